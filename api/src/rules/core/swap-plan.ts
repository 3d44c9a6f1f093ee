import type { Book, BookRecipe, ErrorCode, FieldError, SwapRequest } from '@crumbproof/shared';
import { recipesAbove } from './book-graph';

/** What a swap would change, worked out before anything is saved. */
export interface SwapPlan {
  from: { id: string; name: string };
  to: { id: string; name: string };
  /** The recipes whose lines change, as they would be saved. */
  changed: BookRecipe[];
  /** The whole book as it would be after the swap. */
  after: Book;
  /** Every product (a recipe for sale) whose declaration can change: a changed recipe that is sold, or a sold one above it, in the book's order. */
  products: string[];
}

/** Why a swap cannot be planned, with the request field it is about. */
export interface SwapRefusal {
  code: Extract<ErrorCode, 'not-found' | 'validation'>;
  message: string;
  fields: FieldError[];
}

export type SwapPlanResult = { ok: true; plan: SwapPlan } | { ok: false; refusal: SwapRefusal };

const refuse = (code: SwapRefusal['code'], message: string, path: keyof SwapRequest, field: string): SwapPlanResult => ({
  ok: false,
  refusal: { code, message, fields: [{ path, message: field }] },
});

/**
 * Replaces `from` by `to` on every line of one recipe (`recipe`) or of every recipe that uses it
 * directly. A QUID the sale details ask for `from` is asked for `to` instead. Whether the book can
 * still be declared afterwards is the book check's to say, on `after`.
 */
export function planSwap(book: Book, req: SwapRequest): SwapPlanResult {
  const items = new Map<string, { id: string; name: string }>([...book.ingredients, ...book.recipes].map((x) => [x.id, x]));
  const from = items.get(req.from);
  const to = items.get(req.to);
  if (!from) return refuse('not-found', `There is no ingredient or recipe '${req.from}' to replace.`, 'from', 'Unknown id.');
  if (!to) return refuse('not-found', `There is no ingredient or recipe '${req.to}' to use instead.`, 'to', 'Unknown id.');
  if (req.from === req.to) {
    return refuse(
      'validation',
      'Choose a replacement that differs from the ingredient it replaces.',
      'to',
      'Same as the ingredient replaced.',
    );
  }
  const only = req.recipe === undefined ? undefined : book.recipes.find((r) => r.id === req.recipe);
  if (req.recipe !== undefined && !only) return refuse('not-found', `There is no recipe '${req.recipe}'.`, 'recipe', 'Unknown recipe.');

  const changed: BookRecipe[] = [];
  const recipes = book.recipes.map((r) => {
    if (only && r.id !== only.id) return r;
    if (!r.lines.some((l) => l.use === req.from)) return r;
    const next: BookRecipe = { ...r, lines: r.lines.map((l) => (l.use === req.from ? { ...l, use: req.to } : l)) };
    // A percentage asked for the replaced ingredient is asked for its replacement.
    if (next.sale?.quid?.includes(req.from)) {
      next.sale = { ...next.sale, quid: [...new Set(next.sale.quid.map((q) => (q === req.from ? req.to : q)))] };
    }
    changed.push(next);
    return next;
  });
  if (changed.length === 0) {
    return refuse(
      'validation',
      `${from.name} is not used directly in ${only ? only.name : 'any recipe'}, so there is nothing to swap.`,
      'from',
      'Not used here.',
    );
  }
  const after: Book = { ...book, recipes };
  const reached = new Set(changed.map((r) => r.id));
  for (const r of changed) for (const id of recipesAbove(after, r.id)) reached.add(id);
  const products = after.recipes.filter((r) => r.sale && reached.has(r.id)).map((r) => r.id);
  return { ok: true, plan: { from: { id: from.id, name: from.name }, to: { id: to.id, name: to.name }, changed, after, products } };
}
