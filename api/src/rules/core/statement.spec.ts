import type { BookInput, Regime } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { declare } from './declare';
import { renderName } from './statement';
import { book, ing, recipe } from './testing/book-builder';

const refs = loadReferenceData();
type IngredientInput = BookInput['ingredients'][number];

function listOf(regime: Regime, ingredients: IngredientInput[]) {
  const lines = ingredients.map((i, n) => [i.id, 100 * (ingredients.length - n)] as [string, number]);
  return declare(book(ingredients, [recipe('p', lines, { sale: { portionG: 50 } })], {}, regime), 'p', refs);
}

const flour = ing('flour', { name: 'Wheat flour', contains: ['wheat'] });
const butter = ing('butter', { name: 'Butter', contains: ['milk'] });
const coconut = ing('coconut', { name: 'Desiccated coconut', contains: ['coconut'] });
const pine = ing('pine', { name: 'Pine nuts', contains: ['pine-nut'] });
const cod = ing('cod', { name: 'Cod', contains: [{ source: 'fish', species: 'cod' }] });
const shrimp = ing('shrimp', { name: 'Prawn paste', contains: [{ source: 'crustacean', species: 'shrimp' }] });
const spelt = ing('spelt', { name: 'Wholegrain spelt flour', contains: ['spelt'] });

describe('renderName', () => {
  it.each([
    // EU 1169/2011 Art. 21(1)(a)-(b): the allergen named and emphasised within the list.
    { name: 'Plain wheat flour', marks: [{ name: 'wheat', match: ['wheat'] }], out: 'Plain **wheat** flour' },
    { name: 'Butter', marks: [{ name: 'milk', match: ['milk'] }], out: 'Butter (**milk**)' },
    { name: 'Free-range eggs', marks: [{ name: 'egg', match: ['egg', 'eggs'] }], out: 'Free-range **eggs**' },
    { name: 'Nutmeg', marks: [{ name: 'nut', match: ['nut'] }], out: 'Nutmeg (**nut**)' },
    {
      name: 'Dark chocolate',
      marks: [
        { name: 'milk', match: ['milk'] },
        { name: 'soya', match: ['soy', 'soya'] },
      ],
      out: 'Dark chocolate (**milk**, **soya**)',
    },
  ])('$name → $out', ({ name, marks, out }) => {
    const segments = renderName(
      name,
      marks.map((m) => ({ ...m, emphasis: true })),
    );
    expect(segments.map((s) => (s.emphasis ? `**${s.text}**` : s.text)).join('')).toBe(out);
  });
});

describe('the list in each regime’s form', () => {
  it('EU: allergens emphasised in the list and no "Contains" statement (Commission Notice 2017/C 428/01 §3.5)', () => {
    const d = listOf('EU', [flour, butter]);
    expect(d.ingredientsMarkdown).toBe('Ingredients: **Wheat** flour, Butter (**milk**).');
    expect(d.ingredientsText).not.toMatch(/contains/i);
    expect(d.ingredientsSegments.filter((s) => s.emphasis).map((s) => s.text)).toEqual(['Wheat', 'milk']);
  });

  it('EU and UK: spelt refers clearly to wheat, "spelt (wheat)" (Commission Notice 2017/C 428/01; FSA technical guidance)', () => {
    expect(listOf('EU', [spelt]).ingredientsMarkdown).toBe('Ingredients: Wholegrain **spelt** flour (**wheat**).');
    expect(listOf('UK', [spelt]).ingredientsMarkdown).toBe('Ingredients: Wholegrain **spelt** flour (**wheat**).');
  });

  it('EU: soybeans are named "soya" beside a name that does not name them (UK/EU usage, common practice)', () => {
    const lecithin = ing('lecithin', { name: 'Emulsifier: lecithin', contains: ['soy'] });
    expect(listOf('EU', [flour, lecithin]).ingredientsMarkdown).toBe('Ingredients: **Wheat** flour, Emulsifier: lecithin (**soya**).');
  });

  it('US: the list, then "Contains:" naming tree nut and fish species (FD&C Act 403(w); FALCPA)', () => {
    const d = listOf('US', [flour, butter, pine, cod, shrimp]);
    expect(d.ingredientsText).toBe(
      'Ingredients: Wheat flour, Butter, Pine nuts, Cod, Prawn paste. Contains: milk, cod, shrimp, pine nut, wheat.',
    );
    expect(d.ingredientsSegments.some((s) => s.emphasis)).toBe(false);
    expect(d.contains.find((c) => c.allergen === 'fish')).toMatchObject({ species: ['cod'] });
  });

  it('coconut in a US product is listed by name but not in "Contains" (FDA Q&A on food allergens, Edition 5, Table 1)', () => {
    const d = listOf('US', [flour, coconut]);
    expect(d.ingredientsText).toBe('Ingredients: Wheat flour, Desiccated coconut. Contains: wheat.');
    expect(d.contains.map((c) => c.allergen)).toEqual(['wheat']);
  });

  it.each([
    // Pine nut: not in EU Annex II point 8; a US tree nut (FDA Edition 5 Table 1); a Canadian food allergen
    // (FDR B.01.010.1(1)(a)); "pine nut" in ANZ (Food Standards Code Schedule 9).
    { regime: 'EU' as const, contains: [] as string[], text: 'Ingredients: Pine nuts.' },
    { regime: 'US' as const, contains: ['tree-nuts'], text: 'Ingredients: Pine nuts. Contains: pine nut.' },
    { regime: 'CA' as const, contains: ['tree-nuts'], text: 'Ingredients: Pine nuts. Contains: pine nut.' },
    { regime: 'ANZ' as const, contains: ['pine-nut'], text: 'Ingredients: Pine nuts. Contains: pine nut.' },
  ])('pine nut in $regime', ({ regime, contains, text }) => {
    const d = listOf(regime, [pine]);
    expect(d.contains.map((c) => c.allergen)).toEqual(contains);
    expect(d.ingredientsText).toBe(text);
  });

  it('Canada: "Contains:" right after the list, naming every allergen source, gluten source and sulphites once (FDR B.01.010.3)', () => {
    const barley = ing('barley', { name: 'Barley flakes', contains: ['barley'] });
    const apricot = ing('apricot', { name: 'Dried apricots', contains: ['sulphites'], sulphiteMgPerKg: 2000 });
    const mustard = ing('mustard', { name: 'Dijon mustard', contains: ['mustard'] });
    const d = listOf('CA', [flour, barley, apricot, mustard]);
    expect(d.ingredientsText).toBe(
      'Ingredients: Wheat flour, Barley flakes, Dried apricots, Dijon mustard. Contains: wheat, mustard, barley, sulphites.',
    );
    expect(d.contains.map((c) => c.allergen)).toEqual(['wheat', 'mustard', 'gluten', 'sulphites']);
  });

  it('ANZ: required names in bold in the list and a bold "Contains" summary with gluten (FSANZ PEAL)', () => {
    const oats = ing('oats', { name: 'Rolled oats', contains: ['oats'] });
    const d = listOf('ANZ', [flour, oats, butter]);
    expect(d.ingredientsMarkdown).toBe(
      'Ingredients: **Wheat** flour, Rolled **oats**, Butter (**milk**). **Contains: wheat, oats, gluten, milk.**',
    );
  });

  it.each([
    // Celery and mustard: EU Annex II points 9 and 10; not in ANZ Schedule 9 nor the FALCPA list.
    { regime: 'EU' as const, contains: ['celery', 'mustard'] },
    { regime: 'ANZ' as const, contains: [] as string[] },
    { regime: 'US' as const, contains: [] as string[] },
    { regime: 'CA' as const, contains: ['mustard'] },
  ])('celery salt and mustard in $regime contain $contains', ({ regime, contains }) => {
    const d = listOf(regime, [
      ing('celery', { name: 'Celery salt', contains: ['celery'] }),
      ing('mustard', { name: 'Mustard', contains: ['mustard'] }),
    ]);
    expect(d.contains.map((c) => c.allergen)).toEqual(contains);
  });

  it.each([
    // Molluscs: EU Annex II point 14; Canada B.01.010.1(1)(i); not a US major food allergen (FD&C Act
    // 201(qq) lists Crustacean shellfish only; from memory).
    { regime: 'EU' as const, contains: ['molluscs'] },
    { regime: 'CA' as const, contains: ['molluscs'] },
    { regime: 'ANZ' as const, contains: ['mollusc'] },
    { regime: 'US' as const, contains: [] as string[] },
  ])('oyster sauce in $regime contains $contains', ({ regime, contains }) => {
    const d = listOf(regime, [ing('oyster', { name: 'Oyster sauce', contains: [{ source: 'mollusc', species: 'oyster' }] })]);
    expect(d.contains.map((c) => c.allergen)).toEqual(contains);
  });

  it.each([
    // Goat's-milk cheese is milk in the EU (Notice 2017/C 428/01) and in the US (FDA Ed. 5).
    { regime: 'EU' as const, group: 'milk' },
    { regime: 'US' as const, group: 'milk' },
  ])("goat's cheese in $regime is $group", ({ regime, group }) => {
    const d = listOf(regime, [ing('chevre', { name: "Goat's cheese", contains: ['milk'] })]);
    expect(d.contains.map((c) => c.allergen)).toEqual([group]);
  });

  it('warns when the US statement needs a species that is not recorded', () => {
    const d = listOf('US', [ing('fish', { name: 'Fish stock', contains: ['fish'] })]);
    expect(d.ingredientsText).toBe('Ingredients: Fish stock. Contains: fish.');
    expect(d.warnings.map((w) => w.code)).toContain('species-missing');
  });
});
