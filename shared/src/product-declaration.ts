import type { SpecificationReviewWarning } from './views';
import type { Regime } from './allergens';
import type { Declaration } from './declaration';
import type { NutritionDeclaration } from './nutrition';

/** What the API, the command line and the labels give for a product: allergens, claims, list and nutrition. */
export interface ProductDeclaration extends Declaration {
  nutrition: NutritionDeclaration;
}

/** A recipe line made at a site with the site's own ingredient in place of the book's shared one (the site's substitution). */
export interface StandIn {
  /** The recipe whose line it is. */
  recipe: string;
  /** The line's 1-based position in that recipe. */
  line: number;
  /** The shared ingredient the line names in the book. */
  replaces: string;
  replacesName: string;
  /** The site's own ingredient the line is made with there. */
  with: string;
  withName: string;
  note?: string;
}

/** A product's declaration at one site of a book of several: the site it answers for, and every stand-in below it. */
export interface SiteProductDeclaration extends ProductDeclaration {
  site: { id: string; name: string };
  /** Every line in the product's recipes, at any depth, made with a site's own ingredient in place of a shared one. */
  standIns: StandIn[];
}

/** One recorded item a served declaration was computed from, at the revision it was read. */
export interface DeclarationBasisItem {
  id: string;
  kind: 'ingredient' | 'recipe';
  name: string;
  revision: number;
}

/**
 * Where a served declaration comes from: when it was computed, under which regime, from which
 * revision of the product and of every ingredient and sub-recipe it reaches, and which version of
 * the kitchen's settings (handling, measures). A page that shows a declaration shows this too.
 */
export interface DeclarationBasis {
  /** ISO timestamp of the computation (when it was first computed for exactly these inputs). */
  computedAt: string;
  regime: Regime;
  /** The product itself first, then every item below it. */
  items: DeclarationBasisItem[];
  /** The kitchen settings' version (regime, measures, handling). */
  siteVersion: number;
  /** The kitchen it answers for; absent from a copy kept before kitchens were named. */
  kitchen?: { id: number; name: string };
  /** Every line below the product made at this kitchen with its own ingredient in place of the shared one; absent when none is. */
  standIns?: StandIn[];
}

/** A product's declaration as the API serves it from the store: the declaration and its basis. */
export interface ServedDeclaration extends ProductDeclaration {
  basis: DeclarationBasis;
  /** Present when an ingredient below the product has a specification overdue for review, as of the day it is served. */
  reviewWarnings?: SpecificationReviewWarning[];
  /**
   * What a claim that holds stands on, as of the day it is served (worked out then, never kept):
   * absent only from a declaration kept before it was served this way (an approval's copy).
   */
  claimBasis?: ClaimBasis;
}

/**
 * A leaf ingredient whose recorded allergen and dietary facts rest on the supplier's statement
 * alone: no specification on file, or the newest one past its review-by date.
 */
export type StatementOnlyLeaf = { id: string; name: string } & (
  | { why: 'no-specification' }
  | {
      why: 'review-overdue';
      /** The newest specification's review-by date (YYYY-MM-DD), before the day served. */
      reviewBy: string;
    }
);

/**
 * The basis of the product's claims: every claim is checked against the same leaves, so one basis
 * stands behind each claim that holds (a claim that fails or is not verified says its own reasons).
 */
export interface ClaimBasis {
  /** Distinct leaf ingredients below the product, contact lines included: what each claim was checked against. */
  checked: number;
  /** The leaves of those resting on a supplier statement only, in the order they are reached. */
  statementOnly: StatementOnlyLeaf[];
}

/** POST /api/declarations/preview: the recipe as edited, declared, with the basis its claims would have today. */
export interface PreviewDeclaration extends ProductDeclaration {
  claimBasis: ClaimBasis;
}
