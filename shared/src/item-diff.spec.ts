import type { BookIngredient, BookRecipe } from './book';
import { diffIngredient, diffRecipe } from './item-diff';

const flour: Omit<BookIngredient, 'id'> = {
  name: 'Plain flour',
  supplier: 'Mill one',
  contains: ['wheat'],
  mayContain: [],
  vegan: true,
  vegetarian: true,
  nutrition: { fat: 1.3 },
};

describe('diffIngredient', () => {
  it('says each changed field in words, allergens added and removed by name', () => {
    const after = {
      ...flour,
      contains: [{ source: 'wheat' as const, form: 'glucose-syrup' as const }, 'egg' as const],
      vegan: null,
      nutrition: { fat: 1.5 },
    };
    expect(diffIngredient(flour, after).map((c) => c.text)).toEqual([
      'Allergens: added wheat (glucose syrup), egg; removed wheat.',
      'Vegan: changed from yes to not known.',
      'Fat per 100 g: changed from 1.3 g to 1.5 g.',
    ]);
  });

  it('tells an allergen statement taken away from one stated as none', () => {
    const { contains: _c, ...unknown } = flour;
    expect(diffIngredient(flour, unknown)).toEqual([
      expect.objectContaining({ field: 'contains', before: 'wheat', after: 'not known (no statement from the supplier)' }),
    ]);
    expect(diffIngredient(unknown, { ...flour, contains: [] })[0]?.after).toBe('none');
  });

  it('finds nothing between equal revisions, and a field left out as not given', () => {
    expect(diffIngredient(flour, { ...flour })).toEqual([]);
    const { supplier: _s, ...without } = flour;
    expect(diffIngredient(flour, without).map((c) => c.text)).toEqual(['Supplier: “Mill one” taken out (not given).']);
  });
});

describe('diffRecipe', () => {
  const sponge: Omit<BookRecipe, 'id'> = {
    name: 'Sponge',
    lines: [
      { use: 'plain-flour', qty: 200, unit: 'g' },
      { use: 'eggs', qty: 4, unit: 'each' },
    ],
  };

  it('says lines added, changed and removed, and a product put on sale', () => {
    const after: Omit<BookRecipe, 'id'> = {
      ...sponge,
      lines: [
        { use: 'plain-flour', qty: 220, unit: 'g' },
        { use: 'butter', qty: 50, unit: 'g' },
      ],
      sale: { portionG: 80 },
    };
    const names: Record<string, string> = { 'plain-flour': 'Plain flour', butter: 'Butter' };
    expect(diffRecipe(sponge, after, (id) => names[id]).map((c) => c.text)).toEqual([
      'Lines: added Butter 50 g; Plain flour 200 g → Plain flour 220 g; removed eggs 4 each.',
      'For sale: now for sale.',
    ]);
  });
});
