import { readFileSync } from 'node:fs';
import { dirname, join, resolve, sep } from 'node:path';
import pdfmake from 'pdfmake';
import type { TDocumentDefinitions } from 'pdfmake/interfaces';
import { LABEL_FONT, fontMetrics, type LabelFonts } from '@crumbproof/shared/labels';

/**
 * Label PDFs in Node: pdfmake's server build with Atkinson Hyperlegible (regular and bold, from
 * @expo-google-fonts/atkinson-hyperlegible, SIL Open Font License) embedded in every PDF. No URL
 * is ever fetched, and the only files read are the font files.
 */
export const FONT_DIR = dirname(require.resolve('@expo-google-fonts/atkinson-hyperlegible/package.json'));
export const FONT_FILES = {
  regular: join(FONT_DIR, '400Regular', 'AtkinsonHyperlegible_400Regular.ttf'),
  bold: join(FONT_DIR, '700Bold', 'AtkinsonHyperlegible_700Bold.ttf'),
} as const;

let configured = false;
function configure(): void {
  if (configured) return;
  pdfmake.setFonts({
    [LABEL_FONT]: { normal: FONT_FILES.regular, bold: FONT_FILES.bold, italics: FONT_FILES.regular, bolditalics: FONT_FILES.bold },
  });
  pdfmake.setUrlAccessPolicy(() => false);
  pdfmake.setLocalAccessPolicy((path) => resolve(path).startsWith(FONT_DIR + sep));
  configured = true;
}

let fonts: LabelFonts | undefined;
/** The metrics of the embedded faces, read once from the same files the PDFs embed. */
export function labelFonts(): LabelFonts {
  fonts ??= {
    regular: fontMetrics(new Uint8Array(readFileSync(FONT_FILES.regular))),
    bold: fontMetrics(new Uint8Array(readFileSync(FONT_FILES.bold))),
  };
  return fonts;
}

/** The PDF of a document made by the shared renderer. */
export async function renderPdf(doc: TDocumentDefinitions): Promise<Buffer> {
  configure();
  return pdfmake.createPdf(doc).getBuffer();
}
