import { compare } from '../compare';
import { decimalsOf, roundToStep } from './round';

/**
 * Printed amounts per serving for the US Nutrition Facts label, after 21 CFR 101.9(c) and FDA
 * "Guidance for Industry: A Food Labeling Guide", Appendix H, "Rounding the Values According to
 * FDA Rounding Rules" (the paragraph numbers of 101.9(c) from memory). Every band edge is
 * compared at the threshold precision (compare.ts).
 *
 * Decisions where the rules leave a choice:
 * - Protein from 0.5 g to under 1 g prints "less than 1 g" (101.9(c)(7) also allows "1 g").
 * - Cholesterol from 2 mg to 5 mg inclusive prints "less than 5 mg".
 * - Exact ties round half up (see round.ts).
 */
export type UsRoundingKind = 'calories' | 'fat' | 'cholesterol' | 'sodium' | 'carbohydrate' | 'protein';

export const US_INCOMPLETE_TEXT = 'incomplete';

function fixed(value: number, step: number): string {
  return roundToStep(value, step).toFixed(decimalsOf(step));
}

/** The printed amount per serving, or "incomplete". */
export function usText(kind: UsRoundingKind, value: number | null): string {
  if (value === null) return US_INCOMPLETE_TEXT;
  switch (kind) {
    case 'calories':
      // (c)(1): < 5 → 0; ≤ 50 → nearest 5; > 50 → nearest 10.
      if (compare(value, 'lt', 5)) return '0';
      return compare(value, 'lte', 50) ? fixed(value, 5) : fixed(value, 10);
    case 'fat':
      // (c)(2) total, saturated and trans fat: < 0.5 → 0; < 5 → nearest 0.5; ≥ 5 → nearest 1.
      if (compare(value, 'lt', 0.5)) return '0 g';
      return compare(value, 'lt', 5) ? `${trimHalf(roundToStep(value, 0.5))} g` : `${fixed(value, 1)} g`;
    case 'cholesterol':
      // (c)(3): < 2 → 0; 2 to 5 → "less than 5 mg"; > 5 → nearest 5.
      if (compare(value, 'lt', 2)) return '0 mg';
      return compare(value, 'lte', 5) ? 'less than 5 mg' : `${fixed(value, 5)} mg`;
    case 'sodium':
      // (c)(4): < 5 → 0; 5 to 140 → nearest 5; > 140 → nearest 10.
      if (compare(value, 'lt', 5)) return '0 mg';
      return compare(value, 'lte', 140) ? `${fixed(value, 5)} mg` : `${fixed(value, 10)} mg`;
    case 'carbohydrate':
    case 'protein':
      // (c)(6) carbohydrate, fibre, sugars, added sugars; (c)(7) protein:
      // < 0.5 → 0; < 1 → "less than 1 g"; ≥ 1 → nearest 1.
      if (compare(value, 'lt', 0.5)) return '0 g';
      return compare(value, 'lt', 1) ? 'less than 1 g' : `${fixed(value, 1)} g`;
    default: {
      const never: never = kind;
      throw new Error(`Unknown rounding kind ${String(never)}`);
    }
  }
}

/** 4.5 → "4.5", 4 → "4", 5 → "5". */
function trimHalf(value: number): string {
  return Number.isInteger(value) ? value.toFixed(0) : value.toFixed(1);
}

/** True when the printed amount is zero ("0 g", "0 mg", "0"). */
export function printsZero(text: string): boolean {
  return /^0( g| mg)?$/.test(text);
}

/** %DV, nearest 1 % (Appendix H). */
export function percentDvText(percent: number | null): string {
  if (percent === null) return US_INCOMPLETE_TEXT;
  return `${roundToStep(percent, 1).toFixed(0)}%`;
}
