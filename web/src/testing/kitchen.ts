import { CLAIMS, type Claim, type ClaimResult, type IngredientView } from '@crumbproof/shared';

/** Ingredients the recipe and swap screens' tests build their kitchens from. */
function ingredient(view: Omit<IngredientView, 'revision' | 'updatedAt' | 'mayContain'> & Partial<IngredientView>): IngredientView {
  return { mayContain: [], revision: 1, updatedAt: '2026-11-01T10:00:00.000Z', ...view };
}

export const FLOUR = ingredient({ id: 'flour', name: 'Plain wheat flour', contains: ['wheat'], vegan: true, vegetarian: true });
export const BUTTER = ingredient({ id: 'butter', name: 'Butter', contains: ['milk'], vegan: false, vegetarian: true });
export const EGGS = ingredient({ id: 'eggs', name: 'Free-range eggs', contains: ['egg'], vegan: false, vegetarian: true });
/** No allergen statement yet. */
export const JAM = ingredient({ id: 'jam', name: 'Raspberry jam', vegan: true, vegetarian: true });
export const PLANT_SPREAD = ingredient({
  id: 'plant-spread',
  name: 'Plant spread',
  contains: [],
  mayContain: ['milk'],
  vegan: true,
  vegetarian: true,
});

/** Every claim holding, except those given. */
export function claimsWith(overrides: Partial<Record<Claim, ClaimResult>>): Record<Claim, ClaimResult> {
  return Object.fromEntries(CLAIMS.map((claim) => [claim, overrides[claim] ?? { status: 'ok', reasons: [] }])) as Record<
    Claim,
    ClaimResult
  >;
}
