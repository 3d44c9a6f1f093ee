import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { bookSchema, type Book } from '@crumbproof/shared';
import { LABEL_FONT, checkTemplate, renderLabelDocument, type LabelInput } from '@crumbproof/shared/labels';
import type { TDocumentDefinitions } from 'pdfmake/interfaces';
import { labelFonts, renderPdf } from '../labels/pdf-node';
import { declareProduct } from '../rules/core';
import type { ReferenceData } from '../rules/core/reference-schema';

/** Case labels into one PDF on the server, against a text-only pdfmake document of as many pages. */
export interface LabelFigures {
  labels: number;
  ms: number;
  textOnlyMs: number;
  ratio: number;
  bytes: number;
}

const ROOT = join(__dirname, '..', '..', '..');

/**
 * The demo kitchen's brownie on the case template (GS1-128 with its GTIN, dates and batch), as the
 * print route renders it: the shared renderer, then pdfmake with the embedded fonts.
 */
export async function measureLabels(refs: ReferenceData, count = 500): Promise<LabelFigures> {
  const book: Book = bookSchema.parse(JSON.parse(readFileSync(join(ROOT, 'api', 'src', 'database', 'seeders', 'demo-book.json'), 'utf8')));
  const parsed = checkTemplate(
    JSON.parse(readFileSync(join(ROOT, 'label-templates', 'case.json'), 'utf8')),
    'label-templates/case.json',
    labelFonts(),
  );
  if (!parsed.ok) throw new Error(`The case template does not load: ${parsed.problems.map((p) => p.message).join('; ')}`);
  const product = 'vegan-brownie';
  const sale = book.recipes.find((r) => r.id === product)!.sale!;
  const regime = book.site.regime;
  const label: LabelInput = {
    declaration: declareProduct(book, product, refs, { regime }),
    details: sale,
    batch: '261202-BENCH-1',
    productionDate: '2026-12-02',
    quantity: count,
  };
  const started = performance.now();
  const result = renderLabelDocument({
    template: parsed.template,
    labels: [label],
    business: { name: book.site.name, address: book.site.address ?? '' },
    regime,
    fonts: labelFonts(),
    printedAt: new Date().toISOString(),
    allergenGroups: refs.regimes[regime].groups.map((g) => ({ code: g.code, label: g.label })),
  });
  if (!result.ok) throw new Error(`The case labels do not render: ${result.problems.map((p) => p.message).join('; ')}`);
  const pdf = await renderPdf(result.doc);
  const ms = performance.now() - started;

  // The same page count and page size, one line of text each: what pdfmake itself costs.
  const text: TDocumentDefinitions = {
    pageSize: result.doc.pageSize,
    defaultStyle: { font: LABEL_FONT },
    content: Array.from({ length: result.labels }, (_, n) => ({
      text: `Case ${n + 1}`,
      ...(n > 0 ? { pageBreak: 'before' as const } : {}),
    })),
  };
  const textStarted = performance.now();
  await renderPdf(text);
  const textOnlyMs = performance.now() - textStarted;
  return { labels: result.labels, ms, textOnlyMs, ratio: ms / textOnlyMs, bytes: pdf.length };
}
