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

const HOME = { id: 1, code: null, name: 'Wrenfield Lane Bakehouse', regime: 'UK' as const };
const SHORTBREAD: SwapPreview['products'][number] = {
  kitchen: HOME,
  product: 'shortbread',
  name: 'Shortbread',
  before,
  after,
  diff: diffDeclarations(before, after),
  standIns: { before: [], after: [] },
};

export const PREVIEW: SwapPreview = {
  from: { id: 'butter', name: 'Butter' },
  to: { id: 'plant-spread', name: 'Plant spread' },
  recipes: [{ id: 'shortbread', name: 'Shortbread', lines: 1 }],
  kitchens: [{ ...HOME, products: 1 }],
  products: [SHORTBREAD],
};

const BENCH = { id: 1, code: 'bench', name: 'Test bench', regime: 'UK' as const };
const CORNER = { id: 2, code: 'corner', name: 'Corner Shop', regime: 'US' as const };
const MARKET = { id: 3, code: 'market', name: 'Market Stall', regime: 'EU' as const };

/** The corner shop makes its shortbread with its own flour, which may contain soy, and its market stall its own butter. */
const FLOUR_STAND_IN = {
  recipe: 'shortbread',
  line: 1,
  replaces: 'flour',
  replacesName: 'Plain wheat flour',
  with: 'corner-flour',
  withName: 'Stone-ground wheat flour',
};
function atCorner(d: Declaration): Declaration {
  return {
    ...d,
    regime: 'US',
    mayContain: [...d.mayContain, { allergen: 'soy', label: 'soy', why: ['Supplier of Stone-ground wheat flour: may contain soy'] }],
    ingredientsText: d.ingredientsText.replace('Wheat flour', 'Stone-ground wheat flour'),
  };
}
const cornerBefore = atCorner(before);
const cornerAfter = atCorner(after);

/** One swap over three kitchens sharing the book: two reached, one not (it does not sell shortbread). */
export const PREVIEW_KITCHENS: SwapPreview = {
  ...PREVIEW,
  kitchens: [
    { ...BENCH, products: 1 },
    { ...CORNER, products: 1 },
    { ...MARKET, products: 0 },
  ],
  products: [
    { ...SHORTBREAD, kitchen: BENCH },
    {
      kitchen: CORNER,
      product: 'shortbread',
      name: 'Shortbread',
      before: cornerBefore,
      after: cornerAfter,
      diff: diffDeclarations(cornerBefore, cornerAfter),
      standIns: { before: [FLOUR_STAND_IN], after: [FLOUR_STAND_IN] },
    },
  ],
};
