import type { Comparison } from './reference-schema';

/** `value <comparison> limit`, e.g. compare(12, 'gt', 10) is true. */
export function compare(value: number, comparison: Comparison, limit: number): boolean {
  switch (comparison) {
    case 'gt':
      return value > limit;
    case 'gte':
      return value >= limit;
    case 'lt':
      return value < limit;
    case 'lte':
      return value <= limit;
    default: {
      const never: never = comparison;
      throw new Error(`Unknown comparison ${String(never)}`);
    }
  }
}

/** Rounds to `digits` decimals, half away from zero, avoiding binary artefacts (1.005 → 1.01). */
export function round(value: number, digits: number): number {
  const f = 10 ** digits;
  return (Math.sign(value) * Math.round(Math.abs(value) * f + 1e-9)) / f;
}
