import { formatLabelDate as withNoBreakSpaces, formatPrintedAt, labelDate } from './dates';

/** The date as printed, its no-break spaces shown as spaces. */
const formatLabelDate = (...args: Parameters<typeof withNoBreakSpaces>) => withNoBreakSpaces(...args).replace(/\u00a0/g, ' ');

describe('label dates', () => {
  it('add the shelf life to the production date across months, years and 29 February', () => {
    expect(labelDate('2026-12-02', 21)).toBe('2026-12-23');
    expect(labelDate('2026-12-30', 3)).toBe('2027-01-02');
    expect(labelDate('2028-02-27', 2)).toBe('2028-02-29');
    expect(labelDate('2027-02-27', 2)).toBe('2027-03-01');
  });

  it("write the date in each regime's usual form", () => {
    // Regulation (EU) No 1169/2011 Annex X: "Best before …" / "Use by …" with day, month and year.
    expect(formatLabelDate('2026-12-12', 'best-before', 'EU')).toBe('Best before 12.12.2026');
    expect(formatLabelDate('2026-03-05', 'use-by', 'UK')).toBe('Use by 05.03.2026');
    // Common practice in the US.
    expect(formatLabelDate('2026-12-12', 'best-before', 'US')).toBe('BEST BY DEC 12 2026');
    // Food and Drug Regulations B.01.007 (from memory): year, bilingual month code, day.
    expect(formatLabelDate('2026-12-12', 'best-before', 'CA')).toBe('BEST BEFORE / MEILLEUR AVANT 26 DE 12');
    expect(formatLabelDate('2026-04-09', 'best-before', 'CA')).toBe('BEST BEFORE / MEILLEUR AVANT 26 AL 09');
    // Food Standards Code Standard 1.2.5.
    expect(formatLabelDate('2026-12-02', 'use-by', 'ANZ')).toBe('Use by 2 Dec 2026');
  });

  it('keep the date itself on one line', () => {
    expect(withNoBreakSpaces('2026-12-12', 'best-before', 'CA')).toBe('BEST BEFORE / MEILLEUR AVANT 26\u00a0DE\u00a012');
  });

  it('write the print time in UTC', () => {
    expect(formatPrintedAt('2026-12-02T05:07:00.000Z')).toBe('2 December 2026, 05:07 UTC');
  });
});
