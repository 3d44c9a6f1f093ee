import { percentDv, US_DAILY_VALUES } from './daily-values';

/*
 * US daily values, 2016 final rule, 21 CFR 101.9(c)(8)(iv) and (c)(9): FROM MEMORY (not in
 * DOMAIN.md; check against the eCFR).
 */
describe('US daily values (21 CFR 101.9(c)(8)(iv), (c)(9); from memory)', () => {
  it('has the 2016 reference amounts', () => {
    expect(US_DAILY_VALUES).toEqual({
      totalFat: 78,
      saturatedFat: 20,
      cholesterol: 300,
      sodium: 2300,
      totalCarbohydrate: 275,
      dietaryFiber: 28,
      addedSugars: 50,
      protein: 50,
    });
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
