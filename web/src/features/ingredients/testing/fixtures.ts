import type { IngredientView, SpecificationStatus } from '@crumbproof/shared';

export const BUTTER: IngredientView = {
  id: 'butter',
  name: 'Unsalted butter',
  supplier: 'Dale Dairy',
  supplierCode: 'DD-104',
  contains: ['milk'],
  mayContain: [],
  composition: 'Cream (milk).',
  vegan: false,
  vegetarian: true,
  gPerMl: 0.91,
  nutrition: {
    fat: 82,
    saturates: 52,
    carbohydrate: 0.6,
    sugars: 0.6,
    fibre: 0,
    protein: 0.6,
    salt: 0.02,
    source: 'Supplier specification 2026',
  },
  revision: 3,
  updatedAt: '2026-11-20T10:00:00.000Z',
};

export const FLOUR: IngredientView = {
  id: 'plain-flour',
  name: 'Plain flour',
  supplier: 'Millers & Co',
  contains: ['wheat'],
  mayContain: ['soy', 'sesame'],
  vegan: true,
  vegetarian: true,
  nutrition: { fat: 1.3, saturates: 0.2, carbohydrate: 70, sugars: 1.6, fibre: 3.1, protein: 10, salt: 0 },
  revision: 1,
  updatedAt: '2026-10-02T10:00:00.000Z',
};

export const SUGAR: IngredientView = {
  id: 'caster-sugar',
  name: 'Caster sugar',
  supplier: 'Sweetland',
  contains: [],
  mayContain: [],
  vegan: true,
  vegetarian: true,
  nutrition: { fat: 0, saturates: 0, carbohydrate: 100, sugars: 100, fibre: 0, protein: 0, salt: 0 },
  revision: 2,
  updatedAt: '2026-09-12T10:00:00.000Z',
};

/** No allergen statement from the supplier and no nutrition: data missing. */
export const DECORATIONS: IngredientView = {
  id: 'choc-decorations',
  name: 'Chocolate decorations',
  supplier: 'Cocoa Craft',
  mayContain: [],
  vegan: null,
  vegetarian: true,
  revision: 1,
  updatedAt: '2026-11-28T10:00:00.000Z',
};

export const INGREDIENTS: IngredientView[] = [BUTTER, FLOUR, SUGAR, DECORATIONS];

export const SPEC_STATUS: SpecificationStatus[] = [
  {
    ingredient: 'butter',
    name: 'Unsalted butter',
    latest: { id: 11, version: 2, reviewBy: '2027-06-01', uploadedAt: '2026-11-20T10:00:00.000Z' },
    state: 'current',
  },
  {
    ingredient: 'plain-flour',
    name: 'Plain flour',
    latest: { id: 7, version: 1, reviewBy: '2026-05-01', uploadedAt: '2025-05-01T10:00:00.000Z' },
    state: 'overdue',
  },
  { ingredient: 'caster-sugar', name: 'Caster sugar', latest: null, state: 'missing' },
  { ingredient: 'choc-decorations', name: 'Chocolate decorations', latest: null, state: 'missing' },
];
