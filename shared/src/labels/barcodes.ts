import { toSVG } from 'bwip-js';
import { elementString, isPredefinedLength, type Gs1Element } from '../gs1';
import { PT_PER_MM } from './fonts';

/**
 * Barcodes as SVG from bwip-js (vector, the same in Node and the browser), sized in points for
 * pdfmake. bwip-js draws one module as one unit of the SVG's viewBox, so the symbol is scaled
 * by the module width (X-dimension).
 */
export interface BarcodeSymbol {
  svg: string;
  widthPt: number;
  heightPt: number;
  /** The human-readable line the renderer sets under a GS1-128 symbol (EAN/UPC carry their own digits). */
  hri?: string;
}

function viewBox(svg: string): { width: number; height: number } {
  const m = /viewBox="0 0 ([\d.]+) ([\d.]+)"/.exec(svg);
  if (!m) throw new Error('bwip-js gave an SVG without a viewBox.');
  return { width: Number(m[1]), height: Number(m[2]) };
}

/** bwip-js's `height` (millimetres at one point per module) that gives bars of `barMm` with modules of `xMm`. */
const bwipHeight = (barMm: number, xMm: number): number => barMm / (xMm * PT_PER_MM);

function symbol(options: Parameters<typeof toSVG>[0], xMm: number): BarcodeSymbol {
  const svg = toSVG(options);
  const box = viewBox(svg);
  const unitPt = xMm * PT_PER_MM;
  return { svg, widthPt: box.width * unitPt, heightPt: box.height * unitPt };
}

/** EAN/UPC nominal module width and bar height at 100 % (GS1 General Specifications, from memory). */
export const EAN_X_MM = 0.33;
export const EAN_BAR_MM = 22.85;

/**
 * The EAN-13, UPC-A or EAN-8 symbol of a unit's GTIN (check digit already verified): a GTIN-12,
 * or a GTIN-13 starting with 0, is a UPC-A; a GTIN-8 an EAN-8. With its digits under it and the
 * quiet zones (the '>' mark of the right one) included.
 */
export function eanUpcSymbol(gtin: string, magnification: number): BarcodeSymbol {
  const xMm = EAN_X_MM * magnification;
  const height = bwipHeight(EAN_BAR_MM * magnification, xMm);
  const twelve = gtin.length === 12 ? gtin : gtin.length === 13 && gtin.startsWith('0') ? gtin.slice(1) : null;
  const [bcid, text] = twelve ? ['upca', twelve] : gtin.length === 8 ? ['ean8', gtin] : ['ean13', gtin];
  return symbol({ bcid, text, scale: 1, height, includetext: true, guardwhitespace: true }, xMm);
}

/** Quiet zone on each side of a GS1-128 symbol, in modules (GS1 General Specifications, from memory). */
export const GS1_128_QUIET_ZONE = 10;

/**
 * One GS1-128 symbol of elements of a checked element string, in the order given: encoded as
 * Code 128 with FNC1 first and FNC1 as the separator after a variable-length element that is not
 * the symbol's last (GS1 General Specifications, from memory). bwip-js's own GS1 parser would read
 * parentheses in a batch (which character set 82 allows) as AIs, so the checked data goes in as
 * Code 128 with FNC1 characters.
 */
function gs1128(elements: Gs1Element[], xMm: number, barMm: number): BarcodeSymbol {
  const text = `^FNC1${elements
    .map((e, i) => `${e.ai}${e.value}${!isPredefinedLength(e.ai) && i < elements.length - 1 ? '^FNC1' : ''}`)
    .join('')}`;
  const s = symbol(
    {
      bcid: 'code128',
      text,
      parsefnc: true,
      scale: 1,
      height: bwipHeight(barMm, xMm),
      paddingleft: GS1_128_QUIET_ZONE,
      paddingright: GS1_128_QUIET_ZONE,
    },
    xMm,
  );
  return { ...s, hri: elements.map((e) => `(${e.ai})${e.value}`).join('') };
}

/**
 * The element string over as few GS1-128 symbols as fit `maxWidthMm` (quiet zones included),
 * predefined-length elements first; the pairing rules are checked on the whole string, since
 * they hold for the label's symbols together. Null when one element alone does not fit.
 */
export function gs1128Symbols(elements: Gs1Element[], xMm: number, barMm: number, maxWidthMm: number): BarcodeSymbol[] | null {
  const checked = elementString(elements);
  if (!checked.ok) throw new Error(checked.problems.join(' '));
  const maxPt = maxWidthMm * PT_PER_MM;
  const symbols: BarcodeSymbol[] = [];
  let group: Gs1Element[] = [];
  let last: BarcodeSymbol | null = null;
  for (const element of checked.elements) {
    const candidate = gs1128([...group, element], xMm, barMm);
    if (candidate.widthPt <= maxPt) {
      group.push(element);
      last = candidate;
      continue;
    }
    if (!last) return null;
    symbols.push(last);
    group = [element];
    last = gs1128(group, xMm, barMm);
    if (last.widthPt > maxPt) return null;
  }
  if (last) symbols.push(last);
  return symbols;
}

/** Quiet zone around a QR code, in modules (ISO/IEC 18004, from memory). */
export const QR_QUIET_ZONE = 4;
/** The smallest QR module a phone camera reads from a counter ticket at arm's length (common practice). */
export const QR_MIN_MODULE_MM = 0.3;

export interface QrSymbol extends BarcodeSymbol {
  /** The size of one module as printed. */
  moduleMm: number;
}

/**
 * The QR code of a text (error correction level M) drawn `sizeMm` square, its quiet zone
 * included. bwip-js draws a QR module as 2 units of the SVG's viewBox.
 */
export function qrSymbol(text: string, sizeMm: number): QrSymbol {
  const quiet = QR_QUIET_ZONE * 2;
  // eclevel is an option of BWIPP's qrcode encoder, which bwip-js passes on but does not type.
  const options = { bcid: 'qrcode', text, eclevel: 'M', scale: 1, paddingwidth: quiet, paddingheight: quiet };
  const svg = toSVG(options);
  const box = viewBox(svg);
  const sizePt = sizeMm * PT_PER_MM;
  return { svg, widthPt: sizePt, heightPt: sizePt, moduleMm: sizeMm / (box.width / 2) };
}
