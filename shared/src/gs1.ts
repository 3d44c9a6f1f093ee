/**
 * GS1 keys and element strings, as plain functions (no barcode library): check digits of GTINs
 * and SSCCs, the case GTIN-14 derived from a unit's GTIN, GS1 dates, the AI encodable character
 * set 82, and element strings checked against the GS1 Barcode Syntax Dictionary's formats and
 * pairing rules before anything is printed.
 *
 * Sources: GS1 General Specifications (the modulo 10 check digit, section 7.9 from memory; FNC1
 * and the predefined-length AIs, section 5.10 and figure 5.10.1-2 from memory; the character set
 * 82, figure 7.11-1 from memory) and the GS1 Barcode Syntax Dictionary (each AI's format, and its
 * `req=` and `ex=` attributes for the pairing rules; attribute values here from memory).
 */

/** What a GS1 key is: a trade item's GTIN of a given length, or a logistic unit's SSCC. */
export const GS1_KEY_KINDS = ['gtin', 'unit-gtin', 'gtin-14', 'sscc'] as const;
export type Gs1KeyKind = (typeof GS1_KEY_KINDS)[number];

/** The lengths of each kind, check digit included. */
const KEY_LENGTHS: Record<Gs1KeyKind, readonly number[]> = {
  gtin: [8, 12, 13, 14],
  'unit-gtin': [8, 12, 13],
  'gtin-14': [14],
  sscc: [18],
};

const KEY_NAMES: Record<Gs1KeyKind, string> = {
  gtin: 'A GTIN',
  'unit-gtin': "A unit's GTIN",
  'gtin-14': 'A case GTIN-14',
  sscc: 'An SSCC',
};

const DIGITS = /^[0-9]+$/;

/**
 * The GS1 modulo 10 check digit of a payload (the key without its check digit): from the
 * rightmost digit leftwards, weights 3, 1, 3, 1…; the check digit brings the sum up to a
 * multiple of ten (GS1 General Specifications, check digit calculation).
 */
export function gs1CheckDigit(payload: string): number {
  if (!DIGITS.test(payload)) throw new RangeError(`A GS1 check digit is computed over digits only, not '${payload}'.`);
  let sum = 0;
  for (let i = 0; i < payload.length; i++) {
    const digit = payload.charCodeAt(payload.length - 1 - i) - 48;
    sum += digit * (i % 2 === 0 ? 3 : 1);
  }
  return (10 - (sum % 10)) % 10;
}

/**
 * Null when `digits` is a well-formed key of the kind with a correct check digit; otherwise a
 * message that says what is wrong, naming the expected check digit when that is the fault.
 */
export function verifyGs1Key(digits: string, kind: Gs1KeyKind): string | null {
  const lengths = KEY_LENGTHS[kind];
  const name = KEY_NAMES[kind];
  const shown = digits.length > 24 ? `${digits.slice(0, 24)}…` : digits;
  if (!DIGITS.test(digits)) return `${name} is written in digits only (0–9); '${shown}' has other characters.`;
  if (!lengths.includes(digits.length))
    return `${name} has ${lengths.join(', ').replace(/, (\d+)$/, ' or $1')} digits; '${shown}' has ${digits.length}.`;
  const expected = gs1CheckDigit(digits.slice(0, -1));
  const given = Number(digits.at(-1));
  if (expected !== given)
    return `The check digit of ${digits} should be ${expected}, not ${given} (GS1 modulo 10): check the number on the product's registration.`;
  return null;
}

/** The key with its leading zeros to 14 digits (a GTIN-8, -12 or -13 as the GTIN-14 field holds it). */
export const gtin14 = (gtin: string): string => gtin.padStart(14, '0');

/**
 * The GTIN-14 of a case of a unit: the indicator digit (1–8, chosen by the brand owner), the
 * unit's GTIN without its check digit in the remaining 12 places, and a new check digit
 * (GS1 General Specifications, GTIN-14 for trade item groupings; indicator 9 is for variable
 * measure items and 0 is the unit itself, so both are refused here).
 */
export function caseGtinFromUnit(gtin: string, indicator: number): string {
  const problem = verifyGs1Key(gtin, 'unit-gtin');
  if (problem) throw new RangeError(problem);
  if (!Number.isInteger(indicator) || indicator < 1 || indicator > 8)
    throw new RangeError(`The indicator digit of a case GTIN is 1 to 8, not ${indicator}.`);
  const payload = `${indicator}${gtin14(gtin).slice(1, 13)}`;
  return `${payload}${gs1CheckDigit(payload)}`;
}

/** How many serial references an SSCC holds after this company prefix (17 digits before the check digit, less the extension). */
export function ssccCapacity(companyPrefix: string): number {
  return 10 ** (16 - companyPrefix.length);
}

/**
 * The SSCC of a logistic unit: extension digit, GS1 company prefix, serial reference padded to
 * fill 17 digits, check digit (GS1 General Specifications, SSCC).
 */
export function sscc(extension: number, companyPrefix: string, serial: number): string {
  if (!Number.isInteger(extension) || extension < 0 || extension > 9)
    throw new RangeError(`The SSCC extension digit is 0 to 9, not ${extension}.`);
  if (!/^[0-9]{6,12}$/.test(companyPrefix)) throw new RangeError(`A GS1 company prefix has 6 to 12 digits; '${companyPrefix}' is not one.`);
  const capacity = ssccCapacity(companyPrefix);
  if (!Number.isSafeInteger(serial) || serial < 0 || serial >= capacity)
    throw new RangeError(`The SSCC serial ${serial} does not fit after the company prefix ${companyPrefix}: use 0 to ${capacity - 1}.`);
  const payload = `${extension}${companyPrefix}${String(serial).padStart(16 - companyPrefix.length, '0')}`;
  return `${payload}${gs1CheckDigit(payload)}`;
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True when `text` is a YYYY-MM-DD date that exists on the calendar (no 31 April, no 29 February 2027). */
export function isCalendarDate(text: string): boolean {
  const m = ISO_DATE.exec(text);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(Date.UTC(y, mo - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d;
}

/**
 * A date as GS1 element strings carry it, YYMMDD (AIs 11, 13, 15, 17). GS1 reads the year
 * within a window of the current year (General Specifications, from memory), so only years
 * 2000–2099 are written here, where the window and the calendar agree for the decades labels
 * are printed in.
 */
export function gs1Date(isoDate: string): string {
  if (!isCalendarDate(isoDate)) throw new RangeError(`'${isoDate}' is not a date that exists; write it as YYYY-MM-DD.`);
  const year = Number(isoDate.slice(0, 4));
  if (year < 2000 || year > 2099) throw new RangeError(`A GS1 date is written here for the years 2000 to 2099, not ${year}.`);
  return `${isoDate.slice(2, 4)}${isoDate.slice(5, 7)}${isoDate.slice(8, 10)}`;
}

/**
 * GS1 AI encodable character set 82: digits, upper- and lower-case Latin letters and
 * ! " % & ' ( ) * + , - . / : ; < = > ? _ (GS1 General Specifications, figure 7.11-1 from memory).
 */
const CSET82 = /^[!"%&'()*+,\-./0-9:;<=>?A-Z_a-z]*$/;
export const isCset82 = (text: string): boolean => CSET82.test(text);

/** The characters of `text` outside character set 82, each once, in order, for a message. */
export function outsideCset82(text: string): string[] {
  return [...new Set([...text].filter((c) => !CSET82.test(c)))];
}

/** One GS1 element: an application identifier and its value, e.g. {ai: '10', value: 'B7'}. */
export interface Gs1Element {
  ai: string;
  value: string;
}

/** An element string ready to encode: human-readable (HRI), as transmitted, and as bwip-js takes it. */
export interface Gs1ElementString {
  ok: true;
  /** The human-readable interpretation: '(01)05012345678900(10)B7'. */
  hri: string;
  /**
   * The data a GS1-128 scanner transmits: the symbology identifier ']C1' (FNC1 in first
   * position), then each element, with the group separator (ASCII 29, which FNC1 encodes in
   * the symbol) after every variable-length element that is not the last.
   */
  data: string;
  /** The text bwip-js's gs1-128 encoder takes: AIs in parentheses, as the HRI. */
  bwipText: string;
  /** The elements in the order they are encoded: predefined-length ones first. */
  elements: Gs1Element[];
}
export type Gs1ElementStringResult = Gs1ElementString | { ok: false; problems: string[] };

/** The group separator that ends a variable-length element in transmitted GS1 data. */
export const GS = String.fromCharCode(29);

interface AiRule {
  title: string;
  /** Checks the value; null when it is fine, else what is wrong. */
  check: (value: string) => string | null;
  /** Fixed length (the predefined-length AIs of the General Specifications): no separator after it. */
  fixed: boolean;
  /** Each group here needs at least one of its AIs in the same element string (`req=`). */
  requires?: string[][];
  /** None of these may be in the same element string (`ex=`). */
  excludes?: string[];
}

function digitsOf(length: number, what: string): (value: string) => string | null {
  return (value) => (new RegExp(`^[0-9]{${length}}$`).test(value) ? null : `${what} has ${length} digits, not '${value}'.`);
}

function keyCheck(length: number, kind: Gs1KeyKind, what: string): (value: string) => string | null {
  const digits = digitsOf(length, what);
  return (value) => digits(value) ?? verifyGs1Key(value, kind);
}

/** N6 as YYMMDD; DD may be 00 for "the last day of the month" (the syntax dictionary's yymmd0, from memory). */
function dateCheck(what: string): (value: string) => string | null {
  return (value) => {
    if (!/^[0-9]{6}$/.test(value)) return `${what} is written YYMMDD, not '${value}'.`;
    const [yy, mm, dd] = [value.slice(0, 2), value.slice(2, 4), value.slice(4, 6)];
    if (dd === '00' && Number(mm) >= 1 && Number(mm) <= 12) return null;
    return isCalendarDate(`20${yy}-${mm}-${dd}`) ? null : `${what} '${value}' is not a date that exists.`;
  };
}

/** Trade item data (batch, dates, weights) describes an identified item: (01) or (02). */
const NEEDS_ITEM = [['01', '02']];

const AI_RULES: Record<string, AiRule> = {
  '00': { title: 'SSCC', fixed: true, check: keyCheck(18, 'sscc', 'An SSCC (00)') },
  '01': { title: 'GTIN', fixed: true, check: keyCheck(14, 'gtin-14', 'A GTIN (01)'), excludes: ['02', '37'] },
  '02': {
    title: 'CONTENT',
    fixed: true,
    check: keyCheck(14, 'gtin-14', 'The content GTIN (02)'),
    requires: [['00'], ['37']],
    excludes: ['01'],
  },
  '10': {
    title: 'BATCH/LOT',
    fixed: false,
    check: (value) => {
      if (value.length < 1 || value.length > 20) return `A batch (10) has 1 to 20 characters; '${value}' has ${value.length}.`;
      const bad = outsideCset82(value);
      return bad.length === 0
        ? null
        : `A batch (10) uses GS1's character set 82 (letters A–Z and a–z, digits and ! " % & ' ( ) * + , - . / : ; < = > ? _); '${value}' has ${bad.map((c) => `'${c}'`).join(', ')}.`;
    },
    requires: NEEDS_ITEM,
  },
  '11': { title: 'PROD DATE', fixed: true, check: dateCheck('A production date (11)'), requires: NEEDS_ITEM },
  '13': { title: 'PACK DATE', fixed: true, check: dateCheck('A packaging date (13)'), requires: NEEDS_ITEM },
  '15': { title: 'BEST BEFORE or BEST BY', fixed: true, check: dateCheck('A best before date (15)'), requires: NEEDS_ITEM },
  '17': { title: 'USE BY OR EXPIRY', fixed: true, check: dateCheck('A use by date (17)'), requires: NEEDS_ITEM },
  '37': {
    title: 'COUNT',
    fixed: false,
    check: (value) => (/^[0-9]{1,8}$/.test(value) ? null : `A count (37) has 1 to 8 digits, not '${value}'.`),
    requires: [['00'], ['02']],
    excludes: ['01'],
  },
};
for (let n = 0; n <= 5; n++)
  AI_RULES[`310${n}`] = {
    title: `NET WEIGHT (kg)`,
    fixed: true,
    check: digitsOf(6, `A net weight in kilograms (310${n})`),
    requires: NEEDS_ITEM,
  };

/** True for an AI of predefined length, which needs no separator after it (GS1 General Specifications, from memory). */
export const isPredefinedLength = (ai: string): boolean => AI_RULES[ai]?.fixed === true;

/** The application identifiers this product encodes, each with its data title. */
export const SUPPORTED_AIS: ReadonlyArray<{ ai: string; title: string }> = Object.entries(AI_RULES).map(([ai, rule]) => ({
  ai,
  title: rule.title,
}));

/**
 * The element string of a GS1-128 symbol, or every problem with it: each AI's format and length,
 * check digits, the pairing rules (an AI that needs another, an AI that excludes another), one
 * net weight, no AI twice. Predefined-length elements go first, so that only variable-length
 * elements before the last need a separator; the order of the others is kept.
 */
export function elementString(elements: Gs1Element[]): Gs1ElementStringResult {
  const problems: string[] = [];
  if (elements.length === 0) return { ok: false, problems: ['An element string needs at least one element.'] };
  const seen = new Set<string>();
  for (const { ai, value } of elements) {
    const rule = AI_RULES[ai];
    if (!rule) {
      problems.push(`AI (${ai}) is not one this product encodes (${Object.keys(AI_RULES).join(', ')}).`);
      continue;
    }
    if (seen.has(ai)) problems.push(`AI (${ai}) is given twice; an element string holds each AI once.`);
    seen.add(ai);
    const problem = rule.check(value);
    if (problem) problems.push(problem);
  }
  const weights = [...seen].filter((ai) => ai.startsWith('310'));
  if (weights.length > 1) problems.push(`Give one net weight, not ${weights.map((ai) => `(${ai})`).join(' and ')}.`);
  const excluded = new Set<string>();
  for (const ai of seen) {
    const rule = AI_RULES[ai];
    if (!rule) continue;
    for (const group of rule.requires ?? [])
      if (!group.some((other) => seen.has(other)))
        problems.push(`AI (${ai}) is only used with ${group.map((other) => `(${other})`).join(' or ')}.`);
    for (const other of rule.excludes ?? []) {
      const pair = [ai, other].sort().join(' ');
      if (seen.has(other) && !excluded.has(pair)) {
        excluded.add(pair);
        problems.push(`AI (${pair.slice(0, pair.indexOf(' '))}) and AI (${pair.slice(pair.indexOf(' ') + 1)}) are never used together.`);
      }
    }
  }
  if (problems.length > 0) return { ok: false, problems };

  const fixed = isPredefinedLength;
  const ordered = [...elements.filter((e) => fixed(e.ai)), ...elements.filter((e) => !fixed(e.ai))];
  const hri = ordered.map(({ ai, value }) => `(${ai})${value}`).join('');
  const data = ']C1' + ordered.map(({ ai, value }, i) => `${ai}${value}${!fixed(ai) && i < ordered.length - 1 ? GS : ''}`).join('');
  return { ok: true, hri, data, bwipText: hri, elements: ordered };
}

/**
 * A net weight in grams as (310n): kilograms in six digits with n decimals (0–5), the most
 * decimals that fit, so that the weight is as exact as the element allows; null above 999999 kg
 * or below 0.01 g, which (310n) cannot carry.
 */
export function netWeightElement(grams: number): Gs1Element | null {
  const kg = grams / 1000;
  for (let n = 5; n >= 0; n--) {
    const scaled = Math.round(kg * 10 ** n);
    if (scaled < 1_000_000) return scaled > 0 ? { ai: `310${n}`, value: String(scaled).padStart(6, '0') } : null;
  }
  return null;
}
