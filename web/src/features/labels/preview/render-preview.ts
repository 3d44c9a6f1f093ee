/**
 * The preview in the browser: the shared renderer and pdfmake's browser build, with the same
 * Atkinson Hyperlegible files the API embeds. This module is only ever loaded with import(), so
 * neither the renderer (bwip-js, fontkit) nor pdfmake is in the app's first bundle.
 */
import {
  fontMetrics,
  LABEL_FONT,
  renderLabelDocument,
  type LabelFonts,
  type RenderInput,
  type RenderProblem,
} from '@crumbproof/shared/labels';
import pdfMake from 'pdfmake/build/pdfmake';
import boldUrl from '@expo-google-fonts/atkinson-hyperlegible/700Bold/AtkinsonHyperlegible_700Bold.ttf?url';
import regularUrl from '@expo-google-fonts/atkinson-hyperlegible/400Regular/AtkinsonHyperlegible_400Regular.ttf?url';

export type PreviewInput = Omit<RenderInput, 'fonts'>;
export type PreviewResult = { ok: true; pdf: Blob; labels: number } | { ok: false; problems: RenderProblem[] };

const REGULAR_FILE = 'AtkinsonHyperlegible-Regular.ttf';
const BOLD_FILE = 'AtkinsonHyperlegible-Bold.ttf';

async function fontBytes(url: string): Promise<Uint8Array> {
  const response = await fetch(url);
  if (!response.ok) throw new Error(`The label font could not be loaded (status ${response.status}). Reload the page and try again.`);
  return new Uint8Array(await response.arrayBuffer());
}

function base64(bytes: Uint8Array): string {
  let binary = '';
  for (let i = 0; i < bytes.length; i += 0x8000) binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(binary);
}

let fontsReady: Promise<LabelFonts> | null = null;

/** Reads both faces once: their metrics for the renderer, their bytes for pdfmake. */
function loadFonts(): Promise<LabelFonts> {
  fontsReady ??= Promise.all([fontBytes(regularUrl), fontBytes(boldUrl)])
    .then(([regular, bold]) => {
      pdfMake.addVirtualFileSystem({ [REGULAR_FILE]: base64(regular), [BOLD_FILE]: base64(bold) });
      pdfMake.addFonts({ [LABEL_FONT]: { normal: REGULAR_FILE, bold: BOLD_FILE, italics: REGULAR_FILE, bolditalics: BOLD_FILE } });
      // Labels carry no images or fonts from elsewhere: nothing is fetched while the PDF is made.
      pdfMake.setUrlAccessPolicy(() => false);
      return { regular: fontMetrics(regular), bold: fontMetrics(bold) };
    })
    .catch((error: unknown) => {
      fontsReady = null;
      throw error;
    });
  return fontsReady;
}

/** The run as it will print, as a PDF, or the renderer's refusals. */
export async function renderPreview(input: PreviewInput): Promise<PreviewResult> {
  const fonts = await loadFonts();
  const rendered = renderLabelDocument({ ...input, fonts });
  if (!rendered.ok) return rendered;
  const pdf = await pdfMake.createPdf(rendered.doc).getBlob();
  return { ok: true, pdf, labels: rendered.labels };
}
