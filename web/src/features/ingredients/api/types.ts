import type { AllergenSource, BookIngredient, Claim } from '@crumbproof/shared';

/**
 * An ingredient as the API lists it (the shared IngredientView). Not re-validated here: the API
 * checked it with bookIngredientSchema when it was saved, and one odd stored row must not hide
 * the whole library.
 */
export type { IngredientView, IngredientRevisionView as IngredientRevision, UsedIn as UsedInEntry } from '@crumbproof/shared';

export { ingredientsQueryKey } from '@/api/ingredients';

export interface AllergenHit {
  term: string;
  matched: string;
  start: number;
  end: number;
  source: AllergenSource;
  species?: string;
}
export interface AnimalHit {
  term: string;
  matched: string;
  start: number;
  end: number;
  fails: ('vegan' | 'vegetarian')[];
  unverified: ('vegan' | 'vegetarian')[];
}
export interface VagueHit {
  term: string;
  matched: string;
  start: number;
  end: number;
  message: string;
  unverifies: Claim[];
  precautionary: boolean;
}
export interface Discrepancy {
  source: AllergenSource;
  term: string;
  message: string;
}
export interface CompositionScan {
  allergens: AllergenHit[];
  precautionary: AllergenHit[];
  animal: AnimalHit[];
  vague: VagueHit[];
  discrepancies: Discrepancy[];
}

export type { SpecificationState, SpecificationStatus, SpecificationView as Specification } from '@crumbproof/shared';

export interface ImportPreviewRow {
  row: number;
  ingredient: BookIngredient | null;
  action: 'create' | 'update' | 'unchanged';
  problems: string[];
}
export interface ImportSummary {
  create: number;
  update: number;
  unchanged: number;
  withProblems: number;
}
/** A column the import understands (the API sends these; older drafts sent plain header names). */
export interface ImportColumn {
  header: string;
  aliases?: string[];
  /** The ingredient field it fills: 'contains', 'nutrition.fat', … */
  field?: string;
  required?: boolean;
  description?: string;
}
export interface ImportPreview {
  format?: 'csv' | 'xlsx';
  columns: (ImportColumn | string)[];
  /** How the file is read: what an empty cell, 'none' and an absent column mean. */
  rules?: string[];
  /** Problems with the file as a whole (unknown or missing columns, no rows…). */
  problems?: string[];
  rows: ImportPreviewRow[];
  summary: ImportSummary;
}
/** What an import saved. */
export interface ImportResult extends ImportSummary {
  written?: { id: string; revision: number }[];
}

export interface NutrientReferenceRow {
  id: string;
  name: string;
  ifct?: string;
  gPerMl?: number;
  gEach?: number;
  addsSugars?: boolean;
  nutrition: NonNullable<BookIngredient['nutrition']>;
}
export interface NutrientReference {
  note: string;
  rows: NutrientReferenceRow[];
}
