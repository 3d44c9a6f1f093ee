import type { Regime } from '../allergens';
import type { DateMark } from '../book';

/**
 * Dates on labels. The date is the production date plus the product's shelf life, in days.
 * Each regime writes it its usual way:
 * - EU and UK: "Best before 12.12.2026", "Use by 12.12.2026": day, month and year
 *   (Regulation (EU) No 1169/2011 Annex X points 1 and 2);
 * - US: "BEST BY DEC 12 2026", "USE BY DEC 12 2026" (common practice; no federal rule sets the wording);
 * - Canada: "BEST BEFORE / MEILLEUR AVANT 26 DE 12", year, month and day, with the bilingual
 *   month codes (Food and Drug Regulations B.01.007(4) and (5), from memory); a use by date is
 *   written the same way with "USE BY / UTILISER AVANT" (common practice);
 * - Australia and New Zealand: "Best before 12 Dec 2026", "Use by 12 Dec 2026"
 *   (Food Standards Code Standard 1.2.5).
 */

/** The date `days` after a YYYY-MM-DD date. */
export function addDays(isoDate: string, days: number): string {
  const [y, m, d] = isoDate.split('-').map(Number) as [number, number, number];
  const date = new Date(Date.UTC(y, m - 1, d + days));
  return date.toISOString().slice(0, 10);
}

/** The date on the label: the production date plus the shelf life. */
export function labelDate(productionDate: string, shelfLifeDays: number): string {
  return addDays(productionDate, shelfLifeDays);
}

const MONTHS_EN = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** Food and Drug Regulations B.01.007(5), from memory: month codes read in English and French. */
const MONTHS_CA = ['JA', 'FE', 'MR', 'AL', 'MA', 'JN', 'JL', 'AU', 'SE', 'OC', 'NO', 'DE'];

/** The entry of a list of names of months. */
function nth(list: readonly string[], index: number): string {
  const value = list[index];
  if (value === undefined) throw new RangeError(`No month ${index + 1}.`);
  return value;
}

/** A no-break space: the parts of a date stay on one line. */
const NBSP = '\u00a0';

/** The date as the regime writes it on a label, with its words: "Best before 12.12.2026" (the date itself never broken over two lines). */
export function formatLabelDate(isoDate: string, mark: DateMark, regime: Regime): string {
  const [words, date] = labelDateParts(isoDate, mark, regime);
  return `${words} ${date.replace(/ /g, NBSP)}`;
}

function labelDateParts(isoDate: string, mark: DateMark, regime: Regime): [string, string] {
  const [y, m, d] = isoDate.split('-') as [string, string, string];
  const month = Number(m) - 1;
  switch (regime) {
    case 'EU':
    case 'UK':
      return [mark === 'use-by' ? 'Use by' : 'Best before', `${d}.${m}.${y}`];
    case 'US':
      return [mark === 'use-by' ? 'USE BY' : 'BEST BY', `${nth(MONTHS_EN, month).toUpperCase()} ${d} ${y}`];
    case 'CA':
      return [
        mark === 'use-by' ? 'USE BY / UTILISER AVANT' : 'BEST BEFORE / MEILLEUR AVANT',
        `${y.slice(2)} ${nth(MONTHS_CA, month)} ${d}`,
      ];
    case 'ANZ':
      return [mark === 'use-by' ? 'Use by' : 'Best before', `${Number(d)} ${nth(MONTHS_EN, month)} ${y}`];
  }
}

/** A print date and time as the chart shows it: "2 December 2026, 05:10 UTC". */
export function formatPrintedAt(iso: string): string {
  const date = new Date(iso);
  const long = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
  const hh = String(date.getUTCHours()).padStart(2, '0');
  const mm = String(date.getUTCMinutes()).padStart(2, '0');
  return `${date.getUTCDate()} ${nth(long, date.getUTCMonth())} ${date.getUTCFullYear()}, ${hh}:${mm} UTC`;
}
