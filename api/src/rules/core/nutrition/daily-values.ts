/**
 * US daily values for adults and children 4 years and over, 2016 final rule:
 * 21 CFR 101.9(c)(8)(iv) and (c)(9) (from memory; to be checked against the eCFR).
 * Trans fat and total sugars have no daily value.
 */
export const US_DAILY_VALUES = {
  totalFat: 78,
  saturatedFat: 20,
  cholesterol: 300,
  sodium: 2300,
  totalCarbohydrate: 275,
  dietaryFiber: 28,
  addedSugars: 50,
  protein: 50,
} as const;

export type DailyValueKey = keyof typeof US_DAILY_VALUES;

/** Percent of the daily value, unrounded (amount in g, or mg for cholesterol and sodium). */
export function percentDv(key: DailyValueKey, amount: number): number {
  return (amount / US_DAILY_VALUES[key]) * 100;
}
