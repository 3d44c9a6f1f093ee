import { z } from 'zod';
import { bookFileIngredientSchema, bookRecipeSchema, itemId, type BookFileIngredient, type BookIngredient, type BookRecipe } from './book';
import type { Declaration } from './declaration';
import type { DeclarationDiff } from './declaration-diff';
import type { Regime } from './allergens';
import type { StandIn } from './product-declaration';

/**
 * What the API sends for the kitchen's items, revisions and the swap check: one definition for
 * the API that builds them and the web app that reads them.
 */

/**
 * The revision an editor loaded and changed: a save of an existing item names it, and is refused
 * (stale-base) when the item has a later revision, so that no save replaces one it has not seen.
 */
export const baseRevisionSchema = z
  .number({ error: 'Give baseRevision: the revision you started editing from, a whole number from 1.' })
  .int('Give baseRevision as a whole number.')
  .min(1, 'Give baseRevision as a revision number from 1.')
  .meta({
    description: 'The revision the editor loaded and changed. A later revision saved by someone else refuses the save (409 stale-base).',
  });

/**
 * PUT /api/ingredients/:code: the ingredient, and the revision the editor started from. A
 * kitchen's own ingredient comes back with the onlyAt it was read with; a save cannot move it.
 */
export const ingredientSaveSchema = bookFileIngredientSchema.extend({ baseRevision: baseRevisionSchema });
export type IngredientSave = z.infer<typeof ingredientSaveSchema>;

/** PUT /api/recipes/:code: the recipe, and the revision the editor started from. */
export const recipeSaveSchema = bookRecipeSchema.extend({ baseRevision: baseRevisionSchema });
export type RecipeSave = z.infer<typeof recipeSaveSchema>;

/** An ingredient as listed: its current revision's body (onlyAt: a kitchen's own) with the revision number. */
export type IngredientView = BookFileIngredient & { revision: number; updatedAt: string };
/** A recipe or product as listed: its current revision's body with the revision number. */
export type RecipeView = BookRecipe & { revision: number; updatedAt: string };

export interface RevisionMeta {
  revision: number;
  note: string;
  authorId: number | null;
  authorName: string | null;
  createdAt: string;
}

export interface IngredientRevisionView extends RevisionMeta {
  body: Omit<BookIngredient, 'id'>;
}

export interface RecipeRevisionView extends RevisionMeta {
  body: Omit<BookRecipe, 'id'>;
  /** The declaration as it stood when this revision was saved (the kitchen's regime). */
  declaration: Declaration | null;
  /** What changed in the declaration against the revision before. */
  diff: DeclarationDiff | null;
}

/** A recipe that uses an item at any depth, with every path of ids from the recipe down to it. */
export interface UsedIn {
  id: string;
  name: string;
  forSale: boolean;
  paths: string[][];
}

export const swapRequestSchema = z.strictObject({
  from: itemId('Choose the ingredient to replace.'),
  to: itemId('Choose the replacement.'),
  /** One recipe; left out, every recipe that uses `from` directly. */
  recipe: itemId('Choose the recipe, or leave it out for every recipe.').optional(),
});
export type SwapRequest = z.infer<typeof swapRequestSchema>;

/** A kitchen of the installation as the swap check names it. */
export interface SwapKitchen {
  /** The kitchen's number, as the kitchen header names it. */
  id: number;
  /** Its id in the recipe book (null for the one kitchen of a book given as site). */
  code: string | null;
  name: string;
  regime: Regime;
}

/** A product the swap reaches at one kitchen, declared as that kitchen makes it (its regime, handling and substitutions). */
export interface SwapProduct {
  kitchen: SwapKitchen;
  product: string;
  name: string;
  before: Declaration;
  after: Declaration;
  diff: DeclarationDiff;
  /** The lines of the product made at this kitchen with its own ingredient in place of a shared one, before and after the swap. */
  standIns: { before: StandIn[]; after: StandIn[] };
}

export interface SwapPreview {
  from: { id: string; name: string };
  to: { id: string; name: string };
  /** The recipes whose lines change (new revisions when applied); `lines` is how many lines of each. */
  recipes: { id: string; name: string; lines: number }[];
  /**
   * Every kitchen of the installation, the request's first and then in the order they were set up,
   * with how many of its products the swap reaches (none: it does not sell them, or makes them the same either way).
   */
  kitchens: (SwapKitchen & { products: number })[];
  /** Every product affected at any depth at every kitchen, by kitchen in the order of `kitchens`, then by name. */
  products: SwapProduct[];
}

export interface SwapApplied {
  recipes: { id: string; revision: number }[];
}

/** A supplier specification's record (never its bytes). */
export interface SpecificationView {
  id: number;
  /** The ingredient's id (code). */
  ingredient: string;
  version: number;
  filename: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  /** YYYY-MM-DD. */
  reviewBy: string;
  note: string;
  uploadedBy: { id: number; name: string } | null;
  /** ISO timestamp. */
  uploadedAt: string;
  /** The newest version of this ingredient's specification. */
  current: boolean;
  /** reviewBy is before today. */
  reviewOverdue: boolean;
  /** Where the file itself is served (inline). */
  fileUrl: string;
}

export type SpecificationState = 'missing' | 'overdue' | 'current';

/** The newest specification of an ingredient, with its review-by date counted from the kitchen's today. */
export interface SpecificationReview {
  ingredient: string;
  name: string;
  specification: number;
  version: number;
  /** YYYY-MM-DD. */
  reviewBy: string;
  /** Days from today to the review-by date: negative when it has passed. */
  daysLeft: number;
}

/** GET /api/specifications/reviews-due: what to review, as the kitchen's calendar stands today. */
export interface ReviewsDue {
  /** The kitchen's date the lists are counted from (YYYY-MM-DD). */
  today: string;
  /** How many days ahead dueSoon looks. */
  withinDays: number;
  /** Review-by date passed: oldest first. */
  overdue: SpecificationReview[];
  /** Review-by date today or within withinDays days: soonest first. */
  dueSoon: SpecificationReview[];
}

/**
 * Served with a declaration (never kept with it) when an ingredient below the product has a
 * newest specification whose review-by date has passed: the declaration stands on what may no
 * longer be the supplier's word. It never blocks anything.
 */
export interface SpecificationReviewWarning {
  ingredient: string;
  name: string;
  reviewBy: string;
  message: string;
}

export interface SpecificationStatus {
  ingredient: string;
  name: string;
  latest: { id: number; version: number; reviewBy: string; uploadedAt: string } | null;
  state: SpecificationState;
}

/** An item of the book by its id and name. */
export interface NamedItem {
  id: string;
  name: string;
}

/** What one kitchen makes differently from the shared book (GET /api/book/kitchen): its own ingredients standing in, and what it sells. */
export interface KitchenMakes {
  /** The kitchen's id in the recipe book; null for an installation of one kitchen set up from a book without ids. */
  code: string | null;
  name: string;
  /** Each substitution recorded on the kitchen, in its order: the shared ingredient, the kitchen's own in its place there, and how many recipe lines it replaces. */
  substitutions: Array<{ replaces: NamedItem; with: NamedItem & { supplier?: string }; note?: string; lines: number }>;
  /** Null: every product for sale in the book. Otherwise the products this kitchen sells, by name. */
  sells: NamedItem[] | null;
  /** The products for sale in the book that this kitchen does not sell. */
  notSold: NamedItem[];
}
