import { z } from 'zod';
import { itemIdSchema } from './book';
import { calendarDateSchema } from './label-contracts';
import type { Regime } from './allergens';
import type { CounterApproval } from './approval-contracts';
import type { CounterRules } from './counter/ask';
import type { ServedDeclaration } from './product-declaration';
import { plainText } from './text';

/**
 * What the counter (front of house answering a customer) and the API say to each other: every
 * product for sale with its served declaration, the products on sale on a day, questions asked of
 * the kitchen with their answers, and the events pushed to an open counter screen.
 */

/** The most products one kitchen puts on the counter on one day. */
export const COUNTER_DAY_MAX_PRODUCTS = 500;

/** The products on sale on a day, as the manager or pastry chef marks them. */
export const counterDaySchema = z.strictObject({
  date: calendarDateSchema,
  products: z
    .array(itemIdSchema, { error: 'List the products on sale that day, by id.' })
    .max(COUNTER_DAY_MAX_PRODUCTS, `List at most ${COUNTER_DAY_MAX_PRODUCTS} products for one day.`)
    .refine((ids) => new Set(ids).size === ids.length, { error: 'List each product once.' }),
});
export type CounterDay = z.infer<typeof counterDaySchema>;

/** GET /api/counter/today: the day to look up; left out, today. */
export const counterDayQuerySchema = z.strictObject({ date: calendarDateSchema.optional() });
export type CounterDayQuery = z.infer<typeof counterDayQuerySchema>;

/** An allergen group code of the kitchen's regime ('eggs') or a finer source ('walnut'). */
const avoidCodeSchema = z
  .string({ error: 'Name each allergen as its code, e.g. "eggs" or "walnut".' })
  .max(40, 'Name each allergen as its code, e.g. "eggs" or "walnut".')
  .regex(/^[a-z][a-z-]*$/, 'Name each allergen as its code, e.g. "eggs" or "walnut".');

/** A question a customer asks that the counter cannot answer from the records, sent to the kitchen. */
export const counterQuestionSchema = z.strictObject({
  product: itemIdSchema,
  avoid: z
    .array(avoidCodeSchema, { error: 'List what the customer must avoid.' })
    .min(1, 'Pick at least one allergen the customer must avoid.')
    .max(40, 'Pick at most 40 allergens.')
    .refine((codes) => new Set(codes).size === codes.length, { error: 'Name each allergen once.' }),
  note: plainText(z.string({ error: 'Write the note as text.' }).trim().max(500, 'Keep the note to 500 characters.')).optional(),
});
export type CounterQuestionRequest = z.infer<typeof counterQuestionSchema>;

/** The kitchen's answer to a question. */
export const counterAnswerSchema = z.strictObject({
  answer: plainText(
    z
      .string({ error: 'Write the answer as text.' })
      .trim()
      .min(1, 'Write the answer for the counter.')
      .max(1000, 'Keep the answer to 1000 characters.'),
  ),
});
export type CounterAnswerRequest = z.infer<typeof counterAnswerSchema>;

/** GET /api/counter/questions: `open=true` lists only the questions not answered yet. */
export const counterQuestionsQuerySchema = z.strictObject({
  open: z.enum(['true', 'false'], { error: 'Write open as true or false.' }).optional(),
});
export type CounterQuestionsQuery = z.infer<typeof counterQuestionsQuerySchema>;

/**
 * One product on the counter: its approved declaration, or its current one (as GET
 * /api/recipes/:code/declaration serves it) when it was never approved or a change waiting for
 * approval adds an allergen or loses a claim; `approval` says which.
 */
export interface CounterProduct {
  id: string;
  name: string;
  /** Marked on sale on the day of the feed. */
  onSale: boolean;
  declaration: ServedDeclaration;
  approval: CounterApproval;
}

/** GET /api/counter/products: every product for sale, read from one state of the kitchen. */
export interface CounterProductsView {
  /** When the server read the kitchen and assembled this set (ISO 8601). */
  computedAt: string;
  /** The day whose display `onSale` follows (the server's calendar day). */
  date: string;
  /** The kitchen's regime: every declaration in the set is under it. */
  regime: Regime;
  /** The regime's allergen groups, each with its label and the sources it covers, for the counter's lookup. */
  rules: CounterRules;
  products: CounterProduct[];
}

/** The products on sale on a day and who marked them; never marked, no products and no one. */
export interface CounterDayView {
  date: string;
  products: string[];
  setBy: string | null;
  setAt: string | null;
}

export interface CounterQuestionView {
  id: number;
  product: string;
  productName: string;
  avoid: string[];
  note: string | null;
  askedBy: string;
  askedAt: string;
  answer: { text: string; by: string; at: string } | null;
}

/**
 * What an open events stream says: a declaration may have changed (with the ids it touches when
 * they are known: the products for sale made with what was written, and every recipe written, as
 * one just taken off sale leaves the counter; none named means any product), someone asked the
 * kitchen a question (so the kitchen's screens list it at once), the kitchen answered one, or the
 * products on sale on a day were marked again.
 */
export type CounterEvent =
  | { type: 'declarations-changed'; products?: string[] }
  | { type: 'question-asked'; question: number; product: string }
  | { type: 'question-answered'; question: number; product: string }
  | { type: 'display-changed'; date: string };

export const COUNTER_EVENT_TYPES = ['declarations-changed', 'question-asked', 'question-answered', 'display-changed'] as const;
