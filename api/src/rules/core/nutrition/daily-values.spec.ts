import { percentDv } from './daily-values';
import { percentDvText } from './rounding-us';

/*
 * US daily values, 2016 final rule, 21 CFR 101.9(c)(8)(iv) and (c)(9): FROM MEMORY (to be checked
 * against the eCFR).
 */
describe('US daily values (21 CFR 101.9(c)(8)(iv), (c)(9); from memory)', () => {
  it.each([
    // The FDA's sample Nutrition Facts label of the 2016 final rule (from memory): total fat 8 g 10 %,
    // saturated fat 1 g 5 %, cholesterol 0 mg 0 %, sodium 160 mg 7 %, total carbohydrate 37 g 13 %,
    // dietary fiber 4 g 14 %, added sugars 10 g 20 %; %DV to the nearest 1 % (Appendix H).
    { key: 'totalFat' as const, amount: 8, text: '10%' },
    { key: 'saturatedFat' as const, amount: 1, text: '5%' },
    { key: 'cholesterol' as const, amount: 0, text: '0%' },
    { key: 'sodium' as const, amount: 160, text: '7%' },
    { key: 'totalCarbohydrate' as const, amount: 37, text: '13%' },
    { key: 'dietaryFiber' as const, amount: 4, text: '14%' },
    { key: 'addedSugars' as const, amount: 10, text: '20%' },
  ])('$key $amount prints $text as on the FDA sample label', ({ key, amount, text }) => {
    expect(percentDvText(percentDv(key, amount))).toBe(text);
  });

  it.each([
    // Sample serving, worked by hand: 8 g fat / 78 = 10.26 %; 3 g sat / 20 = 15 %;
    // 30 mg chol / 300 = 10 %; 160 mg Na / 2300 = 6.96 %; 37 g carb / 275 = 13.45 %;
    // 4 g fibre / 28 = 14.29 %; 12 g added sugars / 50 = 24 %; 3 g protein / 50 = 6 %.
    { key: 'totalFat' as const, amount: 8, pct: 10.256 },
    { key: 'saturatedFat' as const, amount: 3, pct: 15 },
    { key: 'cholesterol' as const, amount: 30, pct: 10 },
    { key: 'sodium' as const, amount: 160, pct: 6.957 },
    { key: 'totalCarbohydrate' as const, amount: 37, pct: 13.455 },
    { key: 'dietaryFiber' as const, amount: 4, pct: 14.286 },
    { key: 'addedSugars' as const, amount: 12, pct: 24 },
    { key: 'protein' as const, amount: 3, pct: 6 },
  ])('$key $amount → $pct %', ({ key, amount, pct }) => {
    expect(percentDv(key, amount)).toBeCloseTo(pct, 3);
  });
});
