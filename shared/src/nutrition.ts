import type { Regime } from './allergens';

/**
 * Output of the nutrition rules: what the web renders. Figures are per 100 g of finished
 * product and per portion, unrounded (numbers), with the printed label strings beside them.
 * A figure that cannot be computed because an ingredient lacks it is `null` and listed in
 * `incomplete`; it is never read as zero.
 */

/** Nutrients carried per 100 g by a book ingredient (grams; cholesterol in mg). */
export const NUTRIENT_KEYS = [
  'fat',
  'saturates',
  'transFat',
  'cholesterolMg',
  'carbohydrate',
  'sugars',
  'addedSugars',
  'polyols',
  'erythritol',
  'fibre',
  'protein',
  'salt',
  'sodium',
  'alcohol',
  'organicAcids',
  'salatrims',
] as const;
export type NutrientKey = (typeof NUTRIENT_KEYS)[number];

/** Every figure of a declaration: the nutrients plus energy computed from them. */
export const FIGURE_KEYS = ['energyKj', 'energyKcal', ...NUTRIENT_KEYS] as const;
export type FigureKey = (typeof FIGURE_KEYS)[number];

/**
 * The name and unit of every nutrition figure, as the screens and the change lists write them: "Energy (kJ)" in the
 * nutrition table, "energy 1472 kJ" beside an ingredient's figures. Keys are the shared
 * FIGURE_KEYS, so a figure added there must be named here.
 */
export const FIGURE_NAMES: Record<FigureKey, { name: string; unit: 'kJ' | 'kcal' | 'g' | 'mg' }> = {
  energyKj: { name: 'Energy', unit: 'kJ' },
  energyKcal: { name: 'Energy', unit: 'kcal' },
  fat: { name: 'Fat', unit: 'g' },
  saturates: { name: 'Saturates', unit: 'g' },
  transFat: { name: 'Trans fat', unit: 'g' },
  cholesterolMg: { name: 'Cholesterol', unit: 'mg' },
  carbohydrate: { name: 'Carbohydrate', unit: 'g' },
  sugars: { name: 'Sugars', unit: 'g' },
  addedSugars: { name: 'Added sugars', unit: 'g' },
  polyols: { name: 'Polyols', unit: 'g' },
  erythritol: { name: 'Erythritol', unit: 'g' },
  fibre: { name: 'Fibre', unit: 'g' },
  protein: { name: 'Protein', unit: 'g' },
  salt: { name: 'Salt', unit: 'g' },
  sodium: { name: 'Sodium', unit: 'g' },
  alcohol: { name: 'Alcohol', unit: 'g' },
  organicAcids: { name: 'Organic acids', unit: 'g' },
  salatrims: { name: 'Salatrims', unit: 'g' },
};

/** Unrounded figures; `null` means incomplete (some ingredient does not give it). */
export type NutrientFigures = Record<FigureKey, number | null>;

export interface IngredientRef {
  id: string;
  name: string;
}

export interface MissingFigure {
  nutrient: FigureKey;
  /** Leaf ingredients that lack the figure (or whose line could not be weighed). */
  ingredients: IngredientRef[];
}

export interface NutritionSource {
  id: string;
  name: string;
  /** The ingredient's `nutrition.source`; null when none is given. */
  source: string | null;
  /** False when the ingredient has no nutrition at all. */
  hasNutrition: boolean;
}

/** A line whose quantity could not be turned into grams. */
export interface UnweighedLine {
  recipeId: string;
  use: string;
  needs: 'gPerMl' | 'gEach';
}

/** One printed cell: the unrounded value and the text to print ("12 g", "<0.5 g", "incomplete"). */
export interface LabelCell {
  value: number | null;
  text: string;
}

export const EU_LABEL_ROWS = ['energyKj', 'energyKcal', 'fat', 'saturates', 'carbohydrate', 'sugars', 'fibre', 'protein', 'salt'] as const;
export type EuLabelRowKey = (typeof EU_LABEL_ROWS)[number];

export interface EuLabelRow {
  key: EuLabelRowKey;
  name: string;
  /** "of which" rows (saturates, sugars). */
  indent: boolean;
  per100g: LabelCell;
  perPortion: LabelCell | null;
}

export interface EuLabel {
  portionG: number | null;
  rows: EuLabelRow[];
}

export const US_LABEL_ROWS = [
  'calories',
  'totalFat',
  'saturatedFat',
  'transFat',
  'cholesterol',
  'sodium',
  'totalCarbohydrate',
  'dietaryFiber',
  'totalSugars',
  'addedSugars',
  'protein',
] as const;
export type UsLabelRowKey = (typeof US_LABEL_ROWS)[number];

export interface UsLabelRow {
  key: UsLabelRowKey;
  name: string;
  indent: boolean;
  unit: 'kcal' | 'g' | 'mg';
  /** Per serving: unrounded amount and printed text. */
  amount: LabelCell;
  /** %DV (unrounded value and printed "10%"); null where the label shows none. */
  percentDv: LabelCell | null;
}

export interface UsLabel {
  servingG: number;
  rows: UsLabelRow[];
}

export interface NutritionLabel {
  /** EU and UK declaration (Reg 1169/2011), given for every regime so both formats can be read. */
  eu: EuLabel | null;
  /** US Nutrition Facts per serving; null without a portion size. */
  us: UsLabel | null;
  /** The format the declaring regime prints on its labels; null where Crumbproof has none yet. */
  printed: 'eu' | 'us' | null;
  /** Why a label is not given, when it is not. */
  note: string | null;
}

export interface NutritionDeclaration {
  recipeId: string;
  recipeName: string;
  regime: Regime;
  /** Weight of the finished product the totals are divided by; null when it cannot be known. */
  finishedWeightG: number | null;
  weightFrom: 'finishedWeightG' | 'sumOfLines';
  portionG: number | null;
  per100g: NutrientFigures;
  perPortion: NutrientFigures | null;
  incomplete: FigureKey[];
  missing: MissingFigure[];
  unweighed: UnweighedLine[];
  sources: NutritionSource[];
  label: NutritionLabel;
}
