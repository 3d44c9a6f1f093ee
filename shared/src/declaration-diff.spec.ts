import { CLAIMS } from './allergens';
import type { Declaration } from './declaration';
import { diffDeclarations } from './declaration-diff';

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

  it('says nothing changed for the same declaration', () => {
    const a = declaration({ contains: [milk], ingredients: [butter] });
    expect(diffDeclarations(a, structuredClone(a)).changed).toBe(false);
  });
});
