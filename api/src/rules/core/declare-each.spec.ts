import { isDeepStrictEqual } from 'node:util';
import { bookSchema, type Book, type Regime } from '@crumbproof/shared';
import demo from '../../database/seeders/demo-book.json';
import { loadReferenceData } from '../reference-data';
import { checkBook } from './book-check';
import { closureOf } from './book-graph';
import { BookProblemsError, UnknownProductError } from './errors';
import { declareEach, declareProduct, productDeclarer } from './product';
import { book, ing, recipe } from './testing/book-builder';
import { syntheticKitchen } from './testing/synthetic-kitchen';

const refs = loadReferenceData();
const small = syntheticKitchen('small');
const demoBook = bookSchema.parse(demo);

/** What a kept declaration was computed as, one recipe at a time: the recipe alone on its own closure. */
const alone = (from: Book, id: string, regime?: Regime) => declareProduct(closureOf(from, id), id, refs, { regime });

/** Every field the same, at every depth (Jest shows where they differ when they do). */
const expectSame = (got: unknown, want: unknown) => {
  if (!isDeepStrictEqual(got, want)) expect(got).toStrictEqual(want);
};

describe.each<[string, Book, Regime[]]>([
  ['the small synthetic kitchen', small, ['US']],
  ['the demo kitchen', demoBook, ['EU', 'UK', 'US', 'CA', 'ANZ']],
])('declaring every recipe of %s at once', (_name, from, regimes) => {
  const ids = from.recipes.map((r) => r.id);

  it('holds products and sub-recipes both', () => {
    expect(from.recipes.some((r) => r.sale)).toBe(true);
    expect(from.recipes.some((r) => !r.sale && from.recipes.some((p) => p.lines.some((l) => l.use === r.id)))).toBe(true);
  });

  it('gives each recipe, field by field and nutrition included, what declaring it alone on its closure gives', () => {
    const each = declareEach(from, ids, refs);
    expect(each).toHaveLength(ids.length);
    each.forEach((d, n) => {
      expect(d.product).toBe(ids[n]);
      expectSame(d, alone(from, ids[n]));
    });
  });

  it.each(regimes)('under %s gives what declaring each recipe alone under it gives', (regime) => {
    // Sub-recipes first, then products: a product met after its sub-recipes reuses what they rolled up.
    const order = [...ids].reverse();
    const each = declareEach(from, order, refs, { regime });
    each.forEach((d, n) => expectSame(d, alone(from, order[n], regime)));
    expect(each.every((d) => d.regime === regime && d.nutrition.regime === regime)).toBe(true);
  });

  it('gives the same declaration for a recipe asked for twice, and leaves what it gave unchanged by what it gives next', () => {
    const declareOne = productDeclarer(from, refs);
    const first = declareOne(ids[ids.length - 1]);
    const json = JSON.stringify(first);
    for (const id of ids) declareOne(id);
    expect(JSON.stringify(first)).toBe(json);
    expectSame(declareOne(ids[ids.length - 1]), first);
  });
});

describe('declaring recipes of a book at once where declaring one alone would refuse it', () => {
  it('refuses an unknown recipe and an ingredient as declaring either alone does', () => {
    const declareOne = productDeclarer(small, refs);
    expect(() => declareOne('no-such-recipe')).toThrow(UnknownProductError);
    expect(() => declareOne(small.ingredients[0].id)).toThrow(UnknownProductError);
    expect(() => alone(small, small.ingredients[0].id)).toThrow(UnknownProductError);
  });

  it('declares what a book with a problem elsewhere lets each closure declare, and refuses the rest as alone', () => {
    const kitchen = book(
      [ing('flour'), ing('milk', { contains: ['milk'], vegan: false }), ing('cream', { gPerMl: undefined })],
      [
        recipe('dough', [
          ['flour', 500],
          ['milk', 200],
        ]),
        recipe('bun', [['dough', 100]], { sale: { portionG: 100 } }),
        // Cream has no density: this line cannot be weighed, which the book check refuses.
        recipe('eclair', [['dough', 50], { use: 'cream', qty: 30, unit: 'ml' }], { sale: { portionG: 80 } }),
      ],
    );
    expect(checkBook(kitchen).map((p) => p.code)).toEqual(['unweighable-line']);
    const declareOne = productDeclarer(kitchen, refs);
    expect(declareOne('bun')).toEqual(alone(kitchen, 'bun'));
    expect(declareOne('dough')).toEqual(alone(kitchen, 'dough'));
    expect(declareOne('bun').contains.map((c) => c.allergen)).toEqual(['milk']);
    expect(() => declareOne('eclair')).toThrow(BookProblemsError);
    expect(() => alone(kitchen, 'eclair')).toThrow(BookProblemsError);
  });
});
