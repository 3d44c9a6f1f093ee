import { compare } from '../compare';
import { decimalsOf, roundToStep } from './round';

/**
 * Printed values for the EU/UK nutrition declaration, after the European Commission's
 * "Guidance document for competent authorities for the control of compliance with EU
 * legislation ... with regard to the setting of tolerances for nutrient values declared on a
 * label" (December 2012), rounding table (from memory: the table itself was not checked).
 * Applied alike to the per-100-g and the per-portion column. Every band edge is compared at the
 * threshold precision (compare.ts).
 *
 * Decisions where the guidance leaves a choice:
 * - A computed value of exactly 0 prints "0 g"; a non-zero value at or under the negligible
 *   threshold prints "<0.5 g" ("<0.1 g" saturates, "<0.01 g" salt).
 * - A value in the lower band whose rounding reaches the band's top (fat 9.96 g → 10.0; salt
 *   0.996 g → 1.00) is printed with the upper band's precision: "10 g", "1.0 g".
 * - Exact ties round half up (see round.ts).
 */
export type EuRoundingKind = 'energyKj' | 'energyKcal' | 'macro' | 'saturates' | 'salt';

interface Band {
  /** Values at or above this use `step`. */
  from: number;
  step: number;
}

interface GramRule {
  /** At or under this (and above 0), print "<negligibleText g". */
  negligible: number;
  negligibleText: string;
  /** Bands from the highest; the last one covers everything above `negligible`. */
  bands: Band[];
}

/** fat, carbohydrate, sugars, protein, fibre (and polyols, starch). */
const MACRO: GramRule = {
  negligible: 0.5,
  negligibleText: '<0.5',
  bands: [
    { from: 10, step: 1 },
    { from: 0, step: 0.1 },
  ],
};
const SATURATES: GramRule = {
  negligible: 0.1,
  negligibleText: '<0.1',
  bands: [
    { from: 10, step: 1 },
    { from: 0, step: 0.1 },
  ],
};
const SALT: GramRule = {
  negligible: 0.0125,
  negligibleText: '<0.01',
  bands: [
    { from: 1, step: 0.1 },
    { from: 0, step: 0.01 },
  ],
};

export const INCOMPLETE_TEXT = 'incomplete';

function gramText(value: number, rule: GramRule): string {
  if (value === 0) return '0 g';
  if (compare(value, 'lte', rule.negligible)) return `${rule.negligibleText} g`;
  const band = rule.bands.find((b) => compare(value, 'gte', b.from));
  if (!band) throw new Error(`No rounding band for ${value}.`);
  const rounded = roundToStep(value, band.step);
  // The band the rounded value falls in sets the printed precision (9.96 → "10 g").
  const shown = rule.bands.find((b) => compare(rounded, 'gte', b.from)) ?? band;
  return `${rounded.toFixed(decimalsOf(shown.step))} g`;
}

export function euText(kind: EuRoundingKind, value: number | null): string {
  if (value === null) return INCOMPLETE_TEXT;
  switch (kind) {
    case 'energyKj':
      return `${roundToStep(value, 1).toFixed(0)} kJ`;
    case 'energyKcal':
      return `${roundToStep(value, 1).toFixed(0)} kcal`;
    case 'macro':
      return gramText(value, MACRO);
    case 'saturates':
      return gramText(value, SATURATES);
    case 'salt':
      return gramText(value, SALT);
    default: {
      const never: never = kind;
      throw new Error(`Unknown rounding kind ${String(never)}`);
    }
  }
}
