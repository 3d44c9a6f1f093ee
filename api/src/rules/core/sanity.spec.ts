import { FIGURE_KEYS, type NutrientFigures } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { declare } from './declare';
import { declareProduct } from './product';
import { lineWeightWarnings, nutritionLimitWarnings, portionWarnings } from './sanity';
import { book, ing, recipe } from './testing/book-builder';

const refs = loadReferenceData();

describe('a line heavier than the finished product (common practice; no published source sets the limit)', () => {
  const line = (grams: number) => [{ line: 2, name: 'Butter', grams }];

  it('warns on a line above the finished weight, naming the line and what to check', () => {
    const [w] = lineWeightWarnings('Shortbread', 500, line(500.001));
    expect(w).toMatchObject({ code: 'line-weight-out-of-proportion', line: 2 });
    expect(w.message).toBe(
      "Line 2 (Butter) weighs 500.001 g, more than the whole finished weight of Shortbread (500 g). Check the line's quantity and unit (g or kg), and the finished weight.",
    );
  });

  it('does not warn on a line exactly at the finished weight', () => {
    expect(lineWeightWarnings('Shortbread', 500, line(500))).toEqual([]);
  });

  it('does not warn without a recorded finished weight (the sum of the lines is the finished weight)', () => {
    expect(lineWeightWarnings('Shortbread', undefined, line(5000))).toEqual([]);
  });
});

describe('a portion heavier than the finished product (common practice; no published source sets the limit)', () => {
  it('warns on a portion above the finished weight', () => {
    expect(portionWarnings('Tart', 601, 600)).toEqual([
      {
        code: 'portion-over-finished-weight',
        message:
          "A portion of Tart (601 g) weighs more than the whole finished product (600 g). Check the portion weight, the finished weight and the lines' units.",
      },
    ]);
  });

  it('does not warn on a portion that is the whole product, nor without a portion', () => {
    expect(portionWarnings('Tart', 600, 600)).toEqual([]);
    expect(portionWarnings('Tart', null, 600)).toEqual([]);
  });
});

describe('nutrition beyond physical limits', () => {
  const figures = (over: Partial<NutrientFigures>): NutrientFigures =>
    ({ ...Object.fromEntries(FIGURE_KEYS.map((k) => [k, null])), ...over }) as NutrientFigures;

  it('warns on more than 100 g of a nutrient per 100 g (physical limit), not at 100 g', () => {
    expect(nutritionLimitWarnings('Fudge', figures({ sugars: 100 }))).toEqual([]);
    const [w] = nutritionLimitWarnings('Fudge', figures({ sugars: 100.1 }));
    expect(w.code).toBe('nutrition-out-of-limits');
    expect(w.message).toMatch(
      /^Sugars of Fudge works out at 100\.1 g per 100 g \(at most 100 g\), more than the 100 g it is part of\. Check/,
    );
  });

  it('warns on more energy than pure fat (3700 kJ, 900 kcal per 100 g; Regulation (EU) No 1169/2011 Annex XIV), not at it', () => {
    expect(nutritionLimitWarnings('Ghee', figures({ energyKj: 3700, energyKcal: 900 }))).toEqual([]);
    const codes = nutritionLimitWarnings('Ghee', figures({ energyKj: 3700.5, energyKcal: 900.2 })).map((w) => w.message.split(' of ')[0]);
    expect(codes).toEqual(['Energy', 'Energy']);
  });

  it('leaves a figure that is not known unchecked', () => {
    expect(nutritionLimitWarnings('Fudge', figures({}))).toEqual([]);
  });
});

describe('the declaration carries the quantity warnings', () => {
  const sugarFig = { fat: 0, saturates: 0, carbohydrate: 100, sugars: 100, fibre: 0, protein: 0, salt: 0 };
  const b = (finishedWeightG: number, portionG: number) =>
    book(
      [ing('sugar', { nutrition: sugarFig }), ing('oil', { nutrition: { ...sugarFig, fat: 100, carbohydrate: 0, sugars: 0 } })],
      [
        recipe('fudge', [{ use: 'oil', role: 'contact' }, ['sugar', 1000]], {
          finishedWeightG,
          sale: { portionG },
        }),
      ],
    );

  it('a line over the finished weight, on its line; a portion over it; sugars over 100 g per 100 g', () => {
    const d = declareProduct(b(800, 900), 'fudge', refs);
    const codes = d.warnings.map((w) => [w.code, w.line]);
    expect(codes).toContainEqual(['line-weight-out-of-proportion', 2]);
    expect(codes).toContainEqual(['portion-over-finished-weight', undefined]);
    expect(codes).toContainEqual(['nutrition-out-of-limits', undefined]);
  });

  it('nothing when the weights are in proportion; the contact line never warns', () => {
    const d = declareProduct(b(1000, 50), 'fudge', refs);
    expect(
      d.warnings.filter((w) =>
        ['line-weight-out-of-proportion', 'portion-over-finished-weight', 'nutrition-out-of-limits'].includes(w.code),
      ),
    ).toEqual([]);
    expect(declare(b(1000, 50), 'fudge', refs).warnings.some((w) => w.line !== undefined)).toBe(false);
  });
});
