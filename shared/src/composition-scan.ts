import { z } from 'zod';
import type { AllergenSource, Claim } from './allergens';
import { sourceEntrySchema } from './book';
import { plainText } from './text';

/**
 * The composition scan: what the rules engine reads in a supplier's ingredients text, and where
 * it disagrees with the supplier's allergen list. The engine produces `CompositionTerms`; the
 * API answers `POST /api/composition/scan` with a `CompositionScan`; the ingredient form reads it.
 */

export const compositionScanRequestSchema = z.strictObject({
  text: plainText(z.string().max(4000, 'Use at most 4,000 characters.')),
  /** The supplier's contains list; left out when there is no allergen statement. */
  contains: z.array(sourceEntrySchema).optional(),
});
export type CompositionScanRequest = z.infer<typeof compositionScanRequestSchema>;

/** The claims an animal-derived term bears on. */
export type DietClaim = Extract<Claim, 'vegan' | 'vegetarian'>;

/** Where a term stands in the text: offsets into the text as sent. */
export interface TermHit {
  /** The lexicon term. */
  term: string;
  /** The text as written, e.g. "whey powder" matched "whey". */
  matched: string;
  start: number;
  end: number;
}

export interface AllergenHit extends TermHit {
  source: AllergenSource;
  species?: string;
}

export interface AnimalHit extends TermHit {
  fails: DietClaim[];
  unverified: DietClaim[];
}

export interface VagueHit extends TermHit {
  message: string;
  /** The sources the word may stand for. */
  mayMean: AllergenSource[];
  unverifies: Claim[];
  /** Found in a precautionary clause ("may contain nuts"). */
  precautionary: boolean;
}

/** What the engine finds in a composition text. */
export interface CompositionTerms {
  allergens: AllergenHit[];
  /** Sources named in a precautionary clause ("may contain milk"): may-contain, not contains. */
  precautionary: AllergenHit[];
  animal: AnimalHit[];
  vague: VagueHit[];
}

/** A source the composition names that the supplier's contains list leaves out. */
export interface CompositionDiscrepancy {
  source: AllergenSource;
  term: string;
  message: string;
}

export interface CompositionScan extends CompositionTerms {
  /** Empty when the request gave no contains list (there is nothing to compare with). */
  discrepancies: CompositionDiscrepancy[];
}
