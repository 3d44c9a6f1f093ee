import type { z } from 'zod';

/**
 * Text as people type it, checked the same in the API and the web's forms.
 *
 * A string that came from JSON can hold half of a UTF-16 surrogate pair on its own ("\ud83c"
 * without its partner): that is not a character at all (the text is not well-formed Unicode, as
 * ECMAScript's String.prototype.isWellFormed puts it), it cannot be written as UTF-8, and the
 * database would keep a replacement character instead. Such text is refused, never stored changed.
 *
 * One-line fields (names, suppliers, codes) also refuse control characters (NUL, escape, tabs,
 * line breaks), which no one types into them; longer texts keep tabs and line breaks.
 */

/** In a /u expression, \p{Cs} matches only a surrogate without its partner: a pair is one code point. */
const LONE_SURROGATE = /\p{Cs}/u;
const CONTROL = /\p{Cc}/u;
const CONTROL_BUT_TAB_OR_LINE_BREAK = /[^\P{Cc}\t\n\r]/u;

export const BROKEN_CHARACTER_MESSAGE =
  'This text has a broken character (half of an emoji or of another character written in two parts); type or paste it again.';

/** Well-formed Unicode: no lone surrogate. */
export const isWellFormedText = (text: string): boolean => !LONE_SURROGATE.test(text);

function checked<S extends z.ZodString>(schema: S, control: RegExp, message: string): S {
  return schema.refine(isWellFormedText, BROKEN_CHARACTER_MESSAGE).refine((text) => !control.test(text), message);
}

/** A name, a supplier, a code: well-formed, and no control characters. */
export const oneLine = <S extends z.ZodString>(schema: S): S =>
  checked(schema, CONTROL, 'Leave out control characters (such as tabs, line breaks or NUL): this field is one line of text.');

/** A longer text (a composition, a note): well-formed, and no control characters but tabs and line breaks. */
export const plainText = <S extends z.ZodString>(schema: S): S =>
  checked(schema, CONTROL_BUT_TAB_OR_LINE_BREAK, 'Leave out control characters other than tabs and line breaks (such as NUL or escape).');
