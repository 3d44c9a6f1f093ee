/** The parts of gs1-barcode-parser-mod (it ships no types) that the label tests use. */
declare module 'gs1-barcode-parser-mod' {
  export interface ParsedElement {
    ai: string;
    dataTitle: string;
    data: unknown;
    unit: string;
    /** The element's value as it stood in the data. */
    raw?: string;
  }
  export function parseBarcode(barcode: string): { codeName: string; parsedCodeItems: ParsedElement[] };
}
