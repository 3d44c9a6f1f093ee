import { z } from 'zod';

/**
 * A label template: the size of a label (single labels on a roll, or a sheet such as A4 with
 * 3 × 7 labels), and the blocks printed on it, top to bottom, with their font sizes in points.
 * Templates are data (label-templates/*.json, checked against label-templates/template.schema.json,
 * generated from this schema); adding one is a new file. A template whose text would print
 * below the legal x-height is refused by checkTemplate (legibility.ts holds the rule).
 */

/** A4 in millimetres (ISO 216). */
export const A4_MM = { widthMm: 210, heightMm: 297 } as const;

const sizePt = z
  .number({ error: 'Give a font size in points.' })
  .min(4, 'Use a font size of at least 4 pt.')
  .max(96, 'Use a font size of at most 96 pt.');

/** Blocks of text, each filled from the declaration, the print details or the run. */
export const TEXT_BLOCKS = [
  'name',
  'ingredients',
  'mayContain',
  'claims',
  'allergensInWords',
  'dates',
  'batch',
  'storage',
  'business',
  'netWeight',
  'unitsPerCase',
  'caution',
] as const;
export type TextBlockType = (typeof TEXT_BLOCKS)[number];

export const textBlockSchema = z.strictObject({
  type: z.enum(TEXT_BLOCKS),
  sizePt,
  /** Space above the block, in millimetres. */
  spaceBeforeMm: z.number().min(0).max(50).default(0),
  align: z.enum(['left', 'center']).default('left'),
  /** The whole block in the bold face (allergens are bold in any case). */
  bold: z.boolean().default(false),
});
export type TextBlock = z.infer<typeof textBlockSchema>;

/**
 * A barcode: 'ean13-or-upca' encodes the product's GTIN (EAN-13, UPC-A for a GTIN-12, EAN-8 for
 * a GTIN-8) at a magnification of 80 % to 200 % of the nominal size, 0.33 mm modules and
 * 22.85 mm bars (GS1 General Specifications, EAN/UPC symbol dimensions, from memory); 'gs1-128'
 * encodes the case's element string, split over as many symbols as the width needs, with modules
 * of `xDimensionMm` (GS1 logistics labels: at least 0.495 mm, from memory) and 10 modules of quiet
 * zone on each side.
 */
export const barcodeBlockSchema = z.strictObject({
  type: z.literal('barcode'),
  kind: z.enum(['ean13-or-upca', 'gs1-128']),
  magnification: z
    .number()
    .min(0.8, 'An EAN/UPC symbol is printed at 80 % of its nominal size or more.')
    .max(2, 'An EAN/UPC symbol is printed at 200 % of its nominal size or less.')
    .optional(),
  xDimensionMm: z.number().min(0.25).max(1.016).optional(),
  barHeightMm: z.number().min(5).max(60).optional(),
  /** The human-readable line under a GS1-128 symbol. */
  hriSizePt: sizePt.optional(),
  spaceBeforeMm: z.number().min(0).max(50).default(0),
  align: z.enum(['left', 'center', 'right']).default('center'),
});
export type BarcodeBlock = z.infer<typeof barcodeBlockSchema>;

/**
 * A QR code to the product's page on the kitchen's public product page, with a line of words
 * under it. Printed only for a product that is published while the kitchen has the page on; a
 * row's column holding nothing but such a code gives its width to the others when there is none.
 */
export const qrBlockSchema = z.strictObject({
  type: z.literal('qr'),
  /** The code's side, its quiet zone included. */
  sizeMm: z.number().min(12, 'Print a QR code at least 12 mm square, so a phone reads it.').max(60),
  /** The words under the code, e.g. "Allergens on your phone". */
  caption: z.string().min(1).max(60).optional(),
  captionSizePt: sizePt.optional(),
  spaceBeforeMm: z.number().min(0).max(50).default(0),
  align: z.enum(['left', 'center']).default('center'),
});
export type QrBlock = z.infer<typeof qrBlockSchema>;

/** The allergen chart: every product against every allergen group of the regime. */
export const chartBlockSchema = z.strictObject({
  type: z.literal('chart'),
  sizePt,
  headerSizePt: sizePt,
  spaceBeforeMm: z.number().min(0).max(50).default(0),
});
export type ChartBlock = z.infer<typeof chartBlockSchema>;

const leafBlockSchema = z.discriminatedUnion('type', [textBlockSchema, barcodeBlockSchema, qrBlockSchema, chartBlockSchema]);
export type LeafBlock = z.infer<typeof leafBlockSchema>;

/** Blocks side by side: each column takes its width, or shares what the others leave. */
export const rowBlockSchema = z.strictObject({
  type: z.literal('row'),
  gapMm: z.number().min(0).max(50).default(2),
  spaceBeforeMm: z.number().min(0).max(50).default(0),
  columns: z
    .array(
      z.strictObject({
        widthMm: z.number().positive().max(1000).optional(),
        blocks: z.array(leafBlockSchema).min(1),
      }),
    )
    .min(2, 'A row has at least two columns.')
    .max(4, 'A row has at most four columns.'),
});
export type RowBlock = z.infer<typeof rowBlockSchema>;

export const blockSchema = z.discriminatedUnion('type', [
  textBlockSchema,
  barcodeBlockSchema,
  qrBlockSchema,
  chartBlockSchema,
  rowBlockSchema,
]);
export type Block = z.infer<typeof blockSchema>;

const sheetSchema = z.strictObject({
  sheet: z.literal('A4'),
  columns: z.number().int().min(1).max(10),
  rows: z.number().int().min(1).max(30),
  /** Top, right, bottom and left margins of the sheet. */
  marginsMm: z.tuple([z.number().min(0), z.number().min(0), z.number().min(0), z.number().min(0)]),
  /** Horizontal and vertical gaps between labels. */
  gapMm: z.tuple([z.number().min(0), z.number().min(0)]),
});
const rollSchema = z.strictObject({
  roll: z.strictObject({
    widthMm: z.number().min(10).max(600),
    heightMm: z.number().min(10).max(900),
  }),
});

export const labelTemplateSchema = z
  .strictObject({
    $schema: z.string().optional(),
    id: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, 'A template id is lower-case letters, digits and hyphens.'),
    title: z.string().min(1).max(120),
    /** What the template is for: one label per unit, one per case, or one chart of all products. */
    purpose: z.enum(['unit', 'case', 'chart']),
    layout: z.union([sheetSchema, rollSchema]),
    orientation: z.enum(['portrait', 'landscape']).default('portrait'),
    /** White space inside each label's edge. */
    paddingMm: z.number().min(0).max(30).default(3),
    /**
     * The largest surface of the pack the label goes on, in cm²: under 80 cm² mandatory text may
     * have an x-height of 0.9 mm instead of 1.2 mm (Regulation (EU) No 1169/2011 Article 13(3)).
     */
    largestSurfaceCm2: z.number().positive().max(100000),
    /** Line spacing as a multiple of the font's line height. */
    lineSpacing: z.number().min(1).max(2).default(1.1),
    blocks: z.array(blockSchema).min(1),
  })
  .superRefine((t, ctx) => {
    const leaves = t.blocks.flatMap((b) => (b.type === 'row' ? b.columns.flatMap((c) => c.blocks) : [b]));
    const chart = leaves.some((b) => b.type === 'chart');
    if (chart !== (t.purpose === 'chart'))
      ctx.addIssue({ code: 'custom', path: ['blocks'], input: t.blocks, message: 'A chart template, and only one, has a chart block.' });
    const codes = leaves.filter((b) => b.type === 'barcode');
    if (codes.some((b) => b.kind === 'gs1-128') && t.purpose !== 'case')
      ctx.addIssue({
        code: 'custom',
        path: ['blocks'],
        input: t.blocks,
        message: 'A GS1-128 barcode is for case labels (purpose "case").',
      });
    if (codes.some((b) => b.kind === 'ean13-or-upca') && t.purpose !== 'unit')
      ctx.addIssue({
        code: 'custom',
        path: ['blocks'],
        input: t.blocks,
        message: 'An EAN/UPC barcode is for unit labels (purpose "unit").',
      });
    if (leaves.some((b) => b.type === 'qr') && t.purpose !== 'unit')
      ctx.addIssue({
        code: 'custom',
        path: ['blocks'],
        input: t.blocks,
        message: 'A QR code to the public product page is for unit labels (purpose "unit").',
      });
  });
export type LabelTemplate = z.infer<typeof labelTemplateSchema>;
export type LabelTemplateInput = z.input<typeof labelTemplateSchema>;

/** The size of one label, in millimetres, and where each label of a page goes. */
export interface LabelGeometry {
  pageWidthMm: number;
  pageHeightMm: number;
  labelWidthMm: number;
  labelHeightMm: number;
  perPage: number;
  /** The top-left corner of the label in position `i` of a page. */
  origin(i: number): { xMm: number; yMm: number };
}

export function labelGeometry(template: LabelTemplate): LabelGeometry {
  const landscape = template.orientation === 'landscape';
  if ('roll' in template.layout) {
    const { widthMm, heightMm } = template.layout.roll;
    return {
      pageWidthMm: widthMm,
      pageHeightMm: heightMm,
      labelWidthMm: widthMm,
      labelHeightMm: heightMm,
      perPage: 1,
      origin: () => ({ xMm: 0, yMm: 0 }),
    };
  }
  const { columns, rows, marginsMm, gapMm } = template.layout;
  const pageWidthMm = landscape ? A4_MM.heightMm : A4_MM.widthMm;
  const pageHeightMm = landscape ? A4_MM.widthMm : A4_MM.heightMm;
  const [top, right, bottom, left] = marginsMm;
  const labelWidthMm = (pageWidthMm - left - right - gapMm[0] * (columns - 1)) / columns;
  const labelHeightMm = (pageHeightMm - top - bottom - gapMm[1] * (rows - 1)) / rows;
  return {
    pageWidthMm,
    pageHeightMm,
    labelWidthMm,
    labelHeightMm,
    perPage: columns * rows,
    origin: (i) => ({
      xMm: left + (i % columns) * (labelWidthMm + gapMm[0]),
      yMm: top + Math.floor(i / columns) * (labelHeightMm + gapMm[1]),
    }),
  };
}

/** A problem with a template, naming its file and field. */
export interface TemplateProblem {
  file: string;
  field: string;
  message: string;
}

/** A template read from JSON, or every problem with it, each naming the file and the field. */
export function parseTemplate(
  raw: unknown,
  file: string,
): { ok: true; template: LabelTemplate } | { ok: false; problems: TemplateProblem[] } {
  const parsed = labelTemplateSchema.safeParse(raw);
  if (!parsed.success)
    return {
      ok: false,
      problems: parsed.error.issues.map((issue) => ({ file, field: fieldName(issue.path), message: issue.message })),
    };
  const problems: TemplateProblem[] = [];
  const expected = file.replace(/^.*[\\/]/, '').replace(/\.json$/, '');
  if (parsed.data.id !== expected)
    problems.push({
      file,
      field: 'id',
      message: `The template's id is '${parsed.data.id}'; name the file ${parsed.data.id}.json or the id '${expected}'.`,
    });
  const geometry = labelGeometry(parsed.data);
  if (geometry.labelWidthMm < 10 || geometry.labelHeightMm < 10)
    problems.push({
      file,
      field: 'layout',
      message: 'The labels of this sheet would be smaller than 10 mm; use fewer rows or columns, or smaller margins and gaps.',
    });
  return problems.length > 0 ? { ok: false, problems } : { ok: true, template: parsed.data };
}

/** A path as a field name: blocks[2].sizePt. */
export function fieldName(path: readonly PropertyKey[]): string {
  return path.map((p, i) => (typeof p === 'number' ? `[${p}]` : `${i === 0 ? '' : '.'}${String(p)}`)).join('') || '(the template)';
}

/** Every leaf block of a template with its field path, rows opened. */
export function leafBlocks(template: LabelTemplate): Array<{ block: LeafBlock; field: string }> {
  return template.blocks.flatMap((b, i) =>
    b.type === 'row'
      ? b.columns.flatMap((c, j) => c.blocks.map((block, k) => ({ block, field: `blocks[${i}].columns[${j}].blocks[${k}]` })))
      : [{ block: b, field: `blocks[${i}]` }],
  );
}

/** The JSON Schema of a template file (the input side: fields with defaults are optional), published as label-templates/template.schema.json. */
export function templateJsonSchemaText(): string {
  const schema = {
    ...z.toJSONSchema(labelTemplateSchema, { io: 'input', target: 'draft-2020-12' }),
    $id: 'https://crumbproof.example/label-templates/template.schema.json',
    title: 'Crumbproof label template',
  };
  return `${JSON.stringify(schema, null, 2)}\n`;
}
