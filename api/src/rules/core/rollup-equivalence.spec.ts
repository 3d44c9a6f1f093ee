import { bookSchema, type Book, type Regime } from '@crumbproof/shared';
import demo from '../../database/seeders/demo-book.json';
import { loadReferenceData } from '../reference-data';
import { scanComposition, scanCompositionShared } from './composition-scan';
import { declare, declareAll, redeclareAfterChange } from './declare';
import { checkBook } from './book-check';
import { BookProblemsError } from './errors';
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

describe('declaring again after a change, reusing what the declarations before it were worked out with', () => {
  const before = declareAll(small, refs);
  const beforeJson = JSON.stringify(before);
  const counts = new Map<string, number>();
  for (const r of small.recipes) for (const l of r.lines) counts.set(l.use, (counts.get(l.use) ?? 0) + 1);
  const shared = small.ingredients.filter((i) => i.contains !== undefined && (counts.get(i.id) ?? 0) > 3);
  const withSesame = (id: string, from: Book = small): Book => ({
    ...from,
    ingredients: from.ingredients.map((i) =>
      i.id === id ? { ...i, contains: [...(i.contains ?? []), 'sesame'], name: `${i.name} (new)` } : i,
    ),
  });

  it('keeps the declarations before it as they were: two changes from the same declarations each equal the whole changed book', () => {
    const [a, b] = [withSesame(shared[0].id), withSesame(shared[1].id)];
    const afterA = redeclareAfterChange(a, before, shared[0].id, refs);
    const afterB = redeclareAfterChange(b, before, shared[1].id, refs);
    expect(afterA).toEqual(declareAll(a, refs));
    expect(afterB).toEqual(declareAll(b, refs));
    expect(JSON.stringify(before)).toBe(beforeJson);
  });

  it('gives, change after change, what declaring the whole book gives', () => {
    const once = withSesame(shared[2].id);
    const twice = withSesame(shared[3].id, once);
    const first = redeclareAfterChange(once, before, shared[2].id, refs);
    expect(redeclareAfterChange(twice, first, shared[3].id, refs)).toEqual(declareAll(twice, refs));
  });

  it('declares again after a sub-recipe lost a line, and the products above it change', () => {
    const sub = small.recipes.find((r) => !r.sale && (counts.get(r.id) ?? 0) > 3 && r.lines.length > 2)!;
    const after: Book = { ...small, recipes: small.recipes.map((r) => (r.id === sub.id ? { ...r, lines: r.lines.slice(1) } : r)) };
    const again = redeclareAfterChange(after, before, sub.id, refs);
    expect(again).toEqual(declareAll(after, refs));
    expect(again.declarations.some((d, n) => d !== before.declarations[n])).toBe(true);
  });

  it('refuses a change that leaves the book unable to be declared, as declaring the whole book does', () => {
    const liquid = small.ingredients.find((i) => i.gPerMl !== undefined && i.id !== 'water' && (counts.get(i.id) ?? 0) > 0)!;
    const after: Book = { ...small, ingredients: small.ingredients.map((i) => (i.id === liquid.id ? { ...i, gPerMl: undefined } : i)) };
    const problems = checkBook(after);
    expect(problems.length).toBeGreaterThan(0);
    expect(() => redeclareAfterChange(after, before, liquid.id, refs)).toThrow(BookProblemsError);
    expect(() => declareAll(after, refs)).toThrow(BookProblemsError);
  });

  it('refuses a sub-recipe changed to use a recipe above it', () => {
    const sub = small.recipes.find((r) => !r.sale && (counts.get(r.id) ?? 0) > 0)!;
    const user = small.recipes.find((r) => r.lines.some((l) => l.use === sub.id))!;
    const after: Book = {
      ...small,
      recipes: small.recipes.map((r) =>
        r.id === sub.id ? { ...r, lines: [...r.lines, { use: user.id, qty: 10, unit: 'g' as const }] } : r,
      ),
    };
    expect(() => redeclareAfterChange(after, before, sub.id, refs)).toThrow(BookProblemsError);
  });
});
