import { z } from 'zod';
import { DATE_MARKS, ID_MAX_LENGTH, itemIdSchema, unitsPerCaseSchema } from './book';
import { isCalendarDate, isCset82, outsideCset82 } from './gs1';
import { oneLine } from './text';

/**
 * What the web app, the API and the command line say to each other about labels: a request to
 * print a run, the kitchen's label settings (batch codes, GS1 numbers) and a row of the print log.
 * The renderer itself is the second entry, @crumbproof/shared/labels.
 */

/** A calendar date written YYYY-MM-DD that exists (no 30 February). */
export const calendarDateSchema = z
  .string({ error: 'Write the date as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'Write the date as YYYY-MM-DD.', abort: true })
  .refine(isCalendarDate, { error: (issue) => `${String(issue.input)} is not a date that exists; check the day and month.` });

/** The longest batch code: GS1's AI (10) holds up to 20 characters (GS1 Barcode Syntax Dictionary, X..20). */
export const BATCH_MAX_LENGTH = 20;

/** What is wrong with a batch code, or null: 1–20 characters of GS1's character set 82, as AI (10) carries them. */
export function batchProblem(batch: string): string | null {
  if (batch.length === 0) return 'Give a batch code, or leave it out to use the kitchen’s pattern.';
  if (batch.length > BATCH_MAX_LENGTH)
    return `Use a batch code of at most ${BATCH_MAX_LENGTH} characters (GS1 AI (10)); '${batch}' has ${batch.length}.`;
  if (!isCset82(batch))
    return `A batch code uses only GS1's character set 82 (letters A–Z and a–z, digits and ! " % & ' ( ) * + , - . / : ; < = > ? _); '${batch}' has ${outsideCset82(
      batch,
    )
      .map((c) => (c === ' ' ? 'a space' : `'${c}'`))
      .join(', ')}.`;
  return null;
}

export const batchSchema = z.string({ error: 'Write the batch code as text.' }).superRefine((value, ctx) => {
  const problem = batchProblem(value);
  if (problem) ctx.addIssue({ code: 'custom', input: value, message: problem });
});

export const labelRunItemSchema = z.strictObject({
  product: itemIdSchema,
  /** Labels to print; for the case template, cases. */
  quantity: z
    .number({ error: 'Give how many labels to print, as a whole number.' })
    .int('Give how many labels to print, as a whole number.')
    .min(1, 'Print at least 1 label.')
    .max(1000, 'Print at most 1000 labels of one product in one run.'),
  /** The product's revision to print (a reprint names the one logged); left out, the current one. One no longer current needs a manager's override. */
  revision: z.number({ error: 'Give the revision as a whole number.' }).int('Give the revision as a whole number.').min(1).optional(),
});
export type LabelRunItem = z.infer<typeof labelRunItemSchema>;

export const overrideSchema = z.strictObject({
  reason: oneLine(
    z
      .string({ error: 'Say why the label is printed from a revision that is no longer current.' })
      .trim()
      .min(10, 'Say in at least 10 characters why the label is printed from a revision that is no longer current.')
      .max(300, 'Keep the reason to 300 characters or fewer.'),
  ),
});
export type LabelOverride = z.infer<typeof overrideSchema>;

/** What the web app sends the API to print a run of labels. */
export const labelRunRequestSchema = z
  .strictObject({
    template: z
      .string({ error: 'Name the label template.' })
      .min(1, 'Name the label template.')
      .max(ID_MAX_LENGTH)
      .regex(/^[a-z0-9][a-z0-9-]*$/, 'A template is named in lower-case letters, digits and hyphens, e.g. "product".'),
    items: z
      .array(labelRunItemSchema, { error: 'List the products to print.' })
      .min(1, 'Pick at least one product to print.')
      .max(100, 'Print at most 100 products in one run.'),
    productionDate: calendarDateSchema,
    /** Left out: the kitchen's batch pattern gives each product its code. */
    batch: batchSchema.optional(),
    /** Case template: the units in each case, in place of the product's own. */
    unitsPerCase: unitsPerCaseSchema.optional(),
    /** Case template: SSCC labels of shipment units, (00) with (02) and (37), instead of trade-item case labels (01). */
    shipment: z.boolean().optional(),
    override: overrideSchema.optional(),
  })
  .refine((run) => new Set(run.items.map((i) => i.product)).size === run.items.length, {
    message: 'List each product once, with the number of labels it needs.',
    path: ['items'],
  });
export type LabelRunRequest = z.infer<typeof labelRunRequestSchema>;

/** The tokens of a batch pattern, each with what it becomes. */
export const BATCH_TOKENS = {
  '{YYYY}': 'the year of the production date, e.g. 2026',
  '{YY}': 'the last two digits of the year, e.g. 26',
  '{MM}': 'the month, 01–12',
  '{DD}': 'the day of the month, 01–31',
  '{JJJ}': 'the day of the year, 001–366',
  '{P}': "the product's id, upper-cased, first 6 characters without hyphens",
  '{N}': 'the sequence of the product that day, 1, 2, 3…',
  '{NN}': 'the sequence in two digits, 01, 02…',
  '{NNN}': 'the sequence in three digits, 001, 002…',
} as const;

export const DEFAULT_BATCH_PATTERN = '{YY}{MM}{DD}-{P}-{N}';

const TOKEN = /\{[A-Z]+\}/g;

export interface BatchInput {
  /** The production date, YYYY-MM-DD. */
  date: string;
  product: string;
  /** The run of the product that day, from 1. */
  sequence: number;
}

/** The day of the year of a YYYY-MM-DD date, 1–366. */
function dayOfYear(date: string): number {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return Math.round((Date.UTC(y, m - 1, d) - Date.UTC(y, 0, 1)) / 86_400_000) + 1;
}

/** A batch pattern's text with each token replaced (tokens are checked by batchPatternProblem). */
export function expandBatchPattern(pattern: string, { date, product, sequence }: BatchInput): string {
  const values: Record<string, string> = {
    '{YYYY}': date.slice(0, 4),
    '{YY}': date.slice(2, 4),
    '{MM}': date.slice(5, 7),
    '{DD}': date.slice(8, 10),
    '{JJJ}': String(dayOfYear(date)).padStart(3, '0'),
    '{P}': product.replace(/-/g, '').toUpperCase().slice(0, 6),
    '{N}': String(sequence),
    '{NN}': String(sequence).padStart(2, '0'),
    '{NNN}': String(sequence).padStart(3, '0'),
  };
  return pattern.replace(TOKEN, (token) => values[token] ?? token);
}

/**
 * What is wrong with a batch pattern, or null. Every token must be known, a sequence token and the
 * day must be there (codes are unique per product and day), and the
 * longest expansion (a long product id, sequence 999) must still be a batch code AI (10) can carry.
 */
export function batchPatternProblem(pattern: string): string | null {
  const unknown = (pattern.match(TOKEN) ?? []).filter((t) => !(t in BATCH_TOKENS));
  if (unknown.length > 0) return `Unknown token ${unknown.join(', ')} in the batch pattern. Use ${Object.keys(BATCH_TOKENS).join(' ')}.`;
  if (!/\{N{1,3}\}/.test(pattern))
    return 'Put a sequence token ({N}, {NN} or {NNN}) in the batch pattern: batch codes are unique per product and day.';
  if (!pattern.includes('{JJJ}') && !(pattern.includes('{MM}') && pattern.includes('{DD}')))
    return 'Put the day in the batch pattern ({MM} and {DD}, or {JJJ}): batch codes are unique per product and day.';
  const longest = expandBatchPattern(pattern, { date: '2026-12-31', product: 'wwwwww', sequence: 999 });
  const problem = batchProblem(longest);
  return problem ? `The batch pattern gives codes such as '${longest}': ${problem}` : null;
}

/** The kitchen's label settings (manager). */
export const labelSettingsSchema = z.strictObject({
  batchPattern: z
    .string({ error: 'Write the batch pattern as text.' })
    .superRefine((value, ctx) => {
      const problem = batchPatternProblem(value);
      if (problem) ctx.addIssue({ code: 'custom', input: value, message: problem });
    })
    .default(DEFAULT_BATCH_PATTERN),
  /** The kitchen's GS1 company prefix; null until it has one (no SSCC can be made). */
  gs1CompanyPrefix: z
    .string({ error: 'Write the GS1 company prefix as digits.' })
    .regex(/^[0-9]{6,12}$/, 'A GS1 company prefix has 6 to 12 digits.')
    .nullable()
    .default(null),
  /** The SSCC's first digit, chosen by the kitchen to widen its serial range (GS1 General Specifications, SSCC). */
  ssccExtension: z
    .number({ error: 'Give the SSCC extension digit, 0 to 9.' })
    .int('Give the SSCC extension digit, 0 to 9.')
    .min(0, 'Give the SSCC extension digit, 0 to 9.')
    .max(9, 'Give the SSCC extension digit, 0 to 9.')
    .default(0),
  /** The indicator digit of case GTIN-14s derived from unit GTINs. */
  caseIndicator: z
    .number({ error: 'Give the case indicator digit, 1 to 8.' })
    .int('Give the case indicator digit, 1 to 8.')
    .min(1, 'Give the case indicator digit, 1 to 8.')
    .max(8, 'Give the case indicator digit, 1 to 8.')
    .default(1),
});
export type LabelSettings = z.infer<typeof labelSettingsSchema>;

/**
 * A save of the label settings (PUT replaces them): every field is given, so a body that leaves
 * one out is refused naming it rather than putting the default in its place.
 */
export const labelSettingsSaveSchema = z.strictObject({
  batchPattern: labelSettingsSchema.shape.batchPattern.unwrap(),
  gs1CompanyPrefix: labelSettingsSchema.shape.gs1CompanyPrefix.unwrap(),
  ssccExtension: labelSettingsSchema.shape.ssccExtension.unwrap(),
  caseIndicator: labelSettingsSchema.shape.caseIndicator.unwrap(),
});
export type LabelSettingsInput = z.input<typeof labelSettingsSchema>;

/** One product of a logged run, as it was printed. */
export const labelRunLogItemSchema = z.object({
  product: z.string(),
  name: z.string(),
  /** The product's revision the declaration was read from. */
  revision: z.number().int(),
  /** When that declaration was computed (its basis). */
  basisComputedAt: z.string(),
  quantity: z.number().int(),
  batch: z.string(),
  dateMark: z.enum(DATE_MARKS).nullable(),
  /** The date printed (best before or use by), YYYY-MM-DD; null when the product has none. */
  date: z.string().nullable(),
  /** The first and last SSCC of a shipment run. */
  sscc: z.tuple([z.string(), z.string()]).optional(),
});
export type LabelRunLogItem = z.infer<typeof labelRunLogItemSchema>;

/** A row of the print log, as the API sends it. */
export const labelRunSchema = z.object({
  id: z.number().int(),
  printedAt: z.string(),
  printedBy: z.object({ id: z.number().int(), name: z.string() }),
  template: z.string(),
  productionDate: z.string(),
  items: z.array(labelRunLogItemSchema),
  override: z.object({ reason: z.string() }).nullable(),
  /** The size of the stored PDF. */
  pdfBytes: z.number().int(),
  /** SHA-256 of the stored PDF, hex. */
  sha256: z.string(),
  /** Every item's revision is still its product's current one. */
  current: z.boolean(),
});
export type LabelRun = z.infer<typeof labelRunSchema>;
