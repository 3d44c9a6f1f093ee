import { compare } from '../round';
import { minimumSizePt, type LabelFonts } from './fonts';

/**
 * Legibility of mandatory particulars, Regulation (EU) No 1169/2011: Article 13(2) with Annex IV
 * asks for an x-height of at least 1.2 mm; Article 13(3) allows 0.9 mm on packaging whose largest
 * surface is less than 80 cm². The x-height is read from the font file (fonts.ts), so a change
 * of font changes the smallest size.
 */
export const X_HEIGHT_MM = 1.2;
export const SMALL_PACK_X_HEIGHT_MM = 0.9;
export const SMALL_PACK_CM2 = 80;

/** The x-height the mandatory text of a pack must reach, in millimetres. */
export function requiredXHeightMm(largestSurfaceCm2: number): number {
  return largestSurfaceCm2 < SMALL_PACK_CM2 ? SMALL_PACK_X_HEIGHT_MM : X_HEIGHT_MM;
}

/** Which rule sets the limit, for messages. */
export function legibilityRule(largestSurfaceCm2: number): string {
  return largestSurfaceCm2 < SMALL_PACK_CM2
    ? 'Regulation (EU) No 1169/2011 Article 13(3), largest surface under 80 cm²'
    : 'Regulation (EU) No 1169/2011 Article 13(2) and Annex IV';
}

/**
 * The smallest size, in points, at which both faces reach the required x-height: text that mixes
 * regular and bold (an ingredient list) must be legible in each.
 */
export function minimumLegibleSizePt(fonts: LabelFonts, largestSurfaceCm2: number): number {
  const xMm = requiredXHeightMm(largestSurfaceCm2);
  return Math.max(minimumSizePt(fonts.regular, xMm), minimumSizePt(fonts.bold, xMm));
}

/** A size as a message shows it, rounded up to a hundredth of a point so that it is never below the limit. */
export const shownPt = (pt: number): string => `${(Math.ceil(pt * 100 - 1e-6) / 100).toFixed(2)} pt`;

/**
 * True when text set at `sizePt` meets the limit, compared at the threshold precision (a size
 * worked out to exactly the limit comes out of floating point a hair either side of it).
 */
export function isLegible(sizePt: number, fonts: LabelFonts, largestSurfaceCm2: number): boolean {
  return compare(sizePt, 'gte', minimumLegibleSizePt(fonts, largestSurfaceCm2));
}
