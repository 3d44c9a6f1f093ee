import {
  CLAIMS,
  type Declaration,
  type DeclarationBasis,
  type IngredientView,
  type NutritionDeclaration,
  type RecipeRevisionView,
  type RecipeView,
  type ServedDeclaration,
} from '@crumbproof/shared';
import { BUTTER, claimsWith, EGGS, FLOUR, JAM, PLANT_SPREAD } from '@/testing/kitchen';

/** A small kitchen for the recipe screens: a product for sale built on a sub-recipe. */
export const RECIPES: RecipeView[] = [
  {
    id: 'victoria-sponge',
    name: 'Victoria sponge',
    lines: [
      { use: 'vanilla-sponge', qty: 800, unit: 'g' },
      { use: 'jam', qty: 150, unit: 'g' },
      { use: 'flour', role: 'contact' },
    ],
    finishedWeightG: 900,
    sale: { portionG: 90, claims: ['vegetarian'], quid: ['jam'] },
    revision: 4,
    updatedAt: '2026-11-28T10:00:00.000Z',
  },
  {
    id: 'vanilla-sponge',
    name: 'Vanilla sponge',
    lines: [
      { use: 'flour', qty: 300, unit: 'g' },
      { use: 'butter', qty: 250, unit: 'g' },
      { use: 'eggs', qty: 250, unit: 'g' },
    ],
    revision: 2,
    updatedAt: '2026-11-20T10:00:00.000Z',
  },
];

export const INGREDIENTS: IngredientView[] = [FLOUR, BUTTER, EGGS, JAM, PLANT_SPREAD];

export const NUTRITION: NutritionDeclaration = {
  recipeId: 'victoria-sponge',
  recipeName: 'Victoria sponge',
  regime: 'UK',
  finishedWeightG: 900,
  weightFrom: 'finishedWeightG',
  portionG: 90,
  per100g: {} as NutritionDeclaration['per100g'],
  perPortion: null,
  incomplete: ['fibre'],
  missing: [{ nutrient: 'fibre', ingredients: [{ id: 'jam', name: 'Raspberry jam' }] }],
  unweighed: [],
  sources: [
    { id: 'flour', name: 'Plain wheat flour', source: 'McCance and Widdowson 2021', hasNutrition: true },
    { id: 'butter', name: 'Butter', source: 'Supplier specification, Oct 2026', hasNutrition: true },
    { id: 'eggs', name: 'Free-range eggs', source: null, hasNutrition: true },
    { id: 'jam', name: 'Raspberry jam', source: null, hasNutrition: false },
  ],
  label: {
    eu: {
      portionG: 90,
      rows: [
        {
          key: 'energyKj',
          name: 'Energy',
          indent: false,
          per100g: { value: 1650, text: '1650 kJ' },
          perPortion: { value: 1485, text: '1485 kJ' },
        },
        { key: 'fat', name: 'Fat', indent: false, per100g: { value: 21, text: '21 g' }, perPortion: { value: 18.9, text: '18.9 g' } },
        {
          key: 'saturates',
          name: 'of which saturates',
          indent: true,
          per100g: { value: 12, text: '12 g' },
          perPortion: { value: 10.8, text: '10.8 g' },
        },
        {
          key: 'fibre',
          name: 'Fibre',
          indent: false,
          per100g: { value: null, text: 'incomplete' },
          perPortion: { value: null, text: 'incomplete' },
        },
      ],
    },
    us: {
      servingG: 90,
      rows: [
        { key: 'calories', name: 'Calories', indent: false, unit: 'kcal', amount: { value: 355, text: '360' }, percentDv: null },
        {
          key: 'totalFat',
          name: 'Total Fat',
          indent: false,
          unit: 'g',
          amount: { value: 18.9, text: '19g' },
          percentDv: { value: 24.2, text: '24%' },
        },
        {
          key: 'dietaryFiber',
          name: 'Dietary Fiber',
          indent: true,
          unit: 'g',
          amount: { value: null, text: 'incomplete' },
          percentDv: { value: null, text: 'incomplete' },
        },
      ],
    },
    printed: 'eu',
    note: null,
  },
};

/** Worked out from revision 4 of the product, its sub-recipe and four ingredients, under version 3 of the settings. */
export const BASIS: DeclarationBasis = {
  // 10:42 on 28 November 2026 wherever the tests run.
  computedAt: new Date(2026, 10, 28, 10, 42).toISOString(),
  regime: 'UK',
  items: [
    { id: 'victoria-sponge', kind: 'recipe', name: 'Victoria sponge', revision: 4 },
    { id: 'vanilla-sponge', kind: 'recipe', name: 'Vanilla sponge', revision: 2 },
    { id: 'flour', kind: 'ingredient', name: 'Plain wheat flour', revision: 1 },
    { id: 'butter', kind: 'ingredient', name: 'Butter', revision: 1 },
    { id: 'eggs', kind: 'ingredient', name: 'Free-range eggs', revision: 1 },
    { id: 'jam', kind: 'ingredient', name: 'Raspberry jam', revision: 1 },
  ],
  siteVersion: 3,
};

export function declarationFor(overrides: Partial<ServedDeclaration> = {}): ServedDeclaration {
  const base: Declaration = {
    product: 'victoria-sponge',
    name: 'Victoria sponge',
    regime: 'UK',
    finishedWeightG: 900,
    mixWeightG: 950,
    portionG: 90,
    contains: [
      {
        allergen: 'gluten',
        label: 'cereals containing gluten',
        sources: ['wheat'],
        via: [
          ['victoria-sponge', 'vanilla-sponge', 'flour'],
          ['victoria-sponge', 'flour'],
        ],
        contactVia: [['victoria-sponge', 'flour']],
      },
      { allergen: 'milk', label: 'milk', sources: ['milk'], via: [['victoria-sponge', 'vanilla-sponge', 'butter']] },
      { allergen: 'egg', label: 'eggs', sources: ['egg'], via: [['victoria-sponge', 'vanilla-sponge', 'eggs']] },
    ],
    mayContain: [{ allergen: 'sesame', label: 'sesame', why: ['Sesame: shared equipment in this kitchen'] }],
    precautions: [
      {
        source: 'sesame',
        allergens: ['sesame'],
        origin: 'kitchen',
        ingredient: null,
        ingredientName: null,
        controls: 'shared-equipment',
        via: [],
        message: 'Sesame: shared equipment in this kitchen',
      },
    ],
    vague: [],
    unknown: [{ ingredient: 'jam', name: 'Raspberry jam', via: [['victoria-sponge', 'jam']] }],
    exempt: [],
    claims: claimsWith({
      vegan: {
        status: 'fails',
        reasons: [{ leaf: 'butter', path: ['victoria-sponge', 'vanilla-sponge', 'butter'], message: 'Butter contains milk.' }],
      },
      'dairy-free': {
        status: 'fails',
        reasons: [{ leaf: 'butter', path: ['victoria-sponge', 'vanilla-sponge', 'butter'], message: 'Butter contains milk.' }],
      },
      'egg-free': {
        status: 'fails',
        reasons: [{ leaf: 'eggs', path: ['victoria-sponge', 'vanilla-sponge', 'eggs'], message: 'Free-range eggs contains egg.' }],
      },
      'gluten-free': {
        status: 'fails',
        reasons: [{ leaf: 'flour', path: ['victoria-sponge', 'flour'], message: 'Plain wheat flour contains wheat.' }],
      },
      'sesame-free': {
        status: 'unverified',
        reasons: [{ leaf: 'jam', path: ['victoria-sponge', 'jam'], message: 'Raspberry jam has no allergen statement.' }],
      },
    }),
    ingredients: [
      {
        id: 'vanilla-sponge',
        name: 'Vanilla sponge',
        kind: 'recipe',
        percent: 84.2,
        orderWeightG: 800,
        allergens: ['gluten', 'milk', 'egg'],
        role: 'ingredient',
        children: [
          {
            id: 'flour',
            name: 'Plain wheat flour',
            kind: 'ingredient',
            percent: 31.6,
            orderWeightG: 300,
            allergens: ['gluten'],
            role: 'ingredient',
            children: [],
          },
          {
            id: 'butter',
            name: 'Butter',
            kind: 'ingredient',
            percent: 26.3,
            orderWeightG: 250,
            allergens: ['milk'],
            role: 'ingredient',
            children: [],
          },
          {
            id: 'eggs',
            name: 'Free-range eggs',
            kind: 'ingredient',
            percent: 26.3,
            orderWeightG: 250,
            allergens: ['egg'],
            role: 'ingredient',
            children: [],
          },
        ],
      },
      {
        id: 'jam',
        name: 'Raspberry jam',
        kind: 'ingredient',
        percent: 15.8,
        orderWeightG: 150,
        allergens: [],
        role: 'ingredient',
        children: [],
      },
    ],
    ingredientsText: 'Vanilla sponge (wheat flour, butter (milk), eggs), raspberry jam (16%).',
    ingredientsSegments: [
      { text: 'Vanilla sponge (', emphasis: false },
      { text: 'wheat', emphasis: true },
      { text: ' flour, butter (', emphasis: false },
      { text: 'milk', emphasis: true },
      { text: '), ', emphasis: false },
      { text: 'eggs', emphasis: true },
      { text: '), raspberry jam (16%).', emphasis: false },
    ],
    ingredientsMarkdown: 'Vanilla sponge (**wheat** flour, butter (**milk**), **eggs**), raspberry jam (16%).',
    mayContainText: 'May contain: sesame.',
    quid: [{ ingredient: 'jam', name: 'Raspberry jam', percent: 16.7, text: 'Raspberry jam 17%' }],
    sulphites: {
      status: 'not-known',
      mgPerKg: null,
      statedMgPerKg: 2.5,
      declared: false,
      missing: [{ ingredient: 'jam', name: 'Raspberry jam', reason: 'no-allergen-statement' }],
    },
    warnings: [{ code: 'allergens-unknown', message: 'Raspberry jam has no allergen statement.', ingredient: 'jam' }],
    errors: [],
  };
  return { ...base, nutrition: NUTRITION, basis: BASIS, ...overrides };
}

export const REVISIONS: RecipeRevisionView[] = [4, 3, 2, 1].map((revision) => ({
  revision,
  note: revision === 4 ? 'Swapped Margarine for Butter' : revision === 1 ? 'Created' : 'Edited',
  authorId: revision % 2 === 0 ? 2 : 1,
  authorName: revision % 2 === 0 ? 'Teodor Lind' : 'Maren Okafor',
  createdAt: `2026-11-2${revision}T09:30:00.000Z`,
  body: { name: 'Victoria sponge', lines: RECIPES[0]!.lines },
  declaration: null,
  diff:
    revision === 1
      ? null
      : {
          containsAdded: revision === 4 ? [{ allergen: 'milk', label: 'milk' }] : [],
          containsRemoved: [],
          mayContainAdded: [],
          mayContainRemoved: revision === 4 ? [{ allergen: 'soy', label: 'soy' }] : [],
          claims: CLAIMS.map((claim) => ({
            claim,
            before: revision === 4 && claim === 'vegan' ? 'ok' : 'fails',
            after: 'fails',
            reasons: [],
          })),
          shares: [],
          ingredientsText:
            revision === 4 ? { before: 'Wheat flour, sugar, soya spread (soya).', after: 'Wheat flour, sugar, butter (milk).' } : null,
          mayContainText: revision === 4 ? { before: 'May contain: soya.', after: null } : null,
          quid: [],
          finishedWeightG: { before: 900, after: 900 },
          errorsAdded: [],
          errorsRemoved: [],
          changed: revision === 4,
        },
}));
