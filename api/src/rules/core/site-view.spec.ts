import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { bookFileSchema, bookSchema, type BookFileInput, type SiteProductDeclaration } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { UnknownSiteError } from './errors';
import { declareProducts } from './product';
import { declareAtSite, declareSite, siteView, sitesOf, standInsOf } from './site-view';
import { ing, recipe } from './testing/book-builder';

/**
 * One site's view of a book of several: the one-site book the engine declares, with the site's
 * regime and handling, its substitutions on every line and only what it sells for sale.
 */
const refs = loadReferenceData();
const ROOT = join(__dirname, '..', '..', '..', '..');

/** A bakery and a café sharing one book; a shop across the border; the café stands in its own flour. */
function chain(over: Partial<BookFileInput> = {}): BookFileInput {
  return {
    crumbproofBook: 1,
    sites: [
      {
        id: 'bakery',
        name: 'Mill Row Bakery',
        address: '1 Mill Row',
        regime: 'EU',
        handles: [{ allergen: 'sesame', controls: 'shared-equipment' }],
      },
      {
        id: 'cafe',
        name: 'Quayside Café',
        regime: 'EU',
        handles: [{ allergen: 'sesame', controls: 'segregated' }],
        substitutions: [{ replaces: 'flour', with: 'cafe-flour', note: 'Stone-ground flour from the mill on the quay' }],
        sells: ['honey-cake'],
      },
      { id: 'shop', name: 'Border Street Shop', regime: 'US', handles: [] },
    ],
    ingredients: [
      ing('flour', { name: 'Wheat flour', contains: ['wheat'] }),
      { ...ing('cafe-flour', { name: 'Stone-ground spelt flour', contains: ['spelt'], mayContain: ['soy'] }), onlyAt: 'cafe' },
      ing('butter', { name: 'Butter', contains: ['milk'], vegan: false }),
      ing('sugar', { name: 'Sugar' }),
      ing('honey', { name: 'Honey', vegan: false }),
      ing('mustard', { name: 'Mustard seeds', contains: ['mustard'] }),
    ],
    recipes: [
      recipe('sponge', [
        ['flour', 200],
        ['butter', 150],
        ['sugar', 150],
      ]),
      recipe(
        'honey-cake',
        [
          ['sponge', 400],
          ['honey', 100],
        ],
        { name: 'Honey cake', sale: { portionG: 80, quid: ['flour'] } },
      ),
      recipe(
        'mustard-loaf',
        [
          ['flour', 500],
          ['mustard', 20],
        ],
        { name: 'Mustard loaf', sale: { portionG: 60 } },
      ),
    ],
    ...over,
  };
}
const parsed = (input: BookFileInput = chain()) => bookFileSchema.parse(input);
const at = (site: string, product: string) => declareAtSite(siteView(parsed(), site), product, refs) as SiteProductDeclaration;

describe('siteView: one site of a book of several, as the book the engine declares', () => {
  it("gives the site's own fields as the book's site, and the first site when none is named", () => {
    expect(siteView(parsed(), 'cafe').book.site).toEqual({
      name: 'Quayside Café',
      regime: 'EU',
      handles: [{ allergen: 'sesame', controls: 'segregated' }],
    });
    expect(siteView(parsed()).site).toEqual({ id: 'bakery', name: 'Mill Row Bakery' });
    expect(siteView(parsed()).book.site).toEqual(siteView(parsed(), 'bakery').book.site);
    expect(sitesOf(parsed()).map((s) => s.id)).toEqual(['bakery', 'cafe', 'shop']);
  });

  it("keeps the shared ingredients and the site's own, without onlyAt; another site's own is left out", () => {
    expect(siteView(parsed(), 'cafe').book.ingredients.map((i) => i.id)).toEqual([
      'flour',
      'cafe-flour',
      'butter',
      'sugar',
      'honey',
      'mustard',
    ]);
    expect(siteView(parsed(), 'cafe').book.ingredients.some((i) => 'onlyAt' in i)).toBe(false);
    expect(siteView(parsed(), 'bakery').book.ingredients.map((i) => i.id)).not.toContain('cafe-flour');
  });

  it('keeps sale details only on what the site sells; a site without sells sells everything for sale', () => {
    expect(declareSite(siteView(parsed(), 'cafe'), refs).declarations.map((d) => d.product)).toEqual(['honey-cake']);
    expect(declareSite(siteView(parsed(), 'bakery'), refs).declarations.map((d) => d.product)).toEqual(['honey-cake', 'mustard-loaf']);
    expect(siteView(parsed(), 'cafe').book.recipes.find((r) => r.id === 'mustard-loaf')).not.toHaveProperty('sale');
    expect(siteView(parsed(), 'cafe').notSold).toEqual(['mustard-loaf']);
    expect(siteView(parsed(), 'bakery').notSold).toEqual([]);
  });

  it('refuses a site the book does not have, naming the ones it has', () => {
    expect(() => siteView(parsed(), 'harbour')).toThrow(UnknownSiteError);
    expect(() => siteView(parsed(), 'harbour')).toThrow(
      "There is no site 'harbour' in this book; its sites are bakery (Mill Row Bakery), cafe (Quayside Café), shop (Border Street Shop).",
    );
  });

  it.each(['tests/fixtures/shortbread.book.json', 'api/src/database/seeders/demo-book.json'])(
    'reads a book of one kitchen given as site (%s) exactly as the one-site book, and declares it the same',
    (file) => {
      const raw: unknown = JSON.parse(readFileSync(join(ROOT, file), 'utf8'));
      const view = siteView(bookFileSchema.parse(raw));
      const book = bookSchema.parse(raw);
      expect(view).toEqual({ site: null, book, standIns: [], notSold: [] });
      expect(declareSite(view, refs)).toEqual(declareProducts(book, refs));
      expect(() => siteView(bookFileSchema.parse(raw), 'bakery')).toThrow(
        "This book holds one kitchen, given as site without an id, so it has no site 'bakery'.",
      );
    },
  );

  it('reads a book of one site given as sites as the same book given as site', () => {
    const { sites: _sites, ...rest } = chain();
    const ingredients = rest.ingredients.filter((i) => i.onlyAt === undefined);
    const kitchen = { name: 'Mill Row Bakery', address: '1 Mill Row', regime: 'EU' as const, handles: [] };
    expect(siteView(parsed({ ...rest, ingredients, sites: [{ id: 'bakery', ...kitchen }] })).book).toEqual(
      bookSchema.parse({ ...rest, ingredients, site: kitchen }),
    );
  });
});

describe('the same recipe declared at two sites', () => {
  it('may contain sesame where sesame is handled on shared equipment, and not where it is kept apart', () => {
    // Regulation (EU) No 1169/2011 Article 36(3)(a): information on the possible and unintentional
    // presence of an allergen is voluntary and must not mislead (Article 36(2)); the kitchen's own
    // handling is what gives it, so each site states its own.
    const bakery = at('bakery', 'honey-cake');
    const cafe = at('cafe', 'honey-cake');
    expect(bakery.mayContain.map((m) => m.allergen)).toEqual(['sesame']);
    // Annex II point 11 names them sesame seeds.
    expect(bakery.mayContainText).toBe('May contain: sesame seeds.');
    expect(bakery.precautions).toContainEqual(
      expect.objectContaining({ source: 'sesame', origin: 'kitchen', controls: 'shared-equipment' }),
    );
    expect(cafe.mayContain.map((m) => m.allergen)).not.toContain('sesame');
    expect(cafe.precautions.some((p) => p.source === 'sesame')).toBe(false);
  });

  it('declares under each site’s regime: mustard in the EU, not among the US major food allergens', () => {
    const eu = at('bakery', 'mustard-loaf');
    const us = at('shop', 'mustard-loaf');
    // Regulation (EU) No 1169/2011 Annex II point 1 (cereals containing gluten: wheat) and point 10 (mustard).
    expect(eu.regime).toBe('EU');
    expect(eu.contains.map((c) => c.allergen)).toEqual(['gluten', 'mustard']);
    expect(eu.ingredientsMarkdown).toBe('Ingredients: **Wheat** flour, **Mustard** seeds.');
    // FD&C Act 201(qq) (FALCPA, and sesame by the FASTER Act 2021): milk, egg, fish, crustacean
    // shellfish, tree nuts, wheat, peanuts, soybeans, sesame; mustard is not one. The list is
    // followed by "Contains:" (FD&C Act 403(w)(1)(A)).
    expect(us.regime).toBe('US');
    expect(us.contains.map((c) => c.allergen)).toEqual(['wheat']);
    expect(us.ingredientsText).toBe('Ingredients: Wheat flour, Mustard seeds. Contains: wheat.');
    expect(us.site).toEqual({ id: 'shop', name: 'Border Street Shop' });
  });
});

describe('a substitution', () => {
  it('changes the declaration only at its site, and says which ingredient stood in for which', () => {
    const bakery = at('bakery', 'honey-cake');
    const cafe = at('cafe', 'honey-cake');
    // Spelt is a cereal containing gluten named in Regulation (EU) No 1169/2011 Annex II point 1;
    // the café's flour may contain soya (Annex II point 6), as its supplier says.
    expect(cafe.ingredientsMarkdown).toContain('Stone-ground **spelt** flour (**wheat**)');
    expect(cafe.ingredientsText).not.toContain('Wheat flour');
    expect(cafe.mayContain.map((m) => m.allergen)).toEqual(['soybeans']);
    expect(cafe.standIns).toEqual([
      {
        recipe: 'sponge',
        line: 1,
        replaces: 'flour',
        replacesName: 'Wheat flour',
        with: 'cafe-flour',
        withName: 'Stone-ground spelt flour',
        note: 'Stone-ground flour from the mill on the quay',
      },
    ]);
    expect(cafe.quid.map((q) => q.ingredient)).toEqual(['cafe-flour']);

    expect(bakery.ingredientsMarkdown).toContain('**Wheat** flour');
    expect(bakery.ingredientsText).not.toContain('spelt');
    expect(bakery.mayContain.map((m) => m.allergen)).toEqual(['sesame']);
    expect(bakery.standIns).toEqual([]);
    expect(bakery.quid.map((q) => q.ingredient)).toEqual(['flour']);
  });

  it('is listed with the products above its line only', () => {
    const view = siteView(parsed(), 'cafe');
    expect(view.standIns.map((s) => [s.recipe, s.line])).toEqual([
      ['sponge', 1],
      ['mustard-loaf', 1],
    ]);
    expect(standInsOf(view, 'honey-cake').map((s) => s.recipe)).toEqual(['sponge']);
    // The mustard loaf names the shared flour in its own line: made at the café, it has the café's flour too.
    expect(standInsOf(view, 'mustard-loaf').map((s) => [s.recipe, s.line])).toEqual([['mustard-loaf', 1]]);
    expect(at('cafe', 'mustard-loaf').ingredientsText).toContain('Stone-ground spelt flour');
  });
});
