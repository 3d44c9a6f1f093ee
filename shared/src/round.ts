/**
 * Rounds to `digits` decimals, half away from zero, avoiding binary artefacts (1.005 → 1.01):
 * for figures printed or compared as printed (percentages, concentrations). Nutrition on labels is
 * rounded to the regime's steps instead (the rules core's nutrition/round.ts).
 */
export function round(value: number, digits: number): number {
  const f = 10 ** digits;
  return (Math.sign(value) * Math.round(Math.abs(value) * f + 1e-9)) / f;
}

/**
 * Legal thresholds are compared on figures rounded to this many significant figures, never on
 * raw floating-point results. A product worked out by hand to exactly a threshold (10 mg/kg of
 * SO2, 20 mg/kg of gluten, 5 % added water, 100 % QUID, a label's minimum x-height of 1.2 mm)
 * comes out of binary arithmetic a hair to one side (9.999999999999998 or 10.000000000000002);
 * rounded to six significant figures it is the figure it was worked out to. Six figures is far
 * finer than any figure a supplier states or a template sets (two or three), so nothing recorded
 * is lost; the choice is Crumbproof's own.
 */
export const THRESHOLD_SIGNIFICANT_FIGURES = 6;

/** A computed figure as it is compared with a threshold and reported: six significant figures. */
export function atThresholdPrecision(value: number): number {
  if (value === 0 || !Number.isFinite(value)) return value;
  return Number(value.toPrecision(THRESHOLD_SIGNIFICANT_FIGURES));
}

export const COMPARISONS = ['gt', 'gte', 'lt', 'lte'] as const;
export type Comparison = (typeof COMPARISONS)[number];

/**
 * `value <comparison> limit` on both figures at the threshold precision, e.g.
 * compare(12, 'gt', 10) is true and compare(10.000000000000002, 'gt', 10) is false.
 * The one place where a legal threshold is compared.
 */
export function compare(value: number, comparison: Comparison, limit: number): boolean {
  const v = atThresholdPrecision(value);
  const l = atThresholdPrecision(limit);
  switch (comparison) {
    case 'gt':
      return v > l;
    case 'gte':
      return v >= l;
    case 'lt':
      return v < l;
    case 'lte':
      return v <= l;
    default: {
      const never: never = comparison;
      throw new Error(`Unknown comparison ${String(never)}`);
    }
  }
}
