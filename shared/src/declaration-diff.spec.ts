import { CLAIMS } from './allergens';
import type { Declaration } from './declaration';
import { declaredChange, diffDeclarations } from './declaration-diff';
import { declaredChangeInWords } from './approval-contracts';

function declaration(over: Partial<Declaration>): Declaration {
  const claims = Object.fromEntries(CLAIMS.map((c) => [c, { status: 'ok', reasons: [] }])) as unknown as Declaration['claims'];
  return {
    product: 'p',
    name: 'P',
    regime: 'UK',
    finishedWeightG: 100,
    mixWeightG: 100,
    portionG: 50,
    contains: [],
    mayContain: [],
    precautions: [],
    vague: [],
    unknown: [],
    exempt: [],
    claims,
    ingredients: [],
    ingredientsText: '',
    ingredientsSegments: [],
    ingredientsMarkdown: '',
    mayContainText: null,
    quid: [],
    sulphites: { status: 'below-threshold', mgPerKg: 0, statedMgPerKg: 0, declared: false, missing: [] },
    warnings: [],
    errors: [],
    ...over,
  };
}

describe('diffDeclarations', () => {
  const milk = { allergen: 'milk', label: 'milk', sources: ['milk' as const], via: [['p', 'butter']] };
  const butter = {
    id: 'butter',
    name: 'Butter',
    kind: 'ingredient' as const,
    percent: 40,
    orderWeightG: 40,
    allergens: ['milk'],
    role: 'ingredient' as const,
    children: [],
  };
  const spread = { ...butter, id: 'spread', name: 'Plant spread', allergens: [] };

  it('names allergens removed and added, may-contain changes and claims before → after', () => {
    const before = declaration({
      contains: [milk],
      ingredients: [butter],
      ingredientsText: 'butter (milk)',
      claims: { ...declaration({}).claims, vegan: { status: 'fails', reasons: [] } },
    });
    const after = declaration({
      mayContain: [{ allergen: 'milk', label: 'milk', why: ['Supplier of Plant spread: may contain milk'] }],
      ingredients: [spread],
      ingredientsText: 'plant spread',
    });
    const d = diffDeclarations(before, after);
    expect(d.containsRemoved).toEqual([{ allergen: 'milk', label: 'milk' }]);
    expect(d.containsAdded).toEqual([]);
    expect(d.mayContainAdded).toEqual([{ allergen: 'milk', label: 'milk' }]);
    expect(d.claims.find((c) => c.claim === 'vegan')).toMatchObject({ before: 'fails', after: 'ok' });
    expect(d.shares).toEqual([
      { id: 'butter', name: 'Butter', before: 40, after: null },
      { id: 'spread', name: 'Plant spread', before: null, after: 40 },
    ]);
    expect(d.changed).toBe(true);
  });

  it('gives the ingredient list, the may-contain line and the QUID as printed, before and after', () => {
    const before = declaration({
      ingredients: [butter],
      ingredientsText: 'Wheat flour, butter (milk).',
      mayContainText: null,
      quid: [{ ingredient: 'butter', name: 'Butter', percent: 40, text: 'Butter 40%' }],
    });
    const after = declaration({
      ingredients: [butter],
      ingredientsText: 'Wheat flour, butter (milk), hazelnuts.',
      mayContainText: 'May contain: peanuts.',
      quid: [],
    });
    const d = diffDeclarations(before, after);
    expect(d.ingredientsText).toEqual({ before: 'Wheat flour, butter (milk).', after: 'Wheat flour, butter (milk), hazelnuts.' });
    expect(d.mayContainText).toEqual({ before: null, after: 'May contain: peanuts.' });
    expect(d.quid).toEqual([{ ingredient: 'butter', name: 'Butter', before: 'Butter 40%', after: null }]);
    expect(d.shares).toEqual([]);
    expect(d.changed).toBe(true);
    // A may-contain line alone changing is a change a label shows.
    const worded = diffDeclarations(after, { ...after, mayContainText: 'May contain: peanuts and sesame.' });
    expect(worded.ingredientsText).toBeNull();
    expect(worded.mayContainText).toEqual({ before: 'May contain: peanuts.', after: 'May contain: peanuts and sesame.' });
    expect(worded.changed).toBe(true);
  });

  it('says nothing changed for the same declaration', () => {
    const a = declaration({ contains: [milk], ingredients: [butter] });
    const same = diffDeclarations(a, structuredClone(a));
    expect(same.changed).toBe(false);
    expect([same.ingredientsText, same.mayContainText, same.quid]).toEqual([null, null, []]);
  });
});

describe('declaredChange: what a customer or a label depends on', () => {
  const nuts = (sources: ('walnut' | 'pecan')[]) => ({ allergen: 'nuts', label: 'nuts', sources, via: [['p', 'x']] });
  const precaution = (source: 'hazelnut' | 'sesame', allergens: string[]) => ({
    source,
    allergens,
    origin: 'supplier' as const,
    ingredient: 'x',
    ingredientName: 'X',
    controls: null,
    via: [['p', 'x']],
    message: `Supplier of X: may contain ${source}`,
  });

  it('leaves out nutrition, the finished weight and the wording of reasons: nothing to approve', () => {
    const a = declaration({ contains: [nuts(['walnut'])], ingredientsText: 'walnuts' });
    const b = declaration({ contains: [nuts(['walnut'])], ingredientsText: 'walnuts', finishedWeightG: 90, mixWeightG: 120 });
    b.claims.vegan = { status: 'ok', reasons: [{ leaf: null, path: [], message: 'worded again' }] };
    expect(declaredChange(a, b).changed).toBe(false);
  });

  it('names a source new to a group already declared, and a may-contain of a new source, as added', () => {
    const a = declaration({ contains: [nuts(['pecan'])] });
    const b = declaration({ contains: [nuts(['pecan', 'walnut'])], precautions: [precaution('hazelnut', ['nuts'])] });
    const c = declaredChange(a, b);
    expect(c.added).toEqual([
      { allergen: 'nuts', label: 'nuts', how: 'contains', sources: ['walnut'] },
      { allergen: 'nuts', label: 'nuts', how: 'may-contain', sources: ['hazelnut'] },
    ]);
    expect(c.urgent).toBe(true);
    expect(declaredChangeInWords(c)).toEqual(['Now contains nuts (walnut).', 'Now may contain nuts (hazelnut).']);
  });

  it('says a group no longer contained that may still be in it in one sentence', () => {
    const may = (source: 'hazelnut' | 'sesame') => precaution(source, source === 'sesame' ? ['sesame'] : ['nuts']);
    const sesame = { allergen: 'sesame', label: 'sesame', sources: ['sesame' as const], via: [['p', 'x']] };
    // Walnuts swapped for a seed paste made where hazelnut is handled: nuts go from contains to
    // may contain (hazelnut); sesame from may contain to contains.
    const before = declaration({
      contains: [nuts(['walnut'])],
      precautions: [may('sesame')],
      mayContain: [{ allergen: 'sesame', label: 'sesame', why: [] }],
    });
    const after = declaration({
      contains: [sesame],
      precautions: [may('hazelnut')],
      mayContain: [{ allergen: 'nuts', label: 'nuts', why: [] }],
    });
    expect(declaredChangeInWords(declaredChange(before, after))).toEqual([
      'Now contains sesame.',
      'No longer contains nuts, but may contain nuts (hazelnut).',
    ]);
    // The same group by the same name: "it".
    const milk = { allergen: 'milk', label: 'milk', sources: ['milk' as const], via: [['p', 'butter']] };
    const spread = declaration({ mayContain: [{ allergen: 'milk', label: 'milk', why: [] }] });
    expect(declaredChangeInWords(declaredChange(declaration({ contains: [milk] }), spread))).toEqual([
      'No longer contains milk, but may contain it.',
    ]);
  });

  it('is urgent when a claim that held is lost, not when an allergen is taken away', () => {
    const a = declaration({ contains: [nuts(['pecan'])] });
    const lost = declaration({ contains: [nuts(['pecan'])] });
    lost.claims['egg-free'] = { status: 'fails', reasons: [] };
    expect(declaredChange(a, lost)).toMatchObject({
      urgent: true,
      changed: true,
      claims: [{ claim: 'egg-free', before: 'ok', after: 'fails' }],
    });
    expect(declaredChange(a, declaration({}))).toMatchObject({
      urgent: false,
      changed: true,
      containsRemoved: [{ allergen: 'nuts', label: 'nuts' }],
    });
  });

  it('counts a QUID percentage and the printed list, and an ingredient whose allergens became not known', () => {
    const quid = (text: string) => [{ ingredient: 'butter', name: 'Butter', percent: 28, text }];
    const a = declaration({ quid: quid('Butter 28%'), ingredientsText: 'flour, butter' });
    const b = declaration({
      quid: quid('Butter 30%'),
      ingredientsText: 'flour, butter',
      unknown: [{ ingredient: 'x', name: 'X', via: [['p', 'x']] }],
    });
    const c = declaredChange(a, b);
    expect(c.quid).toEqual([{ ingredient: 'butter', name: 'Butter', before: 'Butter 28%', after: 'Butter 30%' }]);
    expect(c.notKnownAdded).toEqual([{ ingredient: 'x', name: 'X' }]);
    expect(c.urgent).toBe(true);
    expect(declaredChange(a, declaration({ quid: quid('Butter 28%'), ingredientsText: 'flour, butter (milk)' })).ingredientsText).toEqual({
      before: 'flour, butter',
      after: 'flour, butter (milk)',
    });
  });
});
