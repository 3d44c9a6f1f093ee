import { create, type Font } from 'fontkit';

/** Points in a millimetre: a point is 1/72 inch, an inch 25.4 mm. */
export const PT_PER_MM = 72 / 25.4;
export const mmToPt = (mm: number): number => mm * PT_PER_MM;
export const ptToMm = (pt: number): number => pt / PT_PER_MM;

/**
 * What the label layout needs of one font face, read from the font file itself with fontkit:
 * the x-height (the height of a lower-case x, which Regulation (EU) No 1169/2011 Annex IV
 * measures legibility by), the vertical metrics pdfmake sets lines with, and advance widths.
 */
export interface FontMetrics {
  /** The face's own name, e.g. "AtkinsonHyperlegible-Bold". */
  postscriptName: string;
  unitsPerEm: number;
  /** The x-height in font units, from the OS/2 table (sxHeight), else the bounding box of the glyph 'x'. */
  xHeight: number;
  ascent: number;
  /** Below the baseline, negative. */
  descent: number;
  /** The width of a text set at a size, in points (with the font's kerning, as pdfmake sets it). */
  width(text: string, sizePt: number): number;
  /** The height of one line at a size, in points: ascent to descent, as pdfmake sets a line. */
  lineHeight(sizePt: number): number;
  /** The x-height at a size, in millimetres. */
  xHeightMm(sizePt: number): number;
}

/** The metrics of a TrueType or OpenType font file; throws with a message when the bytes are not one font. */
export function fontMetrics(bytes: Uint8Array): FontMetrics {
  const opened = create(bytes as unknown as Parameters<typeof create>[0]);
  if (!('unitsPerEm' in opened)) throw new Error('The font file holds a collection of fonts; give one font file.');
  const font: Font = opened;
  const os2 = font['OS/2'] as { version?: number; xHeight?: number } | undefined;
  const fromTable = os2 && (os2.version ?? 0) >= 2 && (os2.xHeight ?? 0) > 0 ? os2.xHeight! : 0;
  const xHeight = fromTable > 0 ? fromTable : font.glyphForCodePoint(0x78).bbox.maxY;
  if (!(xHeight > 0)) throw new Error(`The font ${font.postscriptName} gives no x-height; its legibility cannot be checked.`);
  const { unitsPerEm, ascent, descent } = font;
  const widths = new Map<string, number>();
  const unitsWide = (text: string): number => {
    let w = widths.get(text);
    if (w === undefined) {
      w = font.layout(text).advanceWidth;
      if (widths.size > 5000) widths.clear();
      widths.set(text, w);
    }
    return w;
  };
  return {
    postscriptName: font.postscriptName,
    unitsPerEm,
    xHeight,
    ascent,
    descent,
    width: (text, sizePt) => (unitsWide(text) / unitsPerEm) * sizePt,
    lineHeight: (sizePt) => ((ascent - descent) / unitsPerEm) * sizePt,
    xHeightMm: (sizePt) => ptToMm((xHeight / unitsPerEm) * sizePt),
  };
}

/** The smallest font size, in points, whose x-height reaches `xHeightMm`. */
export function minimumSizePt(metrics: Pick<FontMetrics, 'xHeight' | 'unitsPerEm'>, xHeightMm: number): number {
  return mmToPt(xHeightMm) / (metrics.xHeight / metrics.unitsPerEm);
}

/** The two faces a label is set in: regular, and bold for allergens and names. */
export interface LabelFonts {
  regular: FontMetrics;
  bold: FontMetrics;
}

/** The family name the renderer's documents use; the caller registers the font files under it. */
export const LABEL_FONT = 'Atkinson';
