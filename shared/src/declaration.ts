import type { AllergenSource, Claim, ClaimStatus, Control, ExemptForm, LineRole, Regime } from './allergens';

/**
 * The declaration of one product under one regime: what the rules engine proves from the
 * recipe book, and what it cannot. The web app and the label renderer read it as is.
 */

/** Ids from the product down to the ingredient that brings something, e.g. ['cake', 'sponge', 'eggs']. */
export type IdPath = string[];

/**
 * How many distinct paths a `via` list gives before it is shortened. A sub-recipe shared many
 * times over (a buttercream in every layer of every cake) reaches a product by hundreds of paths;
 * the list keeps its first paths, in the order of the product's lines, and beyond this many only
 * the first path through each place not yet named: each line of the product's own recipe, in the
 * mix and by contact apart. What it leaves out is counted (`viaMore`), never dropped silently.
 */
export const VIA_LISTED_AT_MOST = 8;

/**
 * Paths to a leaf, as a `via` list gives them: each distinct path once, shortened as
 * VIA_LISTED_AT_MOST says, with the count of paths left out.
 */
export interface Provenance {
  via: IdPath[];
  /** Distinct paths not listed in `via` (absent when none was left out). */
  viaMore?: number;
}

export interface ContainedAllergen extends Provenance {
  /** The regime's group code, e.g. 'gluten' (EU) or 'tree-nuts' (US). */
  allergen: string;
  label: string;
  sources: AllergenSource[];
  /** Species recorded for fish, crustaceans and molluscs (named in the US statement). */
  species?: string[];
  /** The distinct paths from the product to a leaf that brings this group (see Provenance). */
  via: IdPath[];
  /**
   * The paths to this group that pass through a contact line (a floured tin, a greased griddle),
   * shortened as `via` is: the allergen is still in the food and declared here, never as a
   * may-contain. Absent when none does.
   */
  contactVia?: IdPath[];
  /** Contact paths not listed in `contactVia` (absent when none was left out). */
  contactViaMore?: number;
}

export interface MayContainAllergen {
  allergen: string;
  label: string;
  /** Short sentences, e.g. "Supplier of Dark chocolate: may contain milk". */
  why: string[];
}

/**
 * One precautionary statement, with the source it names: a supplier's may-contain list, a
 * "may contain" clause in an ingredient's composition text, or the kitchen's own shared handling.
 * Every statement is kept, also for a group the product contains (the may-contain line leaves
 * those out), so that a customer avoiding one source of a group (walnut, in a pecan tart) is told
 * of a may-contain of that source.
 */
export interface PrecautionStatement extends Provenance {
  source: AllergenSource;
  /** The regime's groups the source counts under. */
  allergens: string[];
  /** 'supplier': the supplier's list; 'composition': the composition text; 'kitchen': the kitchen's handling. */
  origin: 'supplier' | 'composition' | 'kitchen';
  /** The ingredient whose statement it is; null for the kitchen's handling. */
  ingredient: string | null;
  ingredientName: string | null;
  /** The kitchen's handling ('shared-equipment', 'shared-area'); null for an ingredient's statement. */
  controls: Exclude<Control, 'segregated'> | null;
  /** The distinct paths from the product to the ingredient (empty for the kitchen's handling; see Provenance). */
  via: IdPath[];
  /** The statement as a may-contain reason says it, e.g. "Supplier of Dark chocolate: may contain hazelnut". */
  message: string;
}

/**
 * A composition text that names an allergen without saying which (nuts, shellfish, gluten), in
 * the composition itself (the allergen is not known) or in a "may contain" clause.
 */
export interface VagueMention extends Provenance {
  ingredient: string;
  name: string;
  /** The word as written in the composition, e.g. 'nuts'. */
  term: string;
  /** In a precautionary clause ("may contain nuts"), not in the composition itself. */
  precautionary: boolean;
  /** The sources the word may stand for (reference-data/lexicon.json). */
  mayMean: AllergenSource[];
  /** The composition-vague warning's message. */
  message: string;
}

/** A leaf with no allergen statement: nothing about it can be proved. */
export interface UnknownAllergens extends Provenance {
  ingredient: string;
  name: string;
}

/** A source present in a form that this regime exempts from declaration. */
export interface ExemptUse extends Provenance {
  ingredient: string;
  name: string;
  source: AllergenSource;
  form: ExemptForm;
  basis: string;
}

/**
 * One reason a claim does not hold, given by a leaf at one place of the product (a line of its own
 * recipe, as VIA_LISTED_AT_MOST counts places): the first path by which it reaches it, and how many
 * other distinct paths through the same place give the same reason.
 */
export interface ClaimReason {
  /** The leaf ingredient id; null when the reason is the kitchen itself (shared handling) or the product's figure. */
  leaf: string | null;
  /** The first path from the product to the leaf through this place (empty when `leaf` is null). */
  path: IdPath;
  message: string;
  /** Other distinct paths by which the same leaf gives the same reason through the same place (absent when none). */
  morePaths?: number;
}

export interface ClaimResult {
  status: ClaimStatus;
  reasons: ClaimReason[];
}

export type DeclaredClaims = Record<Claim, ClaimResult>;

export interface DeclaredIngredient {
  id: string;
  name: string;
  kind: 'ingredient' | 'recipe';
  /**
   * Share of the product's mix (the product's own lines at the time of use), in percent.
   * A sub-recipe's components split their parent's share in proportion to the sub-recipe's
   * own mix, so siblings add up to their parent. Added water placed by Annex VII A.1 carries
   * its share of the finished product instead. Contact lines: 0.
   */
  percent: number;
  /** Weight that orders the list, in grams (0 for contact lines). */
  orderWeightG: number;
  /** The regime's group codes this entry brings (for a sub-recipe: everything below it). */
  allergens: string[];
  role: LineRole;
  children: DeclaredIngredient[];
}

export interface TextSegment {
  text: string;
  emphasis: boolean;
}

export interface QuidEntry {
  ingredient: string;
  name: string;
  /** 100 × weight used / finished weight (Annex VIII 4(a)), unrounded. */
  percent: number;
  /** "Butter 28%" or, when over 100 % in total, "Prepared with 27.8 g of butter per 100 g". */
  text: string;
}

/**
 * What is known of the product's sulphites. Unknown data never reads as "not declared":
 * - 'declared': sulphites go on the label, because the stated contents alone compare above the
 *   regime's threshold, or because a sulphite source has no stated content (the product
 *   contains sulphites, amount not stated);
 * - 'below-threshold': every leaf's content is known (stated, or no sulphites in its allergen
 *   statement) and the total does not reach the threshold; not declared;
 * - 'not-known': a leaf with no allergen statement and no stated content may bring sulphites,
 *   and what is stated does not reach the threshold. Labels are not printed from it.
 */
export const SULPHITE_STATUSES = ['declared', 'below-threshold', 'not-known'] as const;
export type SulphiteStatus = (typeof SULPHITE_STATUSES)[number];

/** An ingredient whose sulphite content is not known, and why. */
export interface SulphiteGap {
  ingredient: string;
  name: string;
  /**
   * 'content-not-stated': brings sulphites with no stated mg/kg; 'contact-line': brings
   * sulphites through a contact line, which has no weight; 'no-allergen-statement': no
   * allergen statement and no stated content, so it may bring sulphites.
   */
  reason: 'content-not-stated' | 'contact-line' | 'no-allergen-statement';
}

export interface SulphiteResult {
  status: SulphiteStatus;
  /**
   * Total SO2 in the product as eaten (mg/kg on the finished weight, at the threshold
   * precision); null when any ingredient's content is not known (`missing`).
   */
  mgPerKg: number | null;
  /** SO2 from the stated contents alone: mgPerKg when that is known, else the least the product holds. */
  statedMgPerKg: number;
  /** True exactly when status is 'declared'. */
  declared: boolean;
  /** Each ingredient whose content is not known, once, in the order of the product's lines. */
  missing: SulphiteGap[];
}

export const DECLARATION_NOTICE_CODES = [
  'claim-not-met',
  'quid-not-in-product',
  'composition-discrepancy',
  'composition-vague',
  'dietary-discrepancy',
  'allergens-unknown',
  'sulphites-unstated',
  /** The product's sulphites are not known (status 'not-known'), one per ingredient missing data; label printing refuses it. */
  'sulphites-not-known',
  'species-missing',
  'vegan-not-dairy-free',
  'added-water-omitted',
  'exempt-form',
  /** A line of the product weighs more than the whole finished product (the notice names the line). */
  'line-weight-out-of-proportion',
  /** The portion weighs more than the finished product. */
  'portion-over-finished-weight',
  /** A nutrition figure per 100 g beyond physical limits (more than 100 g of a nutrient, more energy than pure fat). */
  'nutrition-out-of-limits',
] as const;
export type DeclarationNoticeCode = (typeof DECLARATION_NOTICE_CODES)[number];

export interface DeclarationNotice {
  code: DeclarationNoticeCode;
  message: string;
  ingredient?: string;
  /** The 1-based line of the product's own recipe the notice is about. */
  line?: number;
}

export interface Declaration {
  product: string;
  name: string;
  regime: Regime;
  /** Weight after baking (finishedWeightG), else the sum of the product's line weights. */
  finishedWeightG: number;
  /** Sum of the product's own line weights at the time of use (contact lines excluded). */
  mixWeightG: number;
  portionG: number | null;
  contains: ContainedAllergen[];
  mayContain: MayContainAllergen[];
  /** Every precautionary statement behind the may-contains, with its source, also for groups the product contains. */
  precautions: PrecautionStatement[];
  /** Compositions that name an allergen without saying which. */
  vague: VagueMention[];
  unknown: UnknownAllergens[];
  exempt: ExemptUse[];
  claims: DeclaredClaims;
  ingredients: DeclaredIngredient[];
  /** The list in the regime's own form, as plain text (emphasis is in the segments). */
  ingredientsText: string;
  /** The same text in runs, each emphasised (bold) or not, so renderers never parse. */
  ingredientsSegments: TextSegment[];
  /** The same text with emphasised runs between ** marks. */
  ingredientsMarkdown: string;
  /** Precautionary statement, e.g. "May contain: sesame.", or null. */
  mayContainText: string | null;
  quid: QuidEntry[];
  sulphites: SulphiteResult;
  warnings: DeclarationNotice[];
  /** Anything here blocks printing the product's labels. */
  errors: DeclarationNotice[];
}

export interface DeclarationSet {
  declarations: Declaration[];
}
