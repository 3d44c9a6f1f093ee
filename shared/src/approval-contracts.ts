import { z } from 'zod';
import { CLAIM_LABELS, type Claim, type ClaimStatus } from './allergens';
import { itemIdSchema } from './book';
import type { AddedAllergen, DeclaredChange } from './declaration-diff';
import type { Role } from './roles';
import { plainText } from './text';

/**
 * Approvals: a manager approves each product's declaration before its labels print, and the
 * counter serves the approved one (or, when a change adds an allergen or loses a claim, the
 * current one at once, flagged). Whether a product waits for approval is worked out from the
 * current book every time (never kept), so a change anywhere below a product reaches it.
 */

/** The most products approved in one request (a kitchen's whole range). */
export const APPROVALS_MAX = 500;

const inputHashSchema = z
  .string({ error: 'Give the declaration’s inputHash, as GET /api/approvals lists it.' })
  .regex(/^[0-9a-f]{64}$/, 'Give the declaration’s inputHash, as GET /api/approvals lists it (64 hexadecimal digits).');

/** POST /api/approvals: the products approved, each at the declaration the manager saw. */
export const approvalRequestSchema = z.strictObject({
  products: z
    .array(z.strictObject({ product: itemIdSchema, inputHash: inputHashSchema }), {
      error: 'List the products to approve, each with its inputHash.',
    })
    .min(1, 'Pick at least one product to approve.')
    .max(APPROVALS_MAX, `Approve at most ${APPROVALS_MAX} products at once.`)
    .refine((list) => new Set(list.map((p) => p.product)).size === list.length, { error: 'List each product once.' }),
  note: plainText(z.string({ error: 'Write the note as text.' }).trim().max(500, 'Keep the note to 500 characters.')).optional(),
});
export type ApprovalRequest = z.infer<typeof approvalRequestSchema>;

/** POST /api/labels/stale/:id/handled: what was done about out-of-date labels. */
export const staleHandledSchema = z.strictObject({
  note: plainText(
    z
      .string({ error: 'Say what was done, as text.' })
      .trim()
      .min(1, 'Say what was done (reprinted, withdrawn, thrown away).')
      .max(500, 'Keep the note to 500 characters.'),
  ),
});
export type StaleHandledRequest = z.infer<typeof staleHandledSchema>;

/** Who approved a product's declaration, and when. */
export interface ApprovalStamp {
  id: number;
  at: string;
  by: string;
  role: Role;
  inputHash: string;
  note: string | null;
}

/** A write since the product's approval that reaches it: who changed what, when (from the audit trail). */
export interface ApprovalCause {
  at: string;
  by: string | null;
  role: Role | null;
  action: string;
  /** The audit trail's summary of the write, in words. */
  summary: string;
  /** The items of the product's closure it wrote (the kitchen for a change of its settings). */
  items: { kind: 'ingredient' | 'recipe' | 'kitchen'; id: string; name: string }[];
}

/** A product waiting for a manager's approval. */
export interface PendingApproval {
  product: string;
  name: string;
  /** Of the current declaration: sent back to approve exactly what was seen. */
  inputHash: string;
  reason: 'first-approval' | 'changed';
  /** The latest approval under the kitchen's regime; null when never approved. */
  approved: ApprovalStamp | null;
  /** From the approved declaration to the current one; null for a first approval. */
  change: DeclaredChange | null;
  /** The change in words (before and after); for a first approval, what the declaration says. */
  words: string[];
  /** The change adds an allergen to contains or may contain (a group, or a source of one). */
  addsAllergen: boolean;
  /** The writes since the approval that reach the product, oldest first (empty for a first approval). */
  causes: ApprovalCause[];
}

/** GET /api/approvals: what waits at the request's kitchen (an approval there approves its declarations only). */
export interface ApprovalsView {
  /** The kitchen whose declarations these are. */
  kitchen: { id: number; code: string | null; name: string };
  /** How many kitchens share the recipe book; each approves its own declarations. */
  kitchens: number;
  /**
   * The person's other kitchens (where they are a manager or pastry chef) with how many products
   * wait for approval there, in the order the kitchens were set up; those with none are left out.
   */
  elsewhere: { kitchen: { id: number; code: string | null; name: string }; waiting: number }[];
  regime: string;
  pending: PendingApproval[];
  /** Products for sale whose current declaration is their approved one. */
  approvedCount: number;
}

/** POST /api/approvals: each product approved. */
export interface ApprovalsGiven {
  approved: { product: string; name: string; approval: ApprovalStamp; addsAllergen: boolean }[];
}

/**
 * A product's approval on the counter: `approved` serves the approved declaration; `pending`
 * serves the approved one while the change adds nothing a customer must hear at once, and the
 * current one (`serves: 'current'`) when it adds an allergen or loses a claim; `never-approved`
 * serves the current one, not yet approved.
 */
export type CounterApproval =
  | { state: 'approved'; approvedAt: string; approvedBy: string }
  | {
      state: 'pending';
      approvedAt: string;
      approvedBy: string;
      serves: 'approved' | 'current';
      /** Groups the pending change adds to contains or may contain. */
      adds: AddedAllergen[];
      /** Claims that held in the approved declaration and do not now. */
      losesClaims: Claim[];
      /** Ingredients whose allergens became not known. */
      notKnown: string[];
    }
  | { state: 'never-approved'; serves: 'current' };

/** One printed item or chart whose declaration is no longer the product's approved one. */
export interface StaleLabel {
  /** `${run}-${position}`: the printed item, as POST /api/labels/stale/:id/handled names it. */
  id: string;
  run: number;
  printedAt: string;
  template: string;
  chart: boolean;
  product: string;
  name: string;
  batch: string;
  productionDate: string;
  quantity: number;
  /** What to do, in one sentence: reprint the chart, or withdraw the batch's labels. */
  action: string;
  /** What the label says that is no longer so, in words. */
  words: string[];
  addsAllergen: boolean;
  approvedAt: string;
}

const STATUS_WORDS: Record<ClaimStatus, string> = {
  ok: 'holds as recorded',
  fails: 'does not hold',
  unverified: 'cannot be checked',
};

const list = (names: string[]) =>
  names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;

/** A group added, as a sentence says it: "Eggs" or "Nuts (walnut)" (a source is named where the group's name does not say it). */
export function addedName(a: AddedAllergen): string {
  const label = a.label.toLowerCase();
  return a.sources.every((s) => label.includes(s)) ? a.label : `${a.label} (${a.sources.join(', ')})`;
}

/** A change of a product's declaration in sentences, before and after, from the approved one to the current one. */
export function declaredChangeInWords(c: DeclaredChange): string[] {
  const out: string[] = [];
  const contains = c.added.filter((a) => a.how === 'contains');
  const may = c.added.filter((a) => a.how === 'may-contain');
  // A group no longer contained that may still be in it is said in one sentence. (One now contained
  // that was a may-contain is said by "Now contains" alone: declaredChange does not remove it.)
  const lowered = may.filter((a) => c.containsRemoved.some((g) => g.allergen === a.allergen));
  if (contains.length) out.push(`Now contains ${list(contains.map(addedName))}.`);
  for (const a of lowered) out.push(`No longer contains ${a.label}, but may contain ${addedName(a) === a.label ? 'it' : addedName(a)}.`);
  const mayNewly = may.filter((a) => !lowered.includes(a));
  if (mayNewly.length) out.push(`Now may contain ${list(mayNewly.map(addedName))}.`);
  const containsGone = c.containsRemoved.filter((g) => !lowered.some((a) => a.allergen === g.allergen));
  if (containsGone.length) out.push(`No longer contains ${list(containsGone.map((g) => g.label))}.`);
  if (c.mayContainRemoved.length) out.push(`No longer may contain ${list(c.mayContainRemoved.map((g) => g.label))}.`);
  for (const n of c.notKnownAdded) out.push(`The allergens of ${n.name} are not known (it has no allergen statement).`);
  for (const n of c.notKnownRemoved) out.push(`The allergens of ${n.name} are known again, or it is no longer used.`);
  for (const k of c.claims) out.push(`${CLAIM_LABELS[k.claim]}: ${STATUS_WORDS[k.before]} before, now ${STATUS_WORDS[k.after]}.`);
  for (const q of c.quid) {
    if (q.before === null) out.push(`New percentage: ${q.after}.`);
    else if (q.after === null) out.push(`Percentage no longer given: ${q.before}.`);
    else out.push(`Percentage was ${q.before}, now ${q.after}.`);
  }
  if (c.ingredientsText) out.push(`The ingredient list read “${c.ingredientsText.before}”; it now reads “${c.ingredientsText.after}”.`);
  return out;
}

/** What a declaration says, for a product never approved: what the manager approves the first time. */
export function declarationInWords(d: {
  contains: { label: string }[];
  mayContain: { label: string }[];
  claims: Record<Claim, { status: ClaimStatus }>;
  ingredientsText: string;
}): string[] {
  const holding = (Object.keys(CLAIM_LABELS) as Claim[]).filter((k) => d.claims[k].status === 'ok').map((k) => CLAIM_LABELS[k]);
  return [
    d.contains.length ? `Contains ${list(d.contains.map((g) => g.label))}.` : 'Contains none of the regime’s allergens, as recorded.',
    ...(d.mayContain.length ? [`May contain ${list(d.mayContain.map((g) => g.label))}.`] : []),
    ...(holding.length ? [`Claims that hold as recorded: ${list(holding)}.`] : []),
    `Ingredients: ${d.ingredientsText}`,
  ];
}
