import type { MeasureSystem, Regime, Unit } from '@crumbproof/shared';

/**
 * Household measures in millilitres.
 * - us-customary: US cup = 8 US fl oz = 236.5882365 mL, tbsp = 1/2 fl oz, tsp = 1/6 fl oz
 *   (US gallon = 231 in^3; NIST definitions, computed exactly).
 * - metric: tsp 5 mL, tbsp 15 mL, cup 250 mL (common practice in the UK, EU and Canada).
 * - australian: tsp 5 mL, tbsp 20 mL, cup 250 mL (common practice in Australia; from memory).
 */
export const MEASURES_ML: Record<MeasureSystem, Record<'tsp' | 'tbsp' | 'cup', number>> = {
  'us-customary': { tsp: 4.92892159375, tbsp: 14.78676478125, cup: 236.5882365 },
  metric: { tsp: 5, tbsp: 15, cup: 250 },
  australian: { tsp: 5, tbsp: 20, cup: 250 },
};

export function defaultMeasures(regime: Regime): MeasureSystem {
  if (regime === 'US') return 'us-customary';
  if (regime === 'ANZ') return 'australian';
  return 'metric';
}

export interface Weighable {
  /** grams per millilitre */
  gPerMl?: number;
  /** grams of one unit ("each") */
  gEach?: number;
}

export type WeighResult = { ok: true; grams: number } | { ok: false; needs: 'gPerMl' | 'gEach' };

/** Converts a recipe quantity to grams, or says which figure is missing to do so. */
export function toGrams(qty: number, unit: Unit, item: Weighable, measures: MeasureSystem): WeighResult {
  switch (unit) {
    case 'g':
      return { ok: true, grams: qty };
    case 'kg':
      return { ok: true, grams: qty * 1000 };
    case 'each':
      return item.gEach ? { ok: true, grams: qty * item.gEach } : { ok: false, needs: 'gEach' };
    case 'ml':
    case 'l':
    case 'tsp':
    case 'tbsp':
    case 'cup': {
      if (!item.gPerMl) return { ok: false, needs: 'gPerMl' };
      const ml = unit === 'ml' ? qty : unit === 'l' ? qty * 1000 : qty * MEASURES_ML[measures][unit];
      return { ok: true, grams: ml * item.gPerMl };
    }
    default: {
      const never: never = unit;
      throw new Error(`Unknown unit ${String(never)}`);
    }
  }
}
