import { atThresholdPrecision } from '../compare';

/**
 * Rounding to a step, half up (values here are never negative, so "half away from zero").
 * Neither the European Commission's 2012 guidance on tolerances and rounding nor
 * 21 CFR 101.9(c) states a tie rule; this is the one Crumbproof uses. The value is first taken
 * at the threshold precision (six significant figures, compare.ts), so that a figure worked out
 * to exactly a half (4.45 g computed as 4.449999999999999) is the tie it is; the quotient is
 * then cut to 12 significant digits so that a decimal half such as 1.005 / 0.01 (binary
 * 100.49999999999999) is treated as the tie it is written as.
 */
export function roundToStep(value: number, step: number): number {
  if (!Number.isFinite(value) || value < 0) throw new Error(`Cannot round ${value}.`);
  const q = Number((atThresholdPrecision(value) / step).toPrecision(12));
  const n = Math.floor(q + 0.5);
  return Number((n * step).toPrecision(12));
}

/** Decimal places of a step such as 1, 0.1, 0.01, 0.5 (for printing). */
export function decimalsOf(step: number): number {
  const s = String(step);
  const dot = s.indexOf('.');
  return dot < 0 ? 0 : s.length - dot - 1;
}
