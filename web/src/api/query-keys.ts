import type { AllergenSource, BookRecipe, CompositionScanRequest, Regime } from '@crumbproof/shared';

/** What the print log is narrowed by (`GET /api/labels/runs?product=&batch=&from=&to=`); empty fields are left out. */
export interface LabelRunSearch {
  product?: string;
  batch?: string;
  from?: string;
  to?: string;
}

/** What the ingredient library asks the API to narrow the list by (`GET /api/ingredients?q=&source=`). */
export interface IngredientSearch {
  q?: string;
  source?: AllergenSource;
}

/** A declaration asked for without a regime is the kitchen's own. */
const regimeKey = (regime: Regime | undefined) => regime ?? 'kitchen';

/**
 * Every query key of the web app, in one place, so a key never drifts between the query that
 * fills the cache and the write that refreshes it. Keys are grouped under roots: everything that
 * depends on the kitchen's recorded data sits under one of `KITCHEN_DATA_ROOTS`.
 */
export const queryKeys = {
  me: () => ['me'] as const,
  users: () => ['users'] as const,
  mailOutbox: () => ['mail', 'outbox'] as const,
  /** Reference data: the same for every kitchen, changed only by a new release. */
  reference: {
    nutrients: () => ['reference', 'nutrients'] as const,
    compositionScan: (request: CompositionScanRequest) => ['reference', 'composition-scan', request] as const,
  },
  kitchen: () => ['kitchen'] as const,
  /** What the kitchen makes differently (its stand-ins, what it sells): under the kitchen's root, so a write refreshes it. */
  kitchenMakes: () => ['kitchen', 'makes'] as const,
  ingredients: {
    all: () => ['ingredients'] as const,
    /** The whole library (no search), or the API's matches for a search. */
    list: (search: IngredientSearch = {}) => ['ingredients', 'list', search] as const,
    one: (code: string) => ['ingredients', 'one', code] as const,
    revisions: (code: string) => ['ingredients', 'one', code, 'revisions'] as const,
    usedIn: (code: string) => ['ingredients', 'one', code, 'used-in'] as const,
    specifications: (code: string) => ['ingredients', 'one', code, 'specifications'] as const,
  },
  specifications: {
    all: () => ['specifications'] as const,
    status: () => ['specifications', 'status'] as const,
    reviewsDue: () => ['specifications', 'reviews-due'] as const,
  },
  recipes: {
    all: () => ['recipes'] as const,
    list: () => ['recipes', 'list'] as const,
    one: (code: string) => ['recipes', 'one', code] as const,
    revisions: (code: string) => ['recipes', 'one', code, 'revisions'] as const,
  },
  declarations: {
    all: () => ['declarations'] as const,
    /** One product's served declaration. */
    product: (code: string, regime: Regime | undefined) => ['declarations', 'product', code, regimeKey(regime)] as const,
    /** Every product for sale, served. */
    products: (regime: Regime | undefined) => ['declarations', 'products', regimeKey(regime)] as const,
    /** The recipe as typed in the editor, declared without saving. */
    preview: (recipe: BookRecipe | null, regime: Regime | undefined) => ['declarations', 'preview', regimeKey(regime), recipe] as const,
  },
  counter: {
    /** Everything the counter reads: read again at once when its events stream comes back after a break. */
    all: () => ['counter'] as const,
    /** Every product for sale with its served declaration and whether it is on sale today: the counter's one read. */
    products: () => ['counter', 'products'] as const,
    /** Questions asked of the kitchen, every one (newest first); a question-answered event refreshes them. */
    questions: () => ['counter', 'questions'] as const,
    /** The products marked on sale on one day, with who marked them. */
    day: (date: string) => ['counter', 'day', date] as const,
  },
  /** The kitchen's public product page: on or off, and its address (manager). */
  publicPage: {
    settings: () => ['public-page', 'settings'] as const,
  },
  /** Products waiting for a manager's approval of their declaration: any write to the kitchen can add one. */
  approvals: {
    all: () => ['approvals'] as const,
  },
  labels: {
    all: () => ['labels'] as const,
    /** Printed labels and charts out of date after an approved change. */
    stale: () => ['labels', 'stale'] as const,
    templates: () => ['labels', 'templates'] as const,
    /** The kitchen's batch pattern and GS1 numbers. */
    settings: () => ['labels', 'settings'] as const,
    /** The print log: every search of it sits under `runs.all()`, which a print refreshes. */
    runs: {
      all: () => ['labels', 'runs'] as const,
      search: (search: LabelRunSearch) => ['labels', 'runs', search] as const,
    },
  },
} as const;

/**
 * The roots of every answer that a write to the kitchen's data (an ingredient, a recipe, an
 * import, a swap, a specification, the kitchen's settings) can change.
 */
export const KITCHEN_DATA_ROOTS = [
  queryKeys.kitchen(),
  queryKeys.ingredients.all(),
  queryKeys.specifications.all(),
  queryKeys.recipes.all(),
  queryKeys.declarations.all(),
  // A recipe saved makes earlier runs of it no longer current in the print log.
  queryKeys.labels.all(),
  // The counter's products carry every product's declaration.
  queryKeys.counter.products(),
  // A change below a product sends it to approval.
  queryKeys.approvals.all(),
] as const;

/** Mutation keys, named like the queries they change. */
export const mutationKeys = {
  signIn: () => ['auth', 'sign-in'] as const,
  signOut: () => ['auth', 'sign-out'] as const,
  inviteUser: () => ['users', 'invite'] as const,
  resendInvitation: () => ['users', 'invitation'] as const,
  retryMail: () => ['mail', 'retry'] as const,
  updateUser: () => ['users', 'update'] as const,
  takeOffKitchen: () => ['users', 'take-off-kitchen'] as const,
  updateKitchen: () => ['kitchen', 'update'] as const,
  createIngredient: () => ['ingredients', 'create'] as const,
  updateIngredient: () => ['ingredients', 'update'] as const,
  previewImport: () => ['ingredients', 'import', 'preview'] as const,
  importIngredients: () => ['ingredients', 'import'] as const,
  uploadSpecification: () => ['specifications', 'upload'] as const,
  saveRecipe: () => ['recipes', 'save'] as const,
  previewSwap: () => ['swaps', 'preview'] as const,
  applySwap: () => ['swaps', 'apply'] as const,
  updateLabelSettings: () => ['labels', 'settings', 'update'] as const,
  printLabels: () => ['labels', 'runs', 'print'] as const,
  updatePublicPageSettings: () => ['public-page', 'settings', 'update'] as const,
  askCounterQuestion: () => ['counter', 'questions', 'ask'] as const,
  answerCounterQuestion: () => ['counter', 'questions', 'answer'] as const,
  setCounterDay: () => ['counter', 'day', 'set'] as const,
  approve: () => ['approvals', 'approve'] as const,
  markStaleHandled: () => ['labels', 'stale', 'handled'] as const,
} as const;
