import { z } from 'zod';
import type { FieldError } from './errors';

/**
 * How a schema issue becomes a message for a person, everywhere: the API's request bodies, a
 * recipe book (imported or declared from the command line), a spreadsheet row, the web's forms.
 *
 * A message is the schema's own where it gives one (`.min(1, 'Give the recipe a name.')`);
 * otherwise `defaultIssueMessage` words it from the issue's code and limits, never from the
 * validation library's English. The place names the item and the field: a book path with each
 * item's id, "ingredients.3 (butter).contains", or a spreadsheet cell, "row 4, column Contains".
 */
export type SchemaIssue = z.core.$ZodIssue;

/** Names where an issue is, from its path. */
export type IssuePlace = (path: readonly PropertyKey[]) => string;

const dotted = (path: readonly PropertyKey[]) => path.map(String).join('.');

/** A request body's field by its dotted path, "lines.2.qty"; the body as a whole is "(body)". */
export const bodyPlace: IssuePlace = (path) => (path.length > 0 ? dotted(path) : '(body)');

/**
 * A path in a recipe book, naming each listed item or site by its id when the book as sent has one:
 * ['ingredients', 3, 'contains'] → "ingredients.3 (butter).contains", ['sites', 1, 'sells', 0] →
 * "sites.1 (cafe).sells.0".
 */
export function bookPlace(book: unknown): IssuePlace {
  return (path) => {
    if (path.length === 0) return '(book)';
    const [list, index, ...rest] = path;
    if ((list === 'ingredients' || list === 'recipes' || list === 'sites') && typeof index === 'number') {
      const items = book && typeof book === 'object' ? (book as Record<string, unknown>)[list] : undefined;
      const item = Array.isArray(items) ? (items[index] as unknown) : undefined;
      const id = item && typeof item === 'object' ? (item as Record<string, unknown>).id : undefined;
      if (typeof id === 'string' && id.trim() !== '') return [`${list}.${index} (${id})`, ...rest.map(String)].join('.');
    }
    return dotted(path);
  };
}

/**
 * A cell of a spreadsheet row (the header is row 1): "row 4, column Contains". `column` names
 * the column an ingredient path comes from; the row alone when the issue is not about one column.
 */
export function cellPlace(row: number, column: (path: readonly PropertyKey[]) => string | undefined): IssuePlace {
  return (path) => {
    const name = column(path);
    return name ? `row ${row}, column ${name}` : `row ${row}`;
  };
}

/** The issue as a field of an error body: where it is, and what to do. */
export function issueField(issue: SchemaIssue, place: IssuePlace): FieldError {
  return { path: place(issue.path), message: issue.message };
}

/**
 * The issue as one line: "ingredients.0 (lemon).vegetarian: Use true, false or null…". When the
 * parse reported the value (`reportInput: true`) and it is a single value, it is shown too:
 * "row 2, column fat ('120'): Use a number no larger than 100."
 */
export function formatIssue(issue: SchemaIssue, place: IssuePlace): string {
  const { path, message } = issueField(issue, place);
  const value = shownValue(issue.input);
  return `${path}${value === undefined ? '' : ` (${value})`}: ${message}`;
}

function shownValue(input: unknown): string | undefined {
  if (typeof input === 'number' || typeof input === 'boolean') return `'${String(input)}'`;
  if (typeof input !== 'string' || input.trim() === '') return undefined;
  return `'${input.length > 40 ? `${input.slice(0, 40)}…` : input}'`;
}

const quoted = (value: unknown) => (typeof value === 'string' ? `'${value}'` : String(value));
const list = (values: readonly unknown[]) => values.map(quoted).join(', ');

const MISSING: Record<string, string> = {
  number: 'Give a number.',
  int: 'Give a whole number.',
  string: 'Fill this in.',
  boolean: 'Give true or false.',
  array: 'Give a list.',
  object: 'Give this part with its fields.',
};
const WRONG: Record<string, string> = {
  number: 'Write a number, such as 0.5.',
  int: 'Write a whole number, such as 3.',
  string: 'Write this as text.',
  boolean: 'Write true or false.',
  array: 'Write this as a list.',
  object: 'Write this as a part with its fields.',
  date: 'Write a date as YYYY-MM-DD.',
};
const FORMATS: Record<string, string> = {
  email: 'Write an email address, such as name@example.com.',
  date: 'Write a date as YYYY-MM-DD.',
  datetime: 'Write a date and time, such as 2026-05-01T09:30:00Z.',
  url: 'Write a web address, such as https://example.com.',
};

/**
 * The message for an issue whose schema gives none of its own, worded from the issue's code and
 * limits. Registered once as zod's custom error map below, so every parse of every schema uses it.
 */
export function defaultIssueMessage(issue: z.core.$ZodRawIssue): string {
  switch (issue.code) {
    case 'invalid_type':
      return (issue.input === undefined ? MISSING : WRONG)[issue.expected] ?? `Give a value of the kind '${issue.expected}'.`;
    case 'too_small': {
      const min = Number(issue.minimum);
      if (issue.origin === 'string') return min <= 1 ? 'Fill this in.' : `Use at least ${min} characters.`;
      if (issue.origin === 'array' || issue.origin === 'set') return min <= 1 ? 'Add at least one.' : `Add at least ${min}.`;
      if (issue.inclusive) return `Use a number of at least ${min}.`;
      return min === 0 ? 'Use a number above zero.' : `Use a number above ${min}.`;
    }
    case 'too_big': {
      const max = Number(issue.maximum);
      if (issue.origin === 'string') return `Keep this to ${max} characters or fewer.`;
      if (issue.origin === 'array' || issue.origin === 'set') return `Give no more than ${max}.`;
      return issue.inclusive ? `Use a number no larger than ${max}.` : `Use a number below ${max}.`;
    }
    case 'invalid_value':
      return issue.values.length === 1 ? `Use ${quoted(issue.values[0])}.` : `Choose one of ${list(issue.values)}.`;
    case 'unrecognized_keys':
      return issue.keys.length === 1
        ? `There is no field '${issue.keys[0]}' here; check its spelling or remove it.`
        : `There are no fields ${list(issue.keys)} here; check their spelling or remove them.`;
    case 'invalid_format':
      return FORMATS[issue.format] ?? 'This is not written in the form expected here.';
    case 'not_multiple_of':
      return `Use a multiple of ${issue.divisor}.`;
    case 'invalid_union': {
      // The option the value came closest to: one it matched in kind but not inside (an object
      // with a wrong field), else one that did not refuse its kind (a text that is not in a list).
      const branches = issue.errors.filter((branch) => branch.length > 0);
      const near =
        branches.find((branch) => branch.every((i) => i.path.length > 0)) ??
        branches.find((branch) => branch.every((i) => i.code !== 'invalid_type'));
      const first = near?.[0];
      if (!first) return 'This is not in a form accepted here.';
      return first.path.length > 0 ? `${dotted(first.path)}: ${first.message}` : first.message;
    }
    case 'invalid_key':
    case 'invalid_element':
      return 'One of the entries here is not accepted.';
    default:
      return 'This is not accepted here.';
  }
}

z.config({ customError: defaultIssueMessage });
