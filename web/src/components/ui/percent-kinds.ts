/**
 * Two kinds of percentage of an ingredient are shown, each with one precision:
 * QUID is of the finished product after baking and is shown exactly as the label prints it
 * (whole percent, one decimal below 1 %: the engine's rounding); a share of the mix is of the
 * raw mix before baking, to 2 decimals, and is never printed.
 */
export const QUID_KIND = 'QUID (as printed): percent of the finished product after baking, in whole percent (one decimal below 1%).';
export const MIX_SHARE_KIND = 'Share of the mix: percent of the raw mix before baking, to 2 decimals; not printed.';

/** A share of the mix, to 2 decimals; null is an ingredient the product does not use. */
export function formatMixShare(value: number | null): string {
  if (value === null) return 'not used';
  return `${value.toLocaleString('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 })}% of the mix`;
}
