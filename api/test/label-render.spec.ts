import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import {
  BarcodeFormat,
  BinaryBitmap,
  DecodeHintType,
  HybridBinarizer,
  MultiFormatReader,
  QRCodeReader,
  RGBLuminanceSource,
  type Result,
} from '@zxing/library';
import { parseBarcode } from 'gs1-barcode-parser-mod';
import { PNG } from 'pngjs';
import { bookSchema, sscc as ssccOf, type Book, type Declaration } from '@crumbproof/shared';
import {
  checkTemplate,
  minimumLegibleSizePt,
  parseTemplate,
  renderLabelDocument,
  templateJsonSchemaText,
  type LabelInput,
  type LabelPrintDetails,
  type LabelTemplate,
  type RenderInput,
} from '@crumbproof/shared/labels';
import { FONT_FILES, labelFonts, renderPdf } from '../src/labels/pdf-node';
import { declareProduct } from '../src/rules/core';
import { loadReferenceData } from '../src/rules/reference-data';

const ROOT = join(__dirname, '..', '..');
const TEMPLATES = join(ROOT, 'label-templates');
const work = mkdtempSync(join(tmpdir(), 'labels-'));
const refs = loadReferenceData();
const fonts = labelFonts();

/** The demo kitchen's book; its print details are set here, so the tests do not depend on the demo's. */
const demo: Book = bookSchema.parse(JSON.parse(readFileSync(join(ROOT, 'api/src/database/seeders/demo-book.json'), 'utf8')));

function template(id: string): LabelTemplate {
  const parsed = parseTemplate(JSON.parse(readFileSync(join(TEMPLATES, `${id}.json`), 'utf8')), `label-templates/${id}.json`);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.problems));
  return parsed.template;
}

const SHORTBREAD: LabelPrintDetails = {
  claims: ['vegetarian'],
  shelfLifeDays: 21,
  dateMark: 'best-before',
  gtin: '9521234000020',
  caseGtin: '19521234000027',
  unitsPerCase: 24,
  netWeightG: 160,
  storage: 'Store in a cool, dry place.',
};

function label(product: string, details: LabelPrintDetails = SHORTBREAD, over: Partial<LabelInput> = {}): LabelInput {
  return {
    declaration: declareProduct(demo, product, refs, {}),
    details,
    batch: '261202-LEMONS-1',
    productionDate: '2026-12-02',
    quantity: 1,
    ...over,
  };
}

function run(templateId: string | LabelTemplate, labels: LabelInput[], over: Partial<RenderInput> = {}): RenderInput {
  return {
    template: typeof templateId === 'string' ? template(templateId) : templateId,
    labels,
    business: { name: 'Wrenfield Lane Bakehouse', address: '4 Wrenfield Lane, Bristol BS1 4AA' },
    regime: demo.site.regime,
    fonts,
    printedAt: '2026-12-02T05:00:00.000Z',
    ...over,
  };
}

async function pdfOf(input: RenderInput): Promise<string> {
  const result = renderLabelDocument(input);
  if (!result.ok) throw new Error(JSON.stringify(result.problems));
  const file = join(work, `${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, await renderPdf(result.doc));
  return file;
}

/** The first page at `dpi`, optionally a box of it in millimetres from the top left, as pixels. */
function pageImage(pdf: string, dpi: number, box?: { xMm: number; yMm: number; wMm: number; hMm: number }): PNG {
  const px = (mm: number) => String(Math.round((mm / 25.4) * dpi));
  const out = join(work, `${Math.random().toString(36).slice(2)}`);
  const crop = box ? ['-x', px(box.xMm), '-y', px(box.yMm), '-W', px(box.wMm), '-H', px(box.hMm)] : [];
  execFileSync('pdftoppm', ['-r', String(dpi), '-png', '-f', '1', '-l', '1', '-singlefile', ...crop, pdf, out]);
  return PNG.sync.read(readFileSync(`${out}.png`));
}

/** Decodes the symbol crossing rows top…top+rows of an image, with zxing, reading FNC1 as GS1; null when none does. */
function decodeRows(png: PNG, top: number, rows: number): Result | null {
  // White rows above and below, as a scanner sees the symbol on its label.
  const height = rows + 20;
  const luminance = new Uint8ClampedArray(png.width * height).fill(255);
  for (let y = 0; y < rows; y++)
    for (let x = 0; x < png.width; x++) {
      const i = ((top + y) * png.width + x) * 4;
      luminance[(y + 10) * png.width + x] = Math.round((png.data[i] + png.data[i + 1] + png.data[i + 2]) / 3);
    }
  const reader = new MultiFormatReader();
  reader.setHints(
    new Map<DecodeHintType, unknown>([
      [DecodeHintType.POSSIBLE_FORMATS, [BarcodeFormat.EAN_13, BarcodeFormat.UPC_A, BarcodeFormat.EAN_8, BarcodeFormat.CODE_128]],
      [DecodeHintType.ASSUME_GS1, true],
    ]),
  );
  try {
    return reader.decodeWithState(new BinaryBitmap(new HybridBinarizer(new RGBLuminanceSource(luminance, png.width, height))));
  } catch {
    return null;
  }
}

/**
 * Every symbol of an image, decoded, top to bottom: a strip of rows every 1.5 mm is read as a
 * scanner's line would read it, and each symbol found is counted once.
 */
function decodeAll(png: PNG, dpi: number): Result[] {
  const step = Math.round((1.5 / 25.4) * dpi);
  const found = new Map<string, Result>();
  for (let top = 0; top + 8 <= png.height; top += step) {
    const result = decodeRows(png, top, 8);
    if (result && !found.has(result.getText())) found.set(result.getText(), result);
  }
  return [...found.values()];
}

/** The GS1 elements of decoded GS1-128 symbols, read by an independent parser. */
function gs1Elements(results: Result[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const r of results) {
    expect(r.getBarcodeFormat()).toBe(BarcodeFormat.CODE_128);
    expect(r.getText().startsWith(']C1')).toBe(true);
    for (const item of parseBarcode(r.getText()).parsedCodeItems) out[item.ai] = item.raw ?? String(item.data);
  }
  return out;
}

/** The text of page 1 in runs, each with the name of its embedded font (pdfjs-dist, in a child process: it is an ES module). */
function textRuns(pdf: string): Array<{ str: string; font: string }> {
  const pdfjs = join(dirname(require.resolve('pdfjs-dist/package.json')), 'legacy', 'build', 'pdf.mjs');
  const script = `
    const { getDocument } = await import(${JSON.stringify(pdfjs)});
    const data = new Uint8Array((await import('node:fs')).readFileSync(${JSON.stringify(pdf)}));
    const page = await (await getDocument({ data, verbosity: 0 }).promise).getPage(1);
    const text = await page.getTextContent();
    await page.getOperatorList();
    const runs = text.items.filter((i) => 'str' in i && i.str !== '').map((i) => ({ str: i.str, font: page.commonObjs.get(i.fontName).name }));
    process.stdout.write(JSON.stringify(runs));`;
  return JSON.parse(execFileSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8' })) as Array<{
    str: string;
    font: string;
  }>;
}

describe('label templates', () => {
  it('label-templates/template.schema.json is the JSON Schema generated from the zod template schema (regenerate: tsx --conditions=source api/src/cli/write-label-template-schema.ts)', () => {
    expect(readFileSync(join(TEMPLATES, 'template.schema.json'), 'utf8')).toBe(templateJsonSchemaText());
  });

  it('ships product, ticket, case and chart, each valid', () => {
    const ids = readdirSync(TEMPLATES)
      .filter((f) => f.endsWith('.json') && f !== 'template.schema.json')
      .map((f) => template(f.replace(/\.json$/, '')).id)
      .sort();
    expect(ids).toEqual(['case', 'chart', 'product', 'ticket']);
  });

  it('refuses a bad template naming the file and the field', () => {
    const raw = JSON.parse(readFileSync(join(TEMPLATES, 'product.json'), 'utf8'));
    raw.blocks[1].sizePt = 'large';
    raw.layout.columns = 0;
    const parsed = parseTemplate(raw, 'label-templates/product.json');
    expect(parsed.ok).toBe(false);
    expect(!parsed.ok && parsed.problems.map((p) => `${p.file} ${p.field}`)).toEqual([
      'label-templates/product.json layout.columns',
      'label-templates/product.json blocks[1].sizePt',
    ]);
  });
});

describe('legibility (Regulation (EU) No 1169/2011 Article 13(2), 13(3) and Annex IV)', () => {
  it('refuses a template file that sets mandatory text below the limit, naming the file and the field', () => {
    const raw = JSON.parse(readFileSync(join(TEMPLATES, 'product.json'), 'utf8'));
    expect(checkTemplate(raw, 'label-templates/product.json', fonts).ok).toBe(true);
    raw.blocks[1].sizePt = 6.5;
    expect(checkTemplate(raw, 'label-templates/product.json', fonts)).toEqual({
      ok: false,
      problems: [
        {
          file: 'label-templates/product.json',
          field: 'blocks[1].sizePt',
          message:
            "Template 'product' sets blocks[1].sizePt at 6.5 pt, below the smallest legible size 6.86 pt (x-height 1.2 mm, Regulation (EU) No 1169/2011 Article 13(2) and Annex IV).",
        },
      ],
    });
  });

  it('reads the x-height from the embedded font files', () => {
    // Atkinson Hyperlegible's OS/2 sxHeight is 496 of 1000 units in both faces (read with fontkit from the files).
    expect(fonts.regular.xHeight / fonts.regular.unitsPerEm).toBeCloseTo(0.496, 3);
    expect(fonts.bold.xHeight / fonts.bold.unitsPerEm).toBeCloseTo(0.496, 3);
    expect(fonts.regular.postscriptName).toBe('AtkinsonHyperlegible-Regular');
    expect(readFileSync(FONT_FILES.bold).length).toBeGreaterThan(10_000);
    // 1.2 mm / 0.496 = 2.419 mm of em = 6.86 pt; 0.9 mm gives 5.14 pt.
    expect(minimumLegibleSizePt(fonts, 150)).toBeCloseTo(6.86, 2);
    expect(minimumLegibleSizePt(fonts, 79.9)).toBeCloseTo(5.14, 2);
  });

  const sized = (sizePt: number, largestSurfaceCm2: number): LabelTemplate => {
    const t = template('ticket');
    const resized = <B extends { type: string }>(b: B): B => (b.type === 'caution' ? { ...b, sizePt } : b);
    // The ticket's caution sits in a row beside its QR code.
    const blocks = t.blocks.map((b) =>
      b.type === 'row' ? { ...b, columns: b.columns.map((c) => ({ ...c, blocks: c.blocks.map(resized) })) } : resized(b),
    );
    return { ...t, largestSurfaceCm2, blocks };
  };
  const illegible = (t: LabelTemplate) => {
    const result = renderLabelDocument(run(t, [label('lemon-shortbread')]));
    return result.ok ? [] : result.problems.filter((p) => p.code === 'template-illegible').map((p) => p.message);
  };

  it('prints text whose x-height is just at 1.2 mm and refuses text just under it', () => {
    const min = minimumLegibleSizePt(fonts, 150);
    expect(illegible(sized(min + 0.01, 150))).toEqual([]);
    expect(illegible(sized(min - 0.01, 150))).toEqual([
      `Template 'ticket' sets blocks[1].columns[0].blocks[3].sizePt at ${min - 0.01} pt, below the smallest legible size 6.86 pt (x-height 1.2 mm, Regulation (EU) No 1169/2011 Article 13(2) and Annex IV).`,
    ]);
  });

  it('allows 0.9 mm only when the largest surface is under 80 cm²', () => {
    const min = minimumLegibleSizePt(fonts, 79.9);
    expect(illegible(sized(min + 0.01, 79.9))).toEqual([]);
    expect(illegible(sized(min - 0.01, 79.9))).toEqual([
      expect.stringContaining('x-height 0.9 mm, Regulation (EU) No 1169/2011 Article 13(3)'),
    ]);
    expect(illegible(sized(min + 0.01, 80))).toEqual([expect.stringContaining('x-height 1.2 mm')]);
  });

  it('shrinks a long ingredient list only down to the limit, then says it does not fit', () => {
    const d = declareProduct(demo, 'lemon-shortbread', refs, {});
    const segments = (times: number): Declaration => ({
      ...d,
      ingredientsSegments: [
        ...d.ingredientsSegments,
        ...Array.from({ length: times }, () => [
          { text: ' Candied orange peel, ', emphasis: false },
          { text: 'hazelnut', emphasis: true },
        ]).flat(),
      ],
    });
    // The size the ingredient list is set at: the font size of its first line.
    const listSize = (result: ReturnType<typeof renderLabelDocument>): number => {
      if (!result.ok) throw new Error(JSON.stringify(result.problems));
      const m = /"text":\[\{"text":"Ingredients:[^\]]*\],"noWrap":true,"fontSize":([\d.]+)/.exec(JSON.stringify(result.doc));
      if (!m) throw new Error('No ingredient list in the document.');
      return Number(m[1]);
    };
    const min = minimumLegibleSizePt(fonts, 150);
    expect(listSize(renderLabelDocument(run('product', [label('lemon-shortbread')])))).toBe(8);
    // One more line of ingredients at a time: the list shrinks, never below the limit, until it is refused.
    const sizes: number[] = [];
    for (let times = 1; times <= 30; times++) {
      const result = renderLabelDocument(run('product', [{ ...label('lemon-shortbread'), declaration: segments(times) }]));
      if (!result.ok) {
        expect(result.problems.map((p) => p.code)).toEqual(['does-not-fit']);
        break;
      }
      sizes.push(listSize(result));
    }
    expect(sizes.some((size) => size < 8)).toBe(true);
    expect(sizes.length).toBeLessThan(30);
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(min);
    expect([...sizes].sort((a, b) => b - a)).toEqual(sizes);

    const tooLong = renderLabelDocument(run('product', [{ ...label('lemon-shortbread'), declaration: segments(60) }]));
    expect(tooLong).toEqual({
      ok: false,
      problems: [
        {
          code: 'does-not-fit',
          product: 'lemon-shortbread',
          message: `The ingredient list of Chocolate-dipped lemon shortbread does not fit on the product label at the smallest legible size (x-height 1.2 mm, 6.86 pt): use a larger label template.`,
        },
      ],
    });
  });
});

describe('refused prints', () => {
  it('refuses a declaration with an error, naming it', () => {
    const book: Book = structuredClone(demo);
    const recipe = book.recipes.find((r) => r.id === 'lemon-shortbread')!;
    recipe.sale = { ...recipe.sale!, claims: ['vegan'] };
    const result = renderLabelDocument(
      run('product', [{ ...label('lemon-shortbread'), declaration: declareProduct(book, 'lemon-shortbread', refs, {}) }]),
    );
    expect(result.ok).toBe(false);
    expect(!result.ok && result.problems[0]).toEqual({
      code: 'declaration-error',
      product: 'lemon-shortbread',
      message: expect.stringMatching(/^Chocolate-dipped lemon shortbread: .*vegan.* Labels are not printed until it is fixed\.$/),
    });
  });

  it('refuses a product whose sulphites or allergens are not known', () => {
    const result = renderLabelDocument(run('ticket', [label('strawberry-layer-cake')]));
    expect(!result.ok && result.problems.map((p) => p.code)).toEqual(['sulphites-not-known', 'allergens-not-known']);
  });

  it('refuses a case label without a case GTIN or units per case, and a dated label without a shelf life', () => {
    const { caseGtin: _c, unitsPerCase: _u, ...noCase } = SHORTBREAD;
    const result = renderLabelDocument(run('case', [label('lemon-shortbread', noCase)]));
    expect(!result.ok && result.problems.map((p) => p.message)).toEqual([
      "Chocolate-dipped lemon shortbread has no units per case: the case label needs it. Add it to the product's sale details.",
      "Chocolate-dipped lemon shortbread has no case GTIN-14: the case label needs it. Add it to the product's sale details.",
    ]);
    const { shelfLifeDays: _s, dateMark: _d, ...undated } = SHORTBREAD;
    const product = renderLabelDocument(run('product', [label('lemon-shortbread', undated)]));
    expect(!product.ok && product.problems.map((p) => p.code)).toEqual(['missing-detail']);
  });

  it('leaves the EAN/UPC out of a product label when the product has no GTIN', async () => {
    const { gtin: _g, ...noGtin } = SHORTBREAD;
    const pdf = await pdfOf(run('product', [label('lemon-shortbread', noGtin)]));
    expect(decodeAll(pageImage(pdf, 300, { xMm: 4.65, yMm: 13.1, wMm: 99.1, hMm: 67.7 }), 300)).toEqual([]);
  });
});

describe('barcodes decoded from the rendered PDF', () => {
  // The first label of an A4 sheet of the product template.
  const firstProductLabel = { xMm: 4.65, yMm: 13.1, wMm: 99.1, hMm: 67.7 };

  it('a product label carries its GTIN-13 as an EAN-13', async () => {
    const pdf = await pdfOf(run('product', [label('lemon-shortbread')]));
    const [result, ...others] = decodeAll(pageImage(pdf, 600, firstProductLabel), 600);
    expect(others).toEqual([]);
    expect(result.getBarcodeFormat()).toBe(BarcodeFormat.EAN_13);
    expect(result.getText()).toBe('9521234000020');
  });

  it('a GTIN-12 prints as a UPC-A', async () => {
    const pdf = await pdfOf(run('product', [label('lemon-shortbread', { ...SHORTBREAD, gtin: '036000291452' })]));
    const [result] = decodeAll(pageImage(pdf, 600, firstProductLabel), 600);
    expect(result.getBarcodeFormat()).toBe(BarcodeFormat.UPC_A);
    expect(result.getText()).toBe('036000291452');
  });

  it('a trade-item case label carries (01) the case GTIN-14, (15), (10) and (3105) in GS1-128', async () => {
    const pdf = await pdfOf(run('case', [label('lemon-shortbread', SHORTBREAD, { batch: 'L(7)/26-A' })]));
    const results = decodeAll(pageImage(pdf, 400), 400);
    expect(results.length).toBeGreaterThanOrEqual(1);
    expect(gs1Elements(results)).toEqual({
      '01': '19521234000027',
      '15': '261223',
      '10': 'L(7)/26-A',
      // 24 × 160 g = 3.84 kg, five decimals.
      '3105': '384000',
    });
  });

  it('a shipment case label carries (00) its SSCC, (02) the unit GTIN with (37) the count, the date and the batch', async () => {
    const sscc = [ssccOf(0, '9521234', 1), ssccOf(0, '9521234', 2)];
    const pdf = await pdfOf(run('case', [label('lemon-shortbread', { ...SHORTBREAD, dateMark: 'use-by' }, { quantity: 2, sscc })]));
    expect(gs1Elements(decodeAll(pageImage(pdf, 400), 400))).toEqual({
      '00': sscc[0],
      '02': '09521234000020',
      '37': '24',
      '17': '261223',
      '10': '261202-LEMONS-1',
    });
  });
});

describe('text of the rendered PDF', () => {
  it('holds the whole ingredient list, each allergen in the bold face and the rest in the regular', async () => {
    const pdf = await pdfOf(run('product', [label('strawberry-tart', { ...SHORTBREAD, gtin: undefined })]));
    const runs = textRuns(pdf);
    const d = declareProduct(demo, 'strawberry-tart', refs, {});
    const squash = (s: string) => s.replace(/\s+/g, '');
    // The list, as the declaration words it, is on the label in reading order.
    expect(squash(runs.map((r) => r.str).join(''))).toContain(squash(d.ingredientsText));
    const bold = runs.filter((r) => r.font.endsWith('AtkinsonHyperlegible-Bold')).map((r) => r.str.trim());
    const regular = runs.filter((r) => r.font.endsWith('AtkinsonHyperlegible-Regular')).map((r) => r.str);
    const emphasised = d.ingredientsSegments.filter((s) => s.emphasis).map((s) => s.text);
    expect(emphasised.length).toBeGreaterThan(2);
    for (const allergen of emphasised) expect(bold).toContain(allergen);
    // No word of the list outside the allergens is set in bold.
    const plainWords = d.ingredientsSegments.filter((s) => !s.emphasis).flatMap((s) => s.text.split(/[\s(),.:]+/).filter(Boolean));
    for (const word of ['Ingredients', 'Vanilla', 'Strawberries']) expect(plainWords).toContain(word);
    expect(bold.join(' ')).not.toMatch(/Ingredients|Strawberries|Vanilla pastry/);
    expect(regular.join(' ')).toMatch(/Ingredients: Vanilla pastry cream/);
  });
});

describe('what a pre-packed label must name', () => {
  it('prints each QUID percentage next to the name of the food (Regulation (EU) No 1169/2011 Article 22, Annex VIII point 2)', async () => {
    const d = declareProduct(demo, 'strawberry-tart', refs, {});
    expect(d.quid.map((q) => q.text)).toEqual([expect.stringMatching(/^Strawberries \d+%$/)]);
    const text = textRuns(await pdfOf(run('product', [label('strawberry-tart', { ...SHORTBREAD, gtin: undefined })])))
      .map((r) => r.str)
      .join('');
    expect(text.replace(/\s+/g, ' ')).toContain(`${d.name} (${d.quid[0].text})`);
  });

  it('refuses a product label when the kitchen has no address (Regulation (EU) No 1169/2011 Article 9(1)(h)), and prints a ticket', () => {
    const noAddress = { business: { name: 'Wrenfield Lane Bakehouse', address: ' ' } };
    const refused = renderLabelDocument(run('product', [label('lemon-shortbread')], noAddress));
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.problems.map((p) => p.message).join(' ')).toMatch(/no address.*Article 9\(1\)\(h\)/);
    const ticket = renderLabelDocument(run('ticket', [label('lemon-shortbread')], noAddress));
    expect(ticket.ok ? [] : ticket.problems).toEqual([]);
  });
});

/** The QR code of an image, decoded by zxing; null when it finds none. */
function decodeQr(png: PNG): string | null {
  const luminance = new Uint8ClampedArray(png.width * png.height);
  for (let i = 0; i < luminance.length; i++) luminance[i] = Math.round((png.data[i * 4] + png.data[i * 4 + 1] + png.data[i * 4 + 2]) / 3);
  try {
    return new QRCodeReader()
      .decode(new BinaryBitmap(new HybridBinarizer(new RGBLuminanceSource(luminance, png.width, png.height))))
      .getText();
  } catch {
    return null;
  }
}

describe('the counter ticket’s QR code to the public product page', () => {
  // The first ticket of an A4 sheet.
  const firstTicket = { xMm: 4.65, yMm: 13.1, wMm: 99.1, hMm: 67.7 };
  const url = 'https://menu.wrenfield-lane.example/p/lemon-shortbread';

  it('prints the product’s page address as a QR code a reader decodes, with its caption', async () => {
    const pdf = await pdfOf(run('ticket', [label('lemon-shortbread', SHORTBREAD, { publicUrl: url })]));
    expect(decodeQr(pageImage(pdf, 300, firstTicket))).toBe(url);
    const text = textRuns(pdf)
      .map((r) => r.str)
      .join(' ');
    expect(text).toMatch(/Allergens on\s+your phone/);
  });

  it('prints no code for a product that is not published, and the ticket then looks as it did without one', async () => {
    const ticket = template('ticket');
    const row = ticket.blocks[1];
    if (row.type !== 'row') throw new Error('The ticket template has its QR code in a row.');
    const withoutCode: LabelTemplate = { ...ticket, blocks: [ticket.blocks[0], ...row.columns[0].blocks] };
    const [plainPdf, shippedPdf] = await Promise.all([
      pdfOf(run(withoutCode, [label('lemon-shortbread')])),
      pdfOf(run('ticket', [label('lemon-shortbread')])),
    ]);
    const shipped = pageImage(shippedPdf, 150, firstTicket);
    expect(decodeQr(pageImage(shippedPdf, 300, firstTicket))).toBeNull();
    expect(Buffer.compare(shipped.data, pageImage(plainPdf, 150, firstTicket).data)).toBe(0);
  });

  it('refuses a code whose modules would print too small for a phone, and a code on a case label', () => {
    const ticket = template('ticket');
    const small = JSON.parse(JSON.stringify(ticket).replace('"sizeMm":20', '"sizeMm":12')) as LabelTemplate;
    const long = `https://${'m'.repeat(100)}.example/p/${'lemon-shortbread-'.repeat(4)}x`;
    const refused = renderLabelDocument(run(small, [label('lemon-shortbread', SHORTBREAD, { publicUrl: long })]));
    expect(refused.ok).toBe(false);
    if (!refused.ok) {
      expect(refused.problems.map((p) => p.code)).toEqual(['barcode-does-not-fit']);
      expect(refused.problems[0].message).toMatch(
        /QR code of Chocolate-dipped lemon shortbread would print with modules of 0\.\d\d mm, below 0\.3 mm/,
      );
    }
    const raw = JSON.parse(readFileSync(join(TEMPLATES, 'case.json'), 'utf8'));
    raw.blocks.push({ type: 'qr', sizeMm: 20 });
    const parsed = parseTemplate(raw, 'label-templates/case.json');
    expect(!parsed.ok && parsed.problems.map((p) => p.message)).toEqual([expect.stringMatching(/QR code .* is for unit labels/)]);
  });
});

describe('npm run label', () => {
  const book = join(work, 'book.json');
  beforeAll(() => {
    const b = structuredClone(demo);
    const r = b.recipes.find((x) => x.id === 'lemon-shortbread')!;
    r.sale = { ...r.sale!, ...SHORTBREAD, claims: r.sale!.claims };
    writeFileSync(book, JSON.stringify(b));
  });
  const label = (...args: string[]) =>
    spawnSync(process.execPath, [join(ROOT, 'api/scripts/label.mjs'), book, ...args], {
      encoding: 'utf8',
      cwd: work,
      env: { ...process.env, INIT_CWD: work },
    });

  it('writes a PDF of the case labels whose barcode decodes', () => {
    const out = join(work, 'cli-case.pdf');
    const res = label(
      '--product',
      'lemon-shortbread',
      '--template',
      'case',
      '--out',
      out,
      '--date',
      '2026-12-02',
      '--count',
      '2',
      '--batch',
      'B7',
    );
    expect(res.stderr).toBe('');
    expect(res.stdout).toBe(`Wrote 2 case labels to ${out}\n`);
    expect(res.status).toBe(0);
    expect(gs1Elements(decodeAll(pageImage(out, 400), 400))).toMatchObject({ '01': '19521234000027', '15': '261223', '10': 'B7' });
  });

  it.each([
    [
      ['--gtin', '9521234000021'],
      "--gtin: The check digit of 9521234000021 should be 0, not 1 (GS1 modulo 10): check the number on the product's registration.",
    ],
    [['--count', '0'], '--count: print 1 to 1000 labels, not 0.'],
    [['--date', '2026-02-30'], "--date: '2026-02-30' is not a date that exists; write it as YYYY-MM-DD."],
    [['--batch', 'LOT 7'], expect.stringMatching(/^--batch: A batch code uses only GS1's character set 82 .* 'LOT 7' has a space\.$/)],
    [['--template', 'poster'], "--template: there is no template 'poster' in label-templates/."],
  ])('refuses %j, naming the field, and writes nothing', (args, message) => {
    const out = join(work, `refused-${args[0].slice(2)}.pdf`);
    const template = args[0] === '--template' ? [] : ['--template', 'product'];
    const res = label('--product', 'lemon-shortbread', ...template, '--out', out, ...args);
    expect(res.status).toBe(1);
    expect(res.stderr.trim()).toEqual(message);
    expect(readdirSync(work)).not.toContain(`refused-${args[0].slice(2)}.pdf`);
  });

  describe('at one site of a book of several (--site)', () => {
    const sites = join(work, 'sites.json');
    beforeAll(() => {
      const { site, ...rest } = JSON.parse(readFileSync(book, 'utf8')) as Book;
      const harbour = { id: 'harbour', name: 'Harbour Kiosk', address: '9 Quay Street, Bristol BS1 5TT', regime: 'UK', handles: [] };
      writeFileSync(
        sites,
        JSON.stringify({
          ...rest,
          sites: [
            { id: 'lane', ...site },
            { ...harbour, sells: ['lemon-shortbread'] },
          ],
        }),
      );
    });
    const labelAt = (...args: string[]) =>
      spawnSync(process.execPath, [join(ROOT, 'api/scripts/label.mjs'), sites, ...args], {
        encoding: 'utf8',
        cwd: work,
        env: { ...process.env, INIT_CWD: work },
      });
    const printed = (site: string[]) => {
      const out = join(work, `site-${site.join('-') || 'default'}.pdf`);
      const res = labelAt(...site, '--product', 'lemon-shortbread', '--template', 'product', '--out', out, '--date', '2026-12-02');
      expect(res.stderr).toBe('');
      expect(res.status).toBe(0);
      return textRuns(out)
        .map((r) => r.str)
        .join(' ')
        .replace(/\s+/g, ' ');
    };

    it("prints with the site's name and address (Regulation (EU) No 1169/2011 Article 9(1)(h)), the first site by default", () => {
      const harbour = printed(['--site', 'harbour']);
      expect(harbour).toContain('Harbour Kiosk');
      expect(harbour).toContain('9 Quay Street, Bristol BS1 5TT');
      const lane = printed([]);
      expect(lane).toContain(demo.site.name);
      expect(lane).not.toContain('Harbour Kiosk');
    });

    it('refuses a site the book does not have, naming the ones it has, and a product the site does not sell', () => {
      const unknown = labelAt('--site', 'pier', '--product', 'lemon-shortbread', '--template', 'ticket', '--out', join(work, 'pier.pdf'));
      expect(unknown.status).toBe(1);
      expect(unknown.stderr.trim()).toBe(
        `--site: There is no site 'pier' in this book; its sites are lane (${demo.site.name}), harbour (Harbour Kiosk).`,
      );
      const other = demo.recipes.find((r) => r.sale && r.id !== 'lemon-shortbread')!;
      const unsold = labelAt('--site', 'harbour', '--product', other.id, '--template', 'ticket', '--out', join(work, 'unsold.pdf'));
      expect(unsold.status).toBe(1);
      expect(unsold.stderr.trim()).toBe(
        `--product: ${other.name} is not sold at Harbour Kiosk (the site's sells leaves it out), so it has no labels there.`,
      );
      expect(readdirSync(work)).not.toContain('pier.pdf');
      expect(readdirSync(work)).not.toContain('unsold.pdf');
    });
  });

  it('refuses a product whose declaration has an error', () => {
    const b = structuredClone(demo);
    b.recipes.find((x) => x.id === 'lemon-shortbread')!.sale!.claims = ['vegan'];
    const bad = join(work, 'bad.json');
    writeFileSync(bad, JSON.stringify(b));
    const res = spawnSync(
      process.execPath,
      [join(ROOT, 'api/scripts/label.mjs'), bad, '--product', 'lemon-shortbread', '--template', 'ticket', '--out', join(work, 'x.pdf')],
      {
        encoding: 'utf8',
      },
    );
    expect(res.status).toBe(1);
    expect(res.stderr).toMatch(/^declaration-error: Chocolate-dipped lemon shortbread: /);
  });
});
