import type {
  EuLabel,
  EuLabelRow,
  EuLabelRowKey,
  LabelCell,
  NutrientFigures,
  UsLabel,
  UsLabelRow,
  UsLabelRowKey,
} from '@crumbproof/shared';
import { EU_LABEL_ROWS, US_LABEL_ROWS } from '@crumbproof/shared';
import { DailyValueKey, percentDv } from './daily-values';
import { usCalories } from './energy';
import { euText, EuRoundingKind } from './rounding-eu';
import { percentDvText, printsZero, usText, UsRoundingKind } from './rounding-us';

const EU_ROWS: Record<EuLabelRowKey, { name: string; indent: boolean; kind: EuRoundingKind }> = {
  energyKj: { name: 'Energy', indent: false, kind: 'energyKj' },
  energyKcal: { name: 'Energy', indent: false, kind: 'energyKcal' },
  fat: { name: 'Fat', indent: false, kind: 'macro' },
  saturates: { name: 'of which saturates', indent: true, kind: 'saturates' },
  carbohydrate: { name: 'Carbohydrate', indent: false, kind: 'macro' },
  sugars: { name: 'of which sugars', indent: true, kind: 'macro' },
  fibre: { name: 'Fibre', indent: false, kind: 'macro' },
  protein: { name: 'Protein', indent: false, kind: 'macro' },
  salt: { name: 'Salt', indent: false, kind: 'salt' },
};

function euCell(key: EuLabelRowKey, figures: NutrientFigures): LabelCell {
  const value = figures[key];
  return { value, text: euText(EU_ROWS[key].kind, value) };
}

/** EU/UK declaration rows (Annex XV order) per 100 g and, when a portion is known, per portion. */
export function euLabel(per100g: NutrientFigures, perPortion: NutrientFigures | null, portionG: number | null): EuLabel {
  const rows: EuLabelRow[] = EU_LABEL_ROWS.map((key) => ({
    key,
    name: EU_ROWS[key].name,
    indent: EU_ROWS[key].indent,
    per100g: euCell(key, per100g),
    perPortion: perPortion ? euCell(key, perPortion) : null,
  }));
  return { portionG, rows };
}

const US_ROWS: Record<
  UsLabelRowKey,
  { name: string; indent: boolean; unit: UsLabelRow['unit']; kind: UsRoundingKind; dv: DailyValueKey | null }
> = {
  calories: { name: 'Calories', indent: false, unit: 'kcal', kind: 'calories', dv: null },
  totalFat: { name: 'Total Fat', indent: false, unit: 'g', kind: 'fat', dv: 'totalFat' },
  saturatedFat: { name: 'Saturated Fat', indent: true, unit: 'g', kind: 'fat', dv: 'saturatedFat' },
  transFat: { name: 'Trans Fat', indent: true, unit: 'g', kind: 'fat', dv: null },
  cholesterol: { name: 'Cholesterol', indent: false, unit: 'mg', kind: 'cholesterol', dv: 'cholesterol' },
  sodium: { name: 'Sodium', indent: false, unit: 'mg', kind: 'sodium', dv: 'sodium' },
  totalCarbohydrate: {
    name: 'Total Carbohydrate',
    indent: false,
    unit: 'g',
    kind: 'carbohydrate',
    dv: 'totalCarbohydrate',
  },
  dietaryFiber: { name: 'Dietary Fiber', indent: true, unit: 'g', kind: 'carbohydrate', dv: 'dietaryFiber' },
  totalSugars: { name: 'Total Sugars', indent: true, unit: 'g', kind: 'carbohydrate', dv: null },
  addedSugars: { name: 'Includes Added Sugars', indent: true, unit: 'g', kind: 'carbohydrate', dv: 'addedSugars' },
  protein: { name: 'Protein', indent: false, unit: 'g', kind: 'protein', dv: 'protein' },
};

const sum = (...xs: (number | null)[]): number | null =>
  xs.some((x) => x === null) ? null : xs.reduce<number>((a, x) => a + (x as number), 0);

/**
 * US amounts per serving from the unrounded per-serving figures. US total carbohydrate is the
 * book's carbohydrate (available carbohydrate, polyols included, fibre excluded) plus fibre.
 */
export function usAmounts(s: NutrientFigures): Record<UsLabelRowKey, number | null> {
  const totalCarbohydrate = sum(s.carbohydrate, s.fibre);
  const calories =
    s.fat === null || totalCarbohydrate === null || s.protein === null || s.alcohol === null
      ? null
      : usCalories({ fat: s.fat, totalCarbohydrate, protein: s.protein, alcohol: s.alcohol });
  return {
    calories,
    totalFat: s.fat,
    saturatedFat: s.saturates,
    transFat: s.transFat,
    cholesterol: s.cholesterolMg,
    sodium: s.sodium === null ? null : s.sodium * 1000,
    totalCarbohydrate,
    dietaryFiber: s.fibre,
    totalSugars: s.sugars,
    addedSugars: s.addedSugars,
    protein: s.protein,
  };
}

/**
 * US Nutrition Facts rows per serving. %DV is worked out from the unrounded amount, which
 * 21 CFR 101.9(d)(7)(ii) permits (from memory), except that an amount printed as 0 gets 0 %
 * so the two columns never disagree. Protein's %DV is given; the label needs it only when a
 * protein claim is made.
 */
export function usLabel(perServing: NutrientFigures, servingG: number): UsLabel {
  const amounts = usAmounts(perServing);
  const rows: UsLabelRow[] = US_LABEL_ROWS.map((key) => {
    const spec = US_ROWS[key];
    const value = amounts[key];
    const text = usText(spec.kind, value);
    let dv: LabelCell | null = null;
    if (spec.dv !== null) {
      if (value === null) dv = { value: null, text: percentDvText(null) };
      else if (printsZero(text)) dv = { value: 0, text: '0%' };
      else {
        const p = percentDv(spec.dv, value);
        dv = { value: p, text: percentDvText(p) };
      }
    }
    return { key, name: spec.name, indent: spec.indent, unit: spec.unit, amount: { value, text }, percentDv: dv };
  });
  return { servingG, rows };
}
