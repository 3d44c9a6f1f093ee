import { z } from 'zod';
import { CLAIM_LABELS, type ClaimStatus } from './allergens';
import type { DeclarationDiff } from './declaration-diff';
import { BATCH_MAX_LENGTH, calendarDateSchema } from './label-contracts';
import type { ServedDeclaration } from './product-declaration';
import type { Role } from './roles';

/**
 * The audit trail (append-only: the API's database user may only read and add its rows) and the
 * recall from a batch code, as the API and the manager's Audit page say them to each other.
 */

/** Every kind of event the trail records; each write of the kitchen's data names one. */
export const AUDIT_ACTIONS = [
  'ingredient.saved',
  'recipe.saved',
  'recipe.archived',
  'book.imported',
  'ingredients.imported',
  'kitchen.updated',
  'user.created',
  'user.updated',
  'user.added-to-kitchen',
  'user.taken-off-kitchen',
  'labels.printed',
  'label-settings.saved',
  'public-page.saved',
  'counter.day-marked',
  'counter.question-asked',
  'counter.question-answered',
  'specification.uploaded',
  'specifications.reviewed',
  'swap.applied',
  'approval.given',
  'label-stale.handled',
  'sign-in.succeeded',
  'sign-in.failed',
  'signed-out',
  'access.refused',
  'first-manager.set',
  'user.invited',
  'invitation.resent',
  'password-reset.requested',
  'password.set',
  'account-link.refused',
  'mail.retried',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** What each action reads as on the Audit page. */
export const AUDIT_ACTION_LABELS: Record<AuditAction, string> = {
  'ingredient.saved': 'Ingredient saved',
  'recipe.saved': 'Recipe saved',
  'recipe.archived': 'Recipe archived',
  'book.imported': 'Recipe book imported',
  'ingredients.imported': 'Ingredients imported from a spreadsheet',
  'kitchen.updated': 'Kitchen settings changed',
  'user.created': 'User added',
  'user.updated': 'User changed',
  'user.added-to-kitchen': 'User of another kitchen added to this one',
  'user.taken-off-kitchen': 'User taken off a kitchen',
  'labels.printed': 'Labels printed',
  'label-settings.saved': 'Label settings saved',
  'public-page.saved': 'Public page settings saved',
  'counter.day-marked': 'Products on sale marked',
  'counter.question-asked': 'Question asked of the kitchen',
  'counter.question-answered': 'Question answered',
  'specification.uploaded': 'Supplier specification uploaded',
  'specifications.reviewed': 'Supplier specifications looked at for review (daily)',
  'swap.applied': 'Swap applied',
  'approval.given': 'Declaration approved',
  'label-stale.handled': 'Out-of-date labels handled',
  'sign-in.succeeded': 'Signed in',
  'sign-in.failed': 'Sign-in refused',
  'signed-out': 'Signed out',
  'access.refused': 'Access refused',
  'first-manager.set': 'First manager set',
  'user.invited': 'User invited',
  'invitation.resent': 'Invitation sent again',
  'password-reset.requested': 'Password reset asked for',
  'password.set': 'Password set with a mailed link',
  'account-link.refused': 'Mailed link refused',
  'mail.retried': 'Mail sent again',
};

/** Who did it, as they were at the time (a later rename or new role does not rewrite the trail); null for an anonymous event. */
export interface AuditActor {
  id: number;
  name: string;
  role: Role;
}

/** One row of the trail as a list shows it (before and after are fetched on demand). */
export interface AuditEventRow {
  /** The row's number (a BIGINT, sent as text). */
  id: string;
  /** ISO timestamp, to the millisecond. */
  at: string;
  actor: AuditActor | null;
  action: AuditAction;
  /** What kind of record it is about (ingredient, recipe, user, label-run…) and its id there, or null. */
  recordKind: string | null;
  recordId: string | null;
  summary: string;
  /** The client's address. */
  address: string | null;
  /** Whether the row keeps the record before and after the write. */
  hasChange: boolean;
}

/** One row with the record before and after the write (null where not applicable). */
export interface AuditEventDetail extends AuditEventRow {
  before: unknown;
  after: unknown;
}

/** GET /api/audit and /api/audit/export.csv: the filters (each optional) and the page. */
export const auditQuerySchema = z
  .strictObject({
    user: z.coerce
      .number({ error: 'Give the user as their number.' })
      .int({ error: 'Give the user as their number.' })
      .min(1, 'Give the user as their number.')
      .optional(),
    action: z.enum(AUDIT_ACTIONS, { error: `Name one of the actions: ${AUDIT_ACTIONS.join(', ')}.` }).optional(),
    /** A record's id exactly: an item's code, a user's number, a print run's number. */
    record: z
      .string()
      .trim()
      .min(1, 'Give the record’s id, or leave it out.')
      .max(120, 'Keep the record’s id to 120 characters.')
      .optional(),
    /** Days from and to, YYYY-MM-DD, both included. */
    from: calendarDateSchema.optional(),
    to: calendarDateSchema.optional(),
    sort: z.enum(['newest', 'oldest'], { error: 'Sort by newest or oldest.' }).optional(),
    page: z.coerce.number({ error: 'Give the page as a number from 1.' }).int().min(1, 'Give the page as a number from 1.').optional(),
    pageSize: z.coerce
      .number({ error: 'Give the page size as a number from 1 to 200.' })
      .int()
      .min(1, 'Give the page size as a number from 1 to 200.')
      .max(200, 'Give the page size as a number from 1 to 200.')
      .optional(),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], error: 'The last day comes on or after the first day.' });
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export const AUDIT_DEFAULT_PAGE_SIZE = 50;

export interface AuditPage {
  items: AuditEventRow[];
  /** How many rows match the filters in all. */
  total: number;
  page: number;
  pageSize: number;
}

/** GET /api/audit/recall: a batch code as printed. */
export const recallQuerySchema = z.strictObject({
  batch: z
    .string({ error: 'Give the batch code printed on the label.' })
    .trim()
    .min(1, 'Give the batch code printed on the label.')
    .max(BATCH_MAX_LENGTH, `A batch code has at most ${BATCH_MAX_LENGTH} characters.`),
});
export type RecallQuery = z.infer<typeof recallQuerySchema>;

/** One print of the batch: which run, when, by whom, and what the label carried. */
export interface RecallPrint {
  run: number;
  printedAt: string;
  printedBy: string;
  template: string;
  productionDate: string;
  product: string;
  productName: string;
  /** The product's revision the label was printed from. */
  revision: number;
  quantity: number;
  /** The date mark printed, when the product has one. */
  date: string | null;
  /** The declaration printed, with its basis, as the print log keeps it. */
  declaration: ServedDeclaration;
}

/** The product as it stands now, against what was printed. */
export interface RecallProductNow {
  product: string;
  name: string;
  /** Null when the product is gone from the kitchen. */
  revision: number | null;
  declaration: ServedDeclaration | null;
  /** Between the declaration printed first in this batch and the current one; null when the product is gone. */
  diff: DeclarationDiff | null;
  /** The changes in words; empty when nothing a label shows has changed. */
  changes: string[];
}

export interface RecallResult {
  batch: string;
  /** Every print of the batch, oldest first; empty when the batch was never printed. */
  prints: RecallPrint[];
  /** One per product the batch was printed for. */
  products: RecallProductNow[];
  /** A sentence for the top of the page: how many prints, or that there is none. */
  message: string;
}

const CLAIM_STATUS_WORDS: Record<ClaimStatus, string> = {
  ok: 'stands as recorded',
  fails: 'does not hold',
  unverified: 'cannot be checked',
};

const list = (names: string[]) =>
  names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;

/** What changed between a printed declaration and the current one, in sentences (DeclarationDiff, shared/src/declaration-diff.ts). */
export function declarationChangesInWords(diff: DeclarationDiff, ingredientsText?: { before: string; after: string }): string[] {
  const out: string[] = [];
  const names = (g: { label: string }[]) => list(g.map((x) => x.label));
  if (diff.containsAdded.length) out.push(`Now contains ${names(diff.containsAdded)}, which the label does not declare.`);
  if (diff.containsRemoved.length) out.push(`No longer contains ${names(diff.containsRemoved)}.`);
  if (diff.mayContainAdded.length) out.push(`Now may contain ${names(diff.mayContainAdded)}.`);
  if (diff.mayContainRemoved.length) out.push(`No longer may contain ${names(diff.mayContainRemoved)}.`);
  for (const c of diff.claims) {
    if (c.before !== c.after)
      out.push(`${CLAIM_LABELS[c.claim]}: ${CLAIM_STATUS_WORDS[c.before]} on the label, now ${CLAIM_STATUS_WORDS[c.after]}.`);
  }
  for (const s of diff.shares) {
    if (s.before === null) out.push(`${s.name} is new in the recipe (${s.after}%).`);
    else if (s.after === null) out.push(`${s.name} is no longer in the recipe (was ${s.before}%).`);
    else out.push(`${s.name} went from ${s.before}% to ${s.after}%.`);
  }
  if (diff.finishedWeightG.before !== diff.finishedWeightG.after)
    out.push(`The finished weight went from ${diff.finishedWeightG.before} g to ${diff.finishedWeightG.after} g.`);
  for (const e of diff.errorsAdded) out.push(`New problem: ${e}`);
  for (const e of diff.errorsRemoved) out.push(`Problem since solved: ${e}`);
  if (ingredientsText && ingredientsText.before !== ingredientsText.after && diff.shares.length === 0)
    out.push('The ingredient list reads differently.');
  return out;
}

/** Cells that a spreadsheet would run as a formula (OWASP, CSV injection) start with one of these. */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * One CSV cell (RFC 4180): quoted when it holds a comma, a quote or a line break, quotes doubled;
 * a cell a spreadsheet would run as a formula is kept as text with a leading apostrophe.
 */
export function csvCell(value: string | number | null): string {
  if (value === null) return '';
  let text = String(value);
  if (typeof value === 'string' && FORMULA_START.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** A CSV line of cells, ended by CRLF as RFC 4180 says. */
export function csvLine(cells: (string | number | null)[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`;
}
