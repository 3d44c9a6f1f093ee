import { diffDeclarations, type Declaration, type IngredientView, type RecipeView, type SwapPreview } from '@crumbproof/shared';
import { BUTTER, claimsWith, FLOUR, PLANT_SPREAD } from '@/testing/kitchen';

export const RECIPES: RecipeView[] = [
  {
    id: 'shortbread',
    name: 'Shortbread',
    lines: [
      { use: 'flour', qty: 300, unit: 'g' },
      { use: 'butter', qty: 200, unit: 'g' },
    ],
    sale: { portionG: 40, claims: ['vegan'] },
    revision: 3,
    updatedAt: '2026-11-28T10:00:00.000Z',
  },
  {
    id: 'scone',
    name: 'Scone',
    lines: [{ use: 'flour', qty: 300, unit: 'g' }],
    sale: { portionG: 80 },
    revision: 1,
    updatedAt: '2026-11-28T10:00:00.000Z',
  },
];

export const INGREDIENTS: IngredientView[] = [FLOUR, BUTTER, PLANT_SPREAD];

function shortbread(leaf: 'butter' | 'plant-spread'): Declaration {
  const fat = leaf === 'butter' ? 'Butter' : 'Plant spread';
  return {
    product: 'shortbread',
    name: 'Shortbread',
    regime: 'UK',
    finishedWeightG: 460,
    mixWeightG: 500,
    portionG: 40,
    contains: [
      { allergen: 'gluten', label: 'cereals containing gluten', sources: ['wheat'], via: [['shortbread', 'flour']] },
      ...(leaf === 'butter' ? [{ allergen: 'milk', label: 'milk', sources: ['milk' as const], via: [['shortbread', 'butter']] }] : []),
    ],
    mayContain: leaf === 'butter' ? [] : [{ allergen: 'milk', label: 'milk', why: ['Supplier of Plant spread: may contain milk'] }],
    precautions:
      leaf === 'butter'
        ? []
        : [
            {
              source: 'milk',
              allergens: ['milk'],
              origin: 'supplier',
              ingredient: 'plant-spread',
              ingredientName: 'Plant spread',
              controls: null,
              via: [['shortbread', 'plant-spread']],
              message: 'Supplier of Plant spread: may contain milk',
            },
          ],
    vague: [],
    unknown: [],
    exempt: [],
    claims: claimsWith(
      leaf === 'butter'
        ? {
            vegan: { status: 'fails', reasons: [{ leaf: 'butter', path: ['shortbread', 'butter'], message: 'Butter contains milk.' }] },
            'dairy-free': {
              status: 'fails',
              reasons: [{ leaf: 'butter', path: ['shortbread', 'butter'], message: 'Butter contains milk.' }],
            },
            'gluten-free': {
              status: 'fails',
              reasons: [{ leaf: 'flour', path: ['shortbread', 'flour'], message: 'Plain wheat flour contains wheat.' }],
            },
          }
        : {
            'dairy-free': {
              status: 'fails',
              reasons: [
                {
                  leaf: 'plant-spread',
                  path: ['shortbread', 'plant-spread'],
                  message: 'May contain milk: Supplier of Plant spread says it may contain milk.',
                },
              ],
            },
            'gluten-free': {
              status: 'fails',
              reasons: [{ leaf: 'flour', path: ['shortbread', 'flour'], message: 'Plain wheat flour contains wheat.' }],
            },
          },
    ),
    ingredients: [
      {
        id: 'flour',
        name: 'Plain wheat flour',
        kind: 'ingredient',
        percent: 60,
        orderWeightG: 300,
        allergens: ['gluten'],
        role: 'ingredient',
        children: [],
      },
      {
        id: leaf,
        name: fat,
        kind: 'ingredient',
        percent: 40,
        orderWeightG: 200,
        allergens: leaf === 'butter' ? ['milk'] : [],
        role: 'ingredient',
        children: [],
      },
    ],
    ingredientsText: `Wheat flour, ${fat.toLowerCase()}.`,
    ingredientsSegments: [{ text: `Wheat flour, ${fat.toLowerCase()}.`, emphasis: false }],
    ingredientsMarkdown: `Wheat flour, ${fat.toLowerCase()}.`,
    mayContainText: leaf === 'butter' ? null : 'May contain: milk.',
    // QUID is of the finished product (the mix loses water in the oven), so it differs from the share of the mix.
    quid: leaf === 'butter' ? [{ ingredient: 'butter', name: 'Butter', percent: 44.4, text: 'Butter 44%' }] : [],
    sulphites: { status: 'below-threshold', mgPerKg: 0, statedMgPerKg: 0, declared: false, missing: [] },
    warnings: [],
    errors: [],
  };
}

const before = shortbread('butter');
const after = shortbread('plant-spread');

export const PREVIEW: SwapPreview = {
  from: { id: 'butter', name: 'Butter' },
  to: { id: 'plant-spread', name: 'Plant spread' },
  recipes: [{ id: 'shortbread', name: 'Shortbread', lines: 1 }],
  products: [{ product: 'shortbread', name: 'Shortbread', before, after, diff: diffDeclarations(before, after) }],
};
