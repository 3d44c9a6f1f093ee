import type { Column, Content, TDocumentDefinitions } from 'pdfmake/interfaces';
import { CLAIM_LABELS, REGIME_LABELS, SOURCE_LABELS, type Regime } from '../allergens';
import type { Sale } from '../book';
import type { Declaration } from '../declaration';
import { gs1Date, gtin14, netWeightElement, type Gs1Element } from '../gs1';
import { formatLabelDate, formatPrintedAt, labelDate } from './dates';
import { LABEL_FONT, mmToPt, ptToMm, type LabelFonts } from './fonts';
import { isLegible, legibilityRule, minimumLegibleSizePt, requiredXHeightMm, shownPt } from './legibility';
import { eanUpcSymbol, gs1128Symbols, QR_MIN_MODULE_MM, qrSymbol, type BarcodeSymbol } from './barcodes';
import {
  labelGeometry,
  leafBlocks,
  parseTemplate,
  type BarcodeBlock,
  type Block,
  type ChartBlock,
  type LabelTemplate,
  type QrBlock,
  type TemplateProblem,
  type TextBlock,
} from './template';

/** What a label prints of a product besides its declaration (the book's sale details). */
export type LabelPrintDetails = Pick<
  Sale,
  'claims' | 'shelfLifeDays' | 'dateMark' | 'gtin' | 'caseGtin' | 'unitsPerCase' | 'netWeightG' | 'storage'
>;

/** One product of a run: its declaration, print details, batch and how many labels. */
export interface LabelInput {
  /** A served declaration (with its basis) or a declaration computed from a book file. */
  declaration: Declaration;
  details: LabelPrintDetails;
  batch: string;
  /** YYYY-MM-DD. */
  productionDate: string;
  /** Labels to print (for a case template, cases). */
  quantity: number;
  /** Shipment case labels: one SSCC per case, `quantity` of them. */
  sscc?: string[];
  /** The product's revision the declaration was read from, printed on the chart. */
  revision?: number;
  /**
   * The address of the product's page on the kitchen's public product page, given only when the
   * product is published and the page is on: a template's QR code block prints it, and is left
   * out without it.
   */
  publicUrl?: string;
}

export interface AllergenGroup {
  code: string;
  label: string;
}

export interface RenderInput {
  template: LabelTemplate;
  labels: LabelInput[];
  business: { name: string; address: string };
  regime: Regime;
  fonts: LabelFonts;
  /** ISO timestamp of the print. */
  printedAt: string;
  /** The regime's allergen groups, in order: the chart's columns. */
  allergenGroups?: AllergenGroup[];
}

export const RENDER_PROBLEM_CODES = [
  'declaration-error',
  'regime-mismatch',
  'sulphites-not-known',
  'allergens-not-known',
  'template-illegible',
  'missing-detail',
  'does-not-fit',
  'barcode-does-not-fit',
  'gs1-invalid',
] as const;
export type RenderProblemCode = (typeof RENDER_PROBLEM_CODES)[number];

export interface RenderProblem {
  code: RenderProblemCode;
  message: string;
  product?: string;
}

export type RenderResult = { ok: true; doc: TDocumentDefinitions; labels: number } | { ok: false; problems: RenderProblem[] };

/** A stretch of text in one face. */
interface Run {
  text: string;
  bold: boolean;
}

/** The largest step a long list shrinks by, in points. */
const SHRINK_STEP_PT = 0.25;
/** Room left for kerning between runs and rounding, so that pdfmake never wraps a line itself. */
const WIDTH_SLACK = 0.985;

/** Every problem with a template's sizes: text that would print below the legal x-height. */
export function templateLegibilityProblems(template: LabelTemplate, fonts: LabelFonts): RenderProblem[] {
  return illegibleSizes(template, fonts).map(({ message }) => ({ code: 'template-illegible', message }));
}

/** Each size of a template below the legal x-height, with its field. */
function illegibleSizes(template: LabelTemplate, fonts: LabelFonts): Array<{ field: string; message: string }> {
  const min = minimumLegibleSizePt(fonts, template.largestSurfaceCm2);
  const xMm = requiredXHeightMm(template.largestSurfaceCm2);
  const problems: Array<{ field: string; message: string }> = [];
  const check = (sizePt: number, field: string) => {
    if (!isLegible(sizePt, fonts, template.largestSurfaceCm2))
      problems.push({
        field,
        message: `Template '${template.id}' sets ${field} at ${sizePt} pt, below the smallest legible size ${shownPt(min)} (x-height ${xMm} mm, ${legibilityRule(template.largestSurfaceCm2)}).`,
      });
  };
  for (const { block, field } of leafBlocks(template)) {
    if (block.type === 'barcode') {
      if (block.hriSizePt !== undefined) check(block.hriSizePt, `${field}.hriSizePt`);
    } else if (block.type === 'qr') {
      if (block.caption !== undefined) check(block.captionSizePt ?? QR_CAPTION_PT, `${field}.captionSizePt`);
    } else if (block.type === 'chart') {
      check(block.sizePt, `${field}.sizePt`);
      check(block.headerSizePt, `${field}.headerSizePt`);
    } else check(block.sizePt, `${field}.sizePt`);
  }
  return problems;
}

/**
 * A template file read and checked in full, as the API does at start and the command line at once:
 * its schema, and every font size against the legal x-height in the fonts it prints with. Each
 * problem names the file and the field.
 */
export function checkTemplate(
  raw: unknown,
  file: string,
  fonts: LabelFonts,
): { ok: true; template: LabelTemplate } | { ok: false; problems: TemplateProblem[] } {
  const parsed = parseTemplate(raw, file);
  if (!parsed.ok) return parsed;
  const problems = illegibleSizes(parsed.template, fonts).map((p) => ({ file, ...p }));
  return problems.length > 0 ? { ok: false, problems } : parsed;
}

/** Runs broken into lines no wider than `widthPt`, at spaces; a word longer than a line is broken between characters. */
export function wrapRuns(runs: Run[], sizePt: number, widthPt: number, fonts: LabelFonts): Run[][] {
  const width = (r: Run) => (r.bold ? fonts.bold : fonts.regular).width(r.text, sizePt);
  // Words made of runs (a word can change face, "(milk)"), and the spaces between them.
  const items: Array<{ word: Run[] } | { space: Run }> = [];
  let word: Run[] = [];
  for (const run of runs)
    // Lines break at spaces, tabs and line breaks, never at a no-break space.
    for (const piece of run.text.split(/([ \t\n\r]+)/)) {
      if (piece === '') continue;
      if (/^[ \t\n\r]+$/.test(piece)) {
        if (word.length > 0) items.push({ word });
        word = [];
        items.push({ space: { text: ' ', bold: run.bold } });
      } else word.push({ text: piece, bold: run.bold });
    }
  if (word.length > 0) items.push({ word });

  const lines: Run[][] = [];
  let line: Run[] = [];
  let used = 0;
  let space: Run | null = null;
  const max = widthPt * WIDTH_SLACK;
  const breakLine = () => {
    lines.push(line);
    line = [];
    used = 0;
    space = null;
  };
  for (const item of items) {
    if ('space' in item) {
      if (line.length > 0) space = item.space;
      continue;
    }
    const wordWidth = item.word.reduce((sum, r) => sum + width(r), 0);
    const spaceWidth = space ? width(space) : 0;
    if (line.length > 0 && used + spaceWidth + wordWidth > max) breakLine();
    else if (space) {
      line.push(space);
      used += spaceWidth;
      space = null;
    }
    if (wordWidth <= max - used) {
      line.push(...item.word);
      used += wordWidth;
      continue;
    }
    // Longer than a line: character by character.
    for (const part of item.word)
      for (const ch of part.text) {
        const r = { text: ch, bold: part.bold };
        const w = width(r);
        if (line.length > 0 && used + w > max) breakLine();
        line.push(r);
        used += w;
      }
  }
  if (line.length > 0) lines.push(line);
  return lines.map(merge);
}

function merge(runs: Run[]): Run[] {
  const out: Run[] = [];
  for (const r of runs) {
    const last = out.at(-1);
    if (last && last.bold === r.bold) last.text += r.text;
    else out.push({ ...r });
  }
  return out;
}

/** Something placed on a label, measured. */
interface Placed {
  heightPt: number;
  node: Content;
}

interface Measure {
  fonts: LabelFonts;
  lineSpacing: number;
}

function textPlaced(
  runs: Run[],
  block: { sizePt: number; align: 'left' | 'center'; spaceBeforeMm: number },
  widthPt: number,
  m: Measure,
): Placed {
  const lines = wrapRuns(runs, block.sizePt, widthPt, m.fonts);
  const lineHeight = Math.max(m.fonts.regular.lineHeight(block.sizePt), m.fonts.bold.lineHeight(block.sizePt)) * m.lineSpacing;
  const spaceBefore = mmToPt(block.spaceBeforeMm);
  return {
    heightPt: spaceBefore + lines.length * lineHeight,
    node: {
      stack: lines.map((l) => ({
        text: l.map((r) => ({ text: r.text, bold: r.bold })),
        noWrap: true,
        fontSize: block.sizePt,
        lineHeight: m.lineSpacing,
        alignment: block.align,
      })),
      margin: [0, spaceBefore, 0, 0],
    },
  };
}

const HRI_GAP_MM = 0.8;
/** The caption under a QR code, when the template gives no size. */
const QR_CAPTION_PT = 8;
const SYMBOL_GAP_MM = 2.5;

function barcodePlaced(symbols: BarcodeSymbol[], block: BarcodeBlock, m: Measure): Placed {
  const hriSize = block.hriSizePt ?? 8;
  const hriLine = Math.max(m.fonts.regular.lineHeight(hriSize), m.fonts.bold.lineHeight(hriSize));
  const stack: Content[] = [];
  let height = mmToPt(block.spaceBeforeMm);
  symbols.forEach((s, i) => {
    const gap = i === 0 ? 0 : mmToPt(SYMBOL_GAP_MM);
    stack.push({ svg: s.svg, width: s.widthPt, alignment: block.align, margin: [0, gap, 0, 0] });
    height += gap + s.heightPt;
    if (s.hri) {
      stack.push({
        text: s.hri,
        fontSize: hriSize,
        lineHeight: 1,
        noWrap: true,
        alignment: block.align,
        margin: [0, mmToPt(HRI_GAP_MM), 0, 0],
      });
      height += mmToPt(HRI_GAP_MM) + hriLine;
    }
  });
  return { heightPt: height, node: { stack, margin: [0, mmToPt(block.spaceBeforeMm), 0, 0] } };
}

function qrPlaced(url: string, block: QrBlock, widthPt: number, m: Measure): Placed {
  const s = qrSymbol(url, block.sizeMm);
  const spaceBefore = mmToPt(block.spaceBeforeMm);
  const stack: Content[] = [{ svg: s.svg, width: s.widthPt, height: s.heightPt, alignment: block.align }];
  let height = spaceBefore + s.heightPt;
  if (block.caption) {
    const caption = textPlaced(
      plain(block.caption),
      { sizePt: block.captionSizePt ?? QR_CAPTION_PT, align: block.align, spaceBeforeMm: 0 },
      widthPt,
      m,
    );
    stack.push(caption.node);
    height += caption.heightPt;
  }
  return { heightPt: height, node: { stack, margin: [0, spaceBefore, 0, 0] } };
}

/** What one product's label says, worked out once for all its copies. */
interface LabelText {
  product: string;
  name: string;
  /** The text of each block type; null: the block is left out (nothing to say). */
  text: (block: TextBlock) => Run[] | null;
  /** The barcode symbols of a block at a width, null when the product has no barcode of that kind; copy: the label's index. */
  barcode: (block: BarcodeBlock, widthMm: number, copy: number) => BarcodeSymbol[] | null | 'too-wide';
  /** The address a QR code block prints, or null: the product is not published (or the page is off). */
  publicUrl: string | null;
}

const plain = (text: string): Run[] => [{ text, bold: false }];

function formatGrams(grams: number): string {
  const fmt = (n: number) => String(Math.round(n * 1000) / 1000);
  return grams >= 1000 ? `${fmt(grams / 1000)} kg` : `${fmt(grams)} g`;
}

/** "Contains: cereals containing gluten (wheat), milk." with the allergens in bold. */
function allergenWords(d: Declaration): Run[] {
  if (d.contains.length === 0) return plain('Allergens: none recorded in the ingredients.');
  const runs: Run[] = [{ text: 'Contains: ', bold: false }];
  d.contains.forEach((c, i) => {
    // The sources in brackets where the group's name does not already say them: "nuts (almond)", but "eggs".
    const sources = [...new Set(c.sources.map((s) => SOURCE_LABELS[s]))].filter((s) => !c.label.toLowerCase().includes(s.toLowerCase()));
    runs.push({ text: c.label, bold: true });
    if (sources.length > 0) runs.push({ text: ` (${sources.join(', ')})`, bold: false });
    runs.push({ text: i === d.contains.length - 1 ? '.' : ', ', bold: false });
  });
  return runs;
}

/** Everything that keeps a product's labels from printing, whatever the template. */
function declarationProblems(input: LabelInput, regime: Regime): RenderProblem[] {
  const d = input.declaration;
  const product = d.product;
  const problems: RenderProblem[] = d.errors.map((e) => ({
    code: 'declaration-error' as const,
    product,
    message: `${d.name}: ${e.message} Labels are not printed until it is fixed.`,
  }));
  if (d.regime !== regime)
    problems.push({
      code: 'regime-mismatch',
      product,
      message: `${d.name}: its declaration is for ${REGIME_LABELS[d.regime]}, the labels for ${REGIME_LABELS[regime]}.`,
    });
  if (d.warnings.some((w) => w.code === 'sulphites-not-known'))
    problems.push({
      code: 'sulphites-not-known',
      product,
      message: `${d.name}: its sulphites are not known (${d.sulphites.missing.map((g) => g.name).join(', ')}), so its labels cannot say whether it contains sulphites. Record the sulphite content or the allergen statement of each.`,
    });
  if (d.unknown.length > 0)
    problems.push({
      code: 'allergens-not-known',
      product,
      message: `${d.name}: the allergens of ${d.unknown.map((u) => u.name).join(', ')} are not known (no allergen statement), so its labels cannot list them. Record the supplier's allergen statement first.`,
    });
  return problems;
}

function labelText(input: LabelInput, run: RenderInput, problems: RenderProblem[]): LabelText {
  const { template, regime, printedAt, business } = run;
  const d = input.declaration;
  const { details } = input;
  const product = d.product;
  const missing = (what: string) =>
    problems.push({
      code: 'missing-detail',
      product,
      message: `${d.name} has no ${what}: the ${template.id} label needs it. Add it to the product's sale details.`,
    });
  const leaves = leafBlocks(template).map((l) => l.block);
  const hasText = (type: TextBlock['type']) => leaves.some((b) => b.type === type);
  const caseLabel = template.purpose === 'case';
  const shipment = input.sscc !== undefined;

  const dated = details.shelfLifeDays !== undefined && details.dateMark !== undefined;
  const date = dated ? labelDate(input.productionDate, details.shelfLifeDays!) : null;
  const gs1 = leaves.some((b) => b.type === 'barcode' && b.kind === 'gs1-128');
  if (!dated && (hasText('dates') || gs1)) missing('shelf life and date mark');
  const units = details.unitsPerCase;
  if (caseLabel && units === undefined) missing('units per case');
  if (caseLabel && gs1 && !shipment && details.caseGtin === undefined) missing('case GTIN-14');
  if (caseLabel && gs1 && shipment && details.gtin === undefined) missing('GTIN (the shipment label names the units it holds)');
  if (shipment && input.sscc!.length !== input.quantity)
    problems.push({
      code: 'gs1-invalid',
      product,
      message: `${d.name}: ${input.quantity} case labels need ${input.quantity} SSCCs, not ${input.sscc!.length}.`,
    });

  if (hasText('business') && !business.address.trim())
    problems.push({
      code: 'missing-detail',
      product,
      message: `The kitchen has no address: the ${template.id} label names the business by its name and address (Regulation (EU) No 1169/2011 Article 9(1)(h)). Add it on the Kitchen page.`,
    });

  const claims = (details.claims ?? []).filter((c) => d.claims[c]?.status === 'ok').map((c) => CLAIM_LABELS[c]);

  const text = (block: TextBlock): Run[] | null => {
    const bold = (runs: Run[]) => (block.bold ? runs.map((r) => ({ ...r, bold: true })) : runs);
    switch (block.type) {
      case 'name':
        // QUID: each percentage next to the name of the food on a label that lists the ingredients
        // (Regulation (EU) No 1169/2011 Article 22 and Annex VIII point 2).
        return hasText('ingredients') && d.quid.length > 0
          ? [
              { text: d.name, bold: true },
              { text: ` (${d.quid.map((q) => q.text).join(', ')})`, bold: false },
            ]
          : [{ text: d.name, bold: true }];
      case 'ingredients':
        return bold(d.ingredientsSegments.map((s) => ({ text: s.text, bold: s.emphasis })));
      case 'mayContain':
        return d.mayContainText ? bold(plain(d.mayContainText)) : null;
      case 'claims':
        return claims.length > 0 ? bold(plain(claims.join(' · '))) : null;
      case 'allergensInWords':
        return bold(allergenWords(d));
      case 'dates':
        return date && details.dateMark ? bold(plain(formatLabelDate(date, details.dateMark, regime))) : null;
      case 'batch':
        return bold(plain(`Batch ${input.batch}`));
      case 'storage':
        return details.storage ? bold(plain(details.storage)) : null;
      case 'business':
        return bold(plain(business.address.trim() ? `${business.name}, ${business.address.trim()}` : business.name));
      case 'netWeight':
        if (details.netWeightG === undefined) return null;
        return caseLabel && units !== undefined
          ? bold(plain(`Net weight ${formatGrams(details.netWeightG * units)} (${units} × ${formatGrams(details.netWeightG)})`))
          : bold(plain(`Net weight ${formatGrams(details.netWeightG)}`));
      case 'unitsPerCase':
        return units !== undefined ? bold(plain(`${units} ${units === 1 ? 'unit' : 'units'} per case`)) : null;
      case 'caution':
        return bold(
          plain(
            `Allergen information as recorded in our recipes and our suppliers' information, ${formatPrintedAt(printedAt).replace(/,.*$/, '')}. Please ask us before you buy if you have an allergy.`,
          ),
        );
    }
  };

  const caseElements = (copy: number): Gs1Element[] | null => {
    if (!date || !details.dateMark || units === undefined) return null;
    const dateElement = { ai: details.dateMark === 'use-by' ? '17' : '15', value: gs1Date(date) };
    if (shipment) {
      const code = input.sscc?.[copy];
      if (!code || !details.gtin) return null;
      return [
        { ai: '00', value: code },
        { ai: '02', value: gtin14(details.gtin) },
        { ai: '37', value: String(units) },
        dateElement,
        { ai: '10', value: input.batch },
      ];
    }
    if (!details.caseGtin) return null;
    const weight = details.netWeightG !== undefined ? netWeightElement(details.netWeightG * units) : null;
    return [{ ai: '01', value: details.caseGtin }, dateElement, { ai: '10', value: input.batch }, ...(weight ? [weight] : [])];
  };

  const barcode = (block: BarcodeBlock, widthMm: number, copy: number): BarcodeSymbol[] | null | 'too-wide' => {
    if (block.kind === 'ean13-or-upca') {
      if (!details.gtin) return null;
      const s = eanUpcSymbol(details.gtin, block.magnification ?? 1);
      return ptToMm(s.widthPt) <= widthMm + 1e-6 ? [s] : 'too-wide';
    }
    const elements = caseElements(copy);
    if (!elements) return null;
    const symbols = gs1128Symbols(elements, block.xDimensionMm ?? 0.495, block.barHeightMm ?? 31.75, widthMm);
    return symbols ?? 'too-wide';
  };

  return { product, name: d.name, text, barcode, publicUrl: input.publicUrl ?? null };
}

/** A row's column with nothing to print on this label: only QR code blocks, and no address for them. */
const emptyColumn = (blocks: readonly Block[], label: LabelText) => label.publicUrl === null && blocks.every((b) => b.type === 'qr');

/** A block laid out at a width, or why it cannot be. */
type Laid = { placed: Placed | null; shrinkable: boolean } | { problem: RenderProblem };

function layBlock(block: Block, widthPt: number, label: LabelText, copy: number, m: Measure, ingredientsPt: number): Laid {
  if (block.type === 'row') {
    const present = block.columns.filter((c) => !emptyColumn(c.blocks, label));
    if (present.length === 0) return { placed: null, shrinkable: false };
    // One column left: its blocks take the whole width, as if the row were not there.
    const [only] = present;
    if (only && present.length === 1) {
      const stack: Content[] = [];
      let height = mmToPt(block.spaceBeforeMm);
      let shrinkable = false;
      for (const inner of only.blocks) {
        const laid = layBlock(inner, widthPt, label, copy, m, ingredientsPt);
        if ('problem' in laid) return laid;
        shrinkable ||= laid.shrinkable;
        if (laid.placed) {
          stack.push(laid.placed.node);
          height += laid.placed.heightPt;
        }
      }
      return { placed: { heightPt: height, node: { stack, margin: [0, mmToPt(block.spaceBeforeMm), 0, 0] } }, shrinkable };
    }
    block = { ...block, columns: present };
    const gap = mmToPt(block.gapMm);
    const fixed = block.columns.map((c) => (c.widthMm !== undefined ? mmToPt(c.widthMm) : null));
    const free = block.columns.length - fixed.filter((w) => w !== null).length;
    const rest = widthPt - gap * (block.columns.length - 1) - fixed.reduce<number>((a, w) => a + (w ?? 0), 0);
    const columns: Column[] = [];
    let height = 0;
    let shrinkable = false;
    for (const [i, column] of block.columns.entries()) {
      const w = fixed[i] ?? rest / Math.max(free, 1);
      const stack: Content[] = [];
      let h = 0;
      for (const inner of column.blocks) {
        const laid = layBlock(inner, w, label, copy, m, ingredientsPt);
        if ('problem' in laid) return laid;
        shrinkable ||= laid.shrinkable;
        if (laid.placed) {
          stack.push(laid.placed.node);
          h += laid.placed.heightPt;
        }
      }
      height = Math.max(height, h);
      columns.push({ width: w, stack });
    }
    const spaceBefore = mmToPt(block.spaceBeforeMm);
    return { placed: { heightPt: spaceBefore + height, node: { columns, columnGap: gap, margin: [0, spaceBefore, 0, 0] } }, shrinkable };
  }
  if (block.type === 'barcode') {
    const symbols = label.barcode(block, ptToMm(widthPt), copy);
    if (symbols === 'too-wide')
      return {
        problem: {
          code: 'barcode-does-not-fit',
          product: label.product,
          message: `The ${block.kind === 'gs1-128' ? 'GS1-128' : 'EAN/UPC'} barcode of ${label.name} does not fit the width of its place on the label (${Math.round(ptToMm(widthPt))} mm) at the template's module size.`,
        },
      };
    return { placed: symbols ? barcodePlaced(symbols, block, m) : null, shrinkable: false };
  }
  if (block.type === 'qr') {
    if (label.publicUrl === null) return { placed: null, shrinkable: false };
    if (mmToPt(block.sizeMm) > widthPt + 1e-6)
      return {
        problem: {
          code: 'barcode-does-not-fit',
          product: label.product,
          message: `The QR code of ${label.name} (${block.sizeMm} mm) does not fit the width of its place on the label (${Math.round(ptToMm(widthPt))} mm).`,
        },
      };
    const { moduleMm } = qrSymbol(label.publicUrl, block.sizeMm);
    if (moduleMm < QR_MIN_MODULE_MM)
      return {
        problem: {
          code: 'barcode-does-not-fit',
          product: label.product,
          message: `The QR code of ${label.name} would print with modules of ${moduleMm.toFixed(2)} mm, below ${QR_MIN_MODULE_MM} mm, which a phone may not read: give the kitchen a shorter public address, or use a template with a larger code.`,
        },
      };
    return { placed: qrPlaced(label.publicUrl, block, widthPt, m), shrinkable: false };
  }
  if (block.type === 'chart') return { placed: null, shrinkable: false };
  const runs = label.text(block);
  if (!runs) return { placed: null, shrinkable: false };
  const shrinkable = block.type === 'ingredients';
  const sized = shrinkable ? { ...block, sizePt: Math.min(block.sizePt, ingredientsPt) } : block;
  return { placed: textPlaced(runs, sized, widthPt, m), shrinkable };
}

/** One label of a product laid out in its box, shrinking the ingredient list step by step down to the legal minimum. */
function layLabel(
  label: LabelText,
  copy: number,
  run: RenderInput,
  box: { widthPt: number; heightPt: number },
): { nodes: Content[] } | { problem: RenderProblem } {
  const { template, fonts } = run;
  const m: Measure = { fonts, lineSpacing: template.lineSpacing };
  const min = minimumLegibleSizePt(fonts, template.largestSurfaceCm2);
  const start = Math.max(...leafBlocks(template).map(({ block }) => (block.type === 'ingredients' ? block.sizePt : 0)), min);
  for (let size = start; ; size = Math.max(min, size - SHRINK_STEP_PT)) {
    const nodes: Content[] = [];
    let height = 0;
    let shrinkable = false;
    for (const block of template.blocks) {
      const laid = layBlock(block, box.widthPt, label, copy, m, size);
      if ('problem' in laid) return laid;
      shrinkable ||= laid.shrinkable;
      if (laid.placed) {
        nodes.push(laid.placed.node);
        height += laid.placed.heightPt;
      }
    }
    if (height <= box.heightPt + 1e-6) return { nodes };
    if (!shrinkable || size <= min + 1e-9)
      return {
        problem: {
          code: 'does-not-fit',
          product: label.product,
          message: shrinkable
            ? `The ingredient list of ${label.name} does not fit on the ${template.id} label at the smallest legible size (x-height ${requiredXHeightMm(template.largestSurfaceCm2)} mm, ${shownPt(min)}): use a larger label template.`
            : `The text of ${label.name} does not fit on the ${template.id} label (${Math.round(ptToMm(height))} mm of ${Math.round(ptToMm(box.heightPt))} mm): use a larger label template.`,
        },
      };
  }
}

function chartDocument(run: RenderInput, block: ChartBlock): RenderResult {
  const { template, regime } = run;
  const groups = run.allergenGroups;
  if (!groups || groups.length === 0)
    return {
      ok: false,
      problems: [{ code: 'missing-detail', message: `The allergen chart needs the allergen groups of ${REGIME_LABELS[regime]}.` }],
    };
  const geometry = labelGeometry(template);
  const p = template.paddingMm;
  const [top, right, bottom, left] = 'sheet' in template.layout ? template.layout.marginsMm : ([p, p, p, p] as const);
  const header: Content[] = [
    { text: 'Product', bold: true, fontSize: block.headerSizePt },
    ...groups.map((g) => ({ text: g.label, bold: true, fontSize: block.headerSizePt })),
  ];
  const rows: Content[][] = run.labels.map(({ declaration: d, revision }) => [
    {
      stack: [
        { text: d.name, bold: true, fontSize: block.sizePt },
        { text: revision !== undefined ? `revision ${revision}` : 'from a recipe book file', fontSize: block.sizePt },
      ],
    },
    ...groups.map((g): Content => {
      if (d.contains.some((c) => c.allergen === g.code)) return { text: 'Contains', bold: true, fontSize: block.sizePt };
      const sulphitesUnknown = g.code === 'sulphites' && d.sulphites.status === 'not-known';
      if (d.unknown.length > 0 || sulphitesUnknown)
        return { text: 'Not known', fontSize: block.sizePt, decoration: 'underline', decorationStyle: 'dashed' };
      if (d.mayContain.some((c) => c.allergen === g.code)) return { text: 'May contain', fontSize: block.sizePt };
      return { text: '–', fontSize: block.sizePt };
    }),
  ]);
  const content: Content[] = [
    { text: `Allergen chart · ${run.business.name}`, bold: true, fontSize: block.headerSizePt + 6 },
    {
      text: `${REGIME_LABELS[regime]} allergen groups. Printed ${formatPrintedAt(run.printedAt)}. Contains: in the ingredients as recorded; May contain: recorded cross-contact; Not known: an ingredient has no allergen statement; –: none recorded. From the recorded recipes and supplier information; ask before you buy if you have an allergy.`,
      fontSize: block.sizePt,
      margin: [0, 2, 0, mmToPt(block.spaceBeforeMm + 3)],
    },
    {
      table: {
        headerRows: 1,
        dontBreakRows: true,
        widths: [mmToPt(40), ...groups.map(() => '*' as const)],
        body: [header, ...rows],
      },
      layout: {
        hLineWidth: () => 0.5,
        vLineWidth: () => 0.5,
        paddingLeft: () => 2,
        paddingRight: () => 2,
        paddingTop: () => 3,
        paddingBottom: () => 3,
      },
    },
  ];
  return {
    ok: true,
    labels: 1,
    doc: {
      info: { title: template.title },
      pageSize: { width: mmToPt(geometry.pageWidthMm), height: mmToPt(geometry.pageHeightMm) },
      pageMargins: [mmToPt(left), mmToPt(top), mmToPt(right), mmToPt(bottom)],
      defaultStyle: { font: LABEL_FONT, fontSize: block.sizePt, lineHeight: template.lineSpacing },
      content,
    },
  };
}

/**
 * The pdfmake document of a run of labels, or every reason it cannot be printed: a declaration
 * with errors, sulphites or allergens that are not known, print details the template needs,
 * text that does not fit at the legal minimum size, a barcode that does not fit.
 */
export function renderLabelDocument(run: RenderInput): RenderResult {
  const { template } = run;
  const problems: RenderProblem[] = [...templateLegibilityProblems(template, run.fonts)];
  if (run.labels.length === 0) problems.push({ code: 'missing-detail', message: 'Give at least one product to print.' });
  const chart = leafBlocks(template).find((l) => l.block.type === 'chart')?.block;
  // The chart says "Not known" where a label could not print at all.
  const unknownIsShown = (p: RenderProblem) =>
    chart !== undefined && (p.code === 'sulphites-not-known' || p.code === 'allergens-not-known');
  for (const input of run.labels) problems.push(...declarationProblems(input, run.regime).filter((p) => !unknownIsShown(p)));
  if (problems.length > 0) return { ok: false, problems };

  if (chart?.type === 'chart') return chartDocument(run, chart);

  const texts = run.labels.map((input) => ({ input, label: labelText(input, run, problems) }));
  if (problems.length > 0) return { ok: false, problems };

  const geometry = labelGeometry(template);
  const pad = mmToPt(template.paddingMm);
  const box = { widthPt: mmToPt(geometry.labelWidthMm) - 2 * pad, heightPt: mmToPt(geometry.labelHeightMm) - 2 * pad };
  const content: Content[] = [];
  let slot = 0;
  for (const { input, label } of texts) {
    // Copies differ only by their SSCC, which is of fixed length: lay out the first, then each SSCC.
    const perCopy = input.sscc !== undefined;
    let laid = layLabel(label, 0, run, box);
    for (let copy = 0; copy < input.quantity; copy++) {
      if (copy > 0 && perCopy) laid = layLabel(label, copy, run, box);
      if ('problem' in laid) {
        problems.push(laid.problem);
        break;
      }
      const position = slot % geometry.perPage;
      if (slot > 0 && position === 0) content.push({ text: '', pageBreak: 'before' });
      const origin = geometry.origin(position);
      content.push({
        absolutePosition: { x: mmToPt(origin.xMm) + pad, y: mmToPt(origin.yMm) + pad },
        // pdfmake writes its measurements into the nodes it lays out: each copy gets its own.
        columns: [{ width: box.widthPt, stack: structuredClone(laid.nodes) }],
      });
      slot++;
    }
  }
  if (problems.length > 0) return { ok: false, problems };
  return {
    ok: true,
    labels: slot,
    doc: {
      info: { title: template.title },
      pageSize: { width: mmToPt(geometry.pageWidthMm), height: mmToPt(geometry.pageHeightMm) },
      pageMargins: [0, 0, 0, 0],
      defaultStyle: { font: LABEL_FONT, lineHeight: template.lineSpacing },
      content,
    },
  };
}
