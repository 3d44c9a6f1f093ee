import { bookSchema, type Book, type Regime } from '@crumbproof/shared';
import demo from '../../database/seeders/demo-book.json';
import { loadReferenceData } from '../reference-data';
import { scanComposition, scanCompositionShared } from './composition-scan';
import { declare, declareAll, redeclareAfterChange } from './declare';
import { checkBook } from './book-check';
import { lineCount, syntheticKitchen } from './testing/synthetic-kitchen';

const refs = loadReferenceData();
const small = syntheticKitchen('small');
const demoBook = bookSchema.parse(demo);

describe('the synthetic kitchen', () => {
  it('is a valid book of the small size, the same for the same seed', () => {
    expect(checkBook(small)).toEqual([]);
    expect(small.ingredients).toHaveLength(150);
    expect(small.recipes.filter((r) => r.sale)).toHaveLength(200);
    expect(small.recipes.filter((r) => !r.sale)).toHaveLength(600);
    expect(lineCount(small)).toBeGreaterThan(3500);
    expect(JSON.stringify(syntheticKitchen('small'))).toBe(JSON.stringify(small));
    expect(JSON.stringify(syntheticKitchen('small', 7))).not.toBe(JSON.stringify(small));
  });

  it('nests sub-recipes eight levels deep and shares them between products', () => {
    const byId = new Map(small.recipes.map((r) => [r.id, r]));
    const depth = (id: string): number => {
      const r = byId.get(id);
      return r ? 1 + Math.max(0, ...r.lines.map((l) => depth(l.use))) : 0;
    };
    expect(Math.max(...small.recipes.filter((r) => r.sale).map((r) => depth(r.id)))).toBe(9);
    const users = new Map<string, number>();
    for (const r of small.recipes) for (const l of r.lines) if (byId.has(l.use)) users.set(l.use, (users.get(l.use) ?? 0) + 1);
    expect(Math.max(...users.values())).toBeGreaterThan(3);
  });
});

describe.each<[string, Book]>([
  ['the small synthetic kitchen', small],
  ['the demo kitchen', demoBook],
])('declaring every product of %s', (_name, book) => {
  it('gives exactly what declaring each product alone gives, every field', () => {
    const all = declareAll(book, refs).declarations;
    const alone = book.recipes.filter((r) => r.sale).map((r) => declare(book, r.id, refs));
    expect(all).toHaveLength(alone.length);
    all.forEach((d, n) => expect(d).toEqual(alone[n]));
  });

  it('reads each composition as a fresh scan does', () => {
    for (const i of book.ingredients) {
      const text = i.composition ?? '';
      expect(scanCompositionShared(text, refs.lexicon)).toEqual(scanComposition(text, refs.lexicon));
    }
  });
});

describe.each<[string, Book, Regime[]]>([
  ['the small synthetic kitchen', small, ['US', 'ANZ']],
  ['the demo kitchen', demoBook, ['EU', 'UK', 'US', 'CA', 'ANZ']],
])('declaring every product of %s under another regime', (_name, book, regimes) => {
  it.each(regimes)('under %s gives exactly what declaring each product alone gives, every field', (regime) => {
    const all = declareAll(book, refs, { regime }).declarations;
    const alone = book.recipes.filter((r) => r.sale).map((r) => declare(book, r.id, refs, { regime }));
    expect(all).toHaveLength(alone.length);
    all.forEach((d, n) => expect(d).toEqual(alone[n]));
  });

  it('gives each regime its own declarations, one regime after another', () => {
    const first = declareAll(book, refs, { regime: regimes[0] }).declarations;
    const again = declareAll(book, refs).declarations;
    expect(again).toEqual(book.recipes.filter((r) => r.sale).map((r) => declare(book, r.id, refs)));
    expect(first.every((d) => d.regime === regimes[0])).toBe(true);
  });
});

describe('declaring again after one ingredient changed', () => {
  it('declares only the products above it, and equals declaring the whole changed book', () => {
    const before = declareAll(small, refs);
    const counts = new Map<string, number>();
    for (const r of small.recipes) for (const l of r.lines) counts.set(l.use, (counts.get(l.use) ?? 0) + 1);
    const changed = small.ingredients.find(
      (i) => i.contains !== undefined && !i.contains.includes('sesame') && (counts.get(i.id) ?? 0) > 3,
    )!;
    const after: Book = {
      ...small,
      ingredients: small.ingredients.map((i) => (i.id === changed.id ? { ...i, contains: [...(i.contains ?? []), 'sesame'] } : i)),
    };
    const again = redeclareAfterChange(after, before, changed.id, refs);
    expect(again).toEqual(declareAll(after, refs));
    const differ = again.declarations.filter((d, n) => d !== before.declarations[n]);
    expect(differ.length).toBeGreaterThan(0);
    expect(differ.length).toBeLessThan(before.declarations.length);
    expect(differ.every((d) => d.contains.some((c) => c.allergen === 'sesame'))).toBe(true);
  });
});
