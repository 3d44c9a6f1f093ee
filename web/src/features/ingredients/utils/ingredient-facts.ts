import {
  EXEMPT_FORM_LABELS,
  FIGURE_KEYS,
  SOURCE_LABELS,
  type BookIngredient,
  type SourceEntry,
  type SpecificationState,
} from '@crumbproof/shared';

/** "milk", "wheat (glucose syrup)", "fish (cod)". */
export function describeEntry(entry: SourceEntry): string {
  if (typeof entry === 'string') return SOURCE_LABELS[entry];
  const details = [entry.species, entry.form ? EXEMPT_FORM_LABELS[entry.form] : undefined].filter(Boolean);
  return details.length > 0 ? `${SOURCE_LABELS[entry.source]} (${details.join(', ')})` : SOURCE_LABELS[entry.source];
}

export type AllergenStatement = 'stated' | 'none' | 'unknown';

/** Left out: no statement (not known). Empty: the supplier states none. */
export function allergenStatementOf(ingredient: Pick<BookIngredient, 'contains'>): AllergenStatement {
  if (ingredient.contains === undefined) return 'unknown';
  return ingredient.contains.length === 0 ? 'none' : 'stated';
}

/** True when at least one nutrition figure is recorded. */
export function hasNutrition(ingredient: Pick<BookIngredient, 'nutrition'>): boolean {
  const nutrition = ingredient.nutrition;
  if (!nutrition) return false;
  return FIGURE_KEYS.some((key) => typeof nutrition[key] === 'number');
}

export const MISSING_DATA = {
  'allergen-statement': 'No allergen statement',
  nutrition: 'No nutrition',
  vegan: 'Vegan not known',
  vegetarian: 'Vegetarian not known',
  specification: 'No specification',
} as const;
export type MissingData = keyof typeof MISSING_DATA;

/** What the library lacks for this ingredient, in the order a chef would fix it. */
export function missingDataOf(ingredient: BookIngredient, specification: SpecificationState | undefined): MissingData[] {
  const missing: MissingData[] = [];
  if (ingredient.contains === undefined) missing.push('allergen-statement');
  if (!hasNutrition(ingredient)) missing.push('nutrition');
  if (ingredient.vegan === null || ingredient.vegan === undefined) missing.push('vegan');
  if (ingredient.vegetarian === null || ingredient.vegetarian === undefined) missing.push('vegetarian');
  if (specification === 'missing') missing.push('specification');
  return missing;
}

export function yesNoUnknown(value: boolean | null | undefined): 'Yes' | 'No' | 'Not known' {
  if (value === true) return 'Yes';
  if (value === false) return 'No';
  return 'Not known';
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
  return `${(bytes / (1024 * 1024)).toLocaleString('en-GB', { maximumFractionDigits: 1 })} MB`;
}
