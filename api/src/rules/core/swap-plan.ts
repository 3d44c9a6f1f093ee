import type { Book, BookFile, BookRecipe, ErrorCode, FieldError, StandIn, SwapRequest } from '@crumbproof/shared';
import { closureOf, recipesAbove } from './book-graph';
import { sameData } from './same-data';
import { standInsOf, type SiteView } from './site-view';

/** What a swap would change, worked out before anything is saved. */
export interface SwapPlan<B extends Book | BookFile = Book | BookFile> {
  from: { id: string; name: string };
  to: { id: string; name: string };
  /** The recipes whose lines change, as they would be saved (the book's recipes, shared by every kitchen). */
  changed: BookRecipe[];
  /** The whole book as it would be after the swap. */
  after: B;
  /** Every product (a recipe for sale) whose declaration can change: a changed recipe that is sold, or a sold one above it, in the book's order. */
  products: string[];
}

/** Why a swap cannot be planned, with the request field it is about. */
export interface SwapRefusal {
  code: Extract<ErrorCode, 'not-found' | 'validation'>;
  message: string;
  fields: FieldError[];
}

export type SwapPlanResult<B extends Book | BookFile = Book | BookFile> =
  { ok: true; plan: SwapPlan<B> } | { ok: false; refusal: SwapRefusal };

const refuse = (
  code: SwapRefusal['code'],
  message: string,
  path: keyof SwapRequest,
  field: string,
): { ok: false; refusal: SwapRefusal } => ({
  ok: false,
  refusal: { code, message, fields: [{ path, message: field }] },
});

/**
 * Replaces `from` by `to` on every line of one recipe (`recipe`) or of every recipe that uses it
 * directly, in the whole book (a book of several kitchens: its shared recipes, so every kitchen
 * follows). A QUID the sale details ask for `from` is asked for `to` instead. A kitchen's own
 * ingredient is neither replaced nor used: the recipes name shared ingredients only, and a
 * kitchen's own comes in by its substitution. Whether the book can still be declared afterwards
 * is the book check's to say, on `after`.
 */
export function planSwap<B extends Book | BookFile>(book: B, req: SwapRequest): SwapPlanResult<B> {
  const items = new Map<string, { id: string; name: string; onlyAt?: string }>(
    [...book.ingredients, ...book.recipes].map((x) => [x.id, x]),
  );
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
  const kitchenName = (id: string) => ('sites' in book ? book.sites?.find((s) => s.id === id)?.name : undefined) ?? id;
  if (from.onlyAt !== undefined) {
    const sub = 'sites' in book ? book.sites?.find((s) => s.id === from.onlyAt)?.substitutions?.find((x) => x.with === from.id) : undefined;
    const shared = sub ? items.get(sub.replaces)?.name : undefined;
    return refuse(
      'validation',
      `${from.name} is ${kitchenName(from.onlyAt)}'s own ingredient${shared ? `, standing in there for ${shared}` : ''}; the recipes name the shared ingredients, so there is no line of it to swap. Swap ${shared ?? 'the shared ingredient'}, or change ${kitchenName(from.onlyAt)}'s substitution.`,
      'from',
      `Kept only at ${kitchenName(from.onlyAt)}.`,
    );
  }
  if (to.onlyAt !== undefined) {
    return refuse(
      'validation',
      `${to.name} is kept only at ${kitchenName(to.onlyAt)}, and the recipes are shared by every kitchen: choose a shared ingredient, or let ${kitchenName(to.onlyAt)} stand its own in by a substitution.`,
      'to',
      `Kept only at ${kitchenName(to.onlyAt)}.`,
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
  const after = { ...book, recipes };
  const reached = new Set(changed.map((r) => r.id));
  for (const r of changed) for (const id of recipesAbove(after, r.id)) reached.add(id);
  const products = after.recipes.filter((r) => r.sale && reached.has(r.id)).map((r) => r.id);
  return { ok: true, plan: { from: { id: from.id, name: from.name }, to: { id: to.id, name: to.name }, changed, after, products } };
}

/** A product a swap reaches at one kitchen, with the lines made there with the kitchen's own ingredients before and after. */
export interface SwapAtSite {
  product: string;
  standIns: { before: StandIn[]; after: StandIn[] };
}

/**
 * The products for sale at one kitchen that a planned swap reaches there, in the book's order:
 * those the kitchen sells among the plan's products whose recipes, as the kitchen makes them
 * (its substitutions made), differ before and after. A product the kitchen does not sell, or one
 * it makes the same either way (its own ingredient standing in for both the replaced ingredient
 * and its replacement), is not reached. `before` and `after` are the kitchen's views of the book
 * before the swap and after it.
 */
export function swapAtSite(plan: Pick<SwapPlan, 'products'>, before: SiteView, after: SiteView): SwapAtSite[] {
  const planned = new Set(plan.products);
  return after.book.recipes
    .filter((r) => r.sale && planned.has(r.id) && before.book.recipes.some((b) => b.id === r.id && b.sale))
    .filter((r) => !sameData(closureOf(before.book, r.id), closureOf(after.book, r.id)))
    .map((r) => ({ product: r.id, standIns: { before: standInsOf(before, r.id), after: standInsOf(after, r.id) } }));
}
