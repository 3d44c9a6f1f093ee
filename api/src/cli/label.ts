import { readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import {
  DEFAULT_BATCH_PATTERN,
  batchProblem,
  expandBatchPattern,
  isCalendarDate,
  verifyGs1Key,
  type Declaration,
} from '@crumbproof/shared';
import { checkTemplate, renderLabelDocument, type LabelInput } from '@crumbproof/shared/labels';
import { labelFonts, renderPdf } from '../labels/pdf-node';
import { BookProblemsError, UnknownProductError, declareProduct } from '../rules/core';
import { loadReferenceData } from '../rules/reference-data';
import { fail, problemLines, readSiteView } from './read-book';

/**
 * npm run label -- BOOK.json --product ID --template NAME --out FILE.pdf [--site ID]
 *   [--date YYYY-MM-DD] [--batch CODE] [--count N] [--gtin GTIN]
 * Renders labels of one product from a recipe book (the chart: of every product for sale, or of
 * the one given) with the same renderer as the app, without a database. A book of several sites
 * prints for the site given (the first by default): its regime, its name and address, its
 * substitutions, and only what it sells. A refused print (a book
 * that fails its checks, a declaration error, a bad value, text that does not fit) exits 1 with
 * one reason a line on stderr, naming the field; wrong arguments exit 2. Nothing is written then.
 */
interface Args {
  file: string;
  site?: string;
  product?: string;
  template: string;
  out: string;
  date?: string;
  batch?: string;
  count?: string;
  gtin?: string;
}

const USAGE =
  'Usage: npm run label -- BOOK.json --product ID --template NAME --out FILE.pdf [--site ID] [--date YYYY-MM-DD] [--batch CODE] [--count N] [--gtin GTIN]';

const TEMPLATES_DIR = resolve(__dirname, '..', '..', '..', 'label-templates');

const VALUE_OPTIONS = ['--site', '--product', '--template', '--out', '--date', '--batch', '--count', '--gtin'] as const;
type ValueOption = (typeof VALUE_OPTIONS)[number];

function parseArgs(argv: string[]): Args | string {
  const values: Partial<Record<ValueOption, string>> = {};
  let file: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const option = VALUE_OPTIONS.find((o) => o === a);
    if (option) {
      const value = argv[++i];
      if (value === undefined || value.startsWith('--')) return `Give a value after ${option}.`;
      if (values[option] !== undefined) return `Give ${option} once.`;
      values[option] = value;
    } else if (a.startsWith('--')) return `Unknown option ${a}.`;
    else if (file) return `Give one book only (got ${file} and ${a}).`;
    else file = a;
  }
  if (!file) return 'Give the recipe book to print labels from.';
  if (!values['--template']) return 'Give the label template with --template (product, ticket, case or chart).';
  if (!values['--out']) return 'Give the PDF file to write with --out.';
  if (!values['--product'] && values['--template'] !== 'chart') return 'Give the product to print with --product.';
  return {
    file,
    site: values['--site'],
    product: values['--product'],
    template: values['--template'],
    out: values['--out'],
    date: values['--date'],
    batch: values['--batch'],
    count: values['--count'],
    gtin: values['--gtin'],
  };
}

/** Every bad value among the options, each naming its option. */
function valueProblems(args: Args): string[] {
  const problems: string[] = [];
  if (args.date !== undefined && !isCalendarDate(args.date))
    problems.push(`--date: '${args.date}' is not a date that exists; write it as YYYY-MM-DD.`);
  if (args.count !== undefined && !/^[0-9]+$/.test(args.count))
    problems.push(`--count: give a whole number of labels, not '${args.count}'.`);
  else if (args.count !== undefined && (Number(args.count) < 1 || Number(args.count) > 1000))
    problems.push(`--count: print 1 to 1000 labels, not ${Number(args.count)}.`);
  if (args.batch !== undefined) {
    const problem = batchProblem(args.batch);
    if (problem) problems.push(`--batch: ${problem}`);
  }
  if (args.gtin !== undefined) {
    const problem = verifyGs1Key(args.gtin, 'unit-gtin');
    if (problem) problems.push(`--gtin: ${problem}`);
  }
  if (!/^[a-z0-9][a-z0-9-]*$/.test(args.template))
    problems.push(`--template: '${args.template}' is not a template name (product, ticket, case, chart).`);
  return problems;
}

function readTemplate(name: string) {
  const path = join(TEMPLATES_DIR, `${name}.json`);
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(path, 'utf8'));
  } catch (e) {
    const missing = e instanceof Error && 'code' in e && e.code === 'ENOENT';
    fail(
      [
        missing
          ? `--template: there is no template '${name}' in label-templates/.`
          : `template-invalid: label-templates/${name}.json: ${String(e)}`,
      ],
      1,
    );
  }
  const parsed = checkTemplate(raw, `label-templates/${name}.json`, labelFonts());
  if (!parsed.ok)
    fail(
      parsed.problems.map((p) => `template-invalid: ${p.file}, ${p.field}: ${p.message}`),
      1,
    );
  return parsed.template;
}

async function main(): Promise<void> {
  const args = parseArgs(process.argv.slice(2));
  if (typeof args === 'string') fail([args, USAGE], 2);
  const problems = valueProblems(args);
  if (problems.length > 0) fail(problems, 1);

  const template = readTemplate(args.template);
  const view = readSiteView(args.file, args.site);
  const book = view.book;
  const refs = loadReferenceData();
  const regime = book.site.regime;
  const productionDate = args.date ?? new Date().toISOString().slice(0, 10);
  const products = args.product ? [args.product] : book.recipes.filter((r) => r.sale).map((r) => r.id);

  const labels: LabelInput[] = [];
  for (const id of products) {
    let declaration: Declaration;
    try {
      declaration = declareProduct(book, id, refs, { regime });
    } catch (e) {
      if (e instanceof BookProblemsError) fail(problemLines(e.problems, view), 1);
      if (e instanceof UnknownProductError) fail([`--product: ${e.message}`], 1);
      throw e;
    }
    const sale = book.recipes.find((r) => r.id === id)?.sale;
    if (!sale && view.site && view.notSold.includes(id))
      fail(
        [`--product: ${declaration.name} is not sold at ${view.site.name} (the site's sells leaves it out), so it has no labels there.`],
        1,
      );
    if (!sale) fail([`--product: ${declaration.name} is not for sale in this book (it has no sale details), so it has no labels.`], 1);
    labels.push({
      declaration,
      details: { ...sale, ...(args.gtin ? { gtin: args.gtin } : {}) },
      batch: args.batch ?? expandBatchPattern(DEFAULT_BATCH_PATTERN, { date: productionDate, product: id, sequence: 1 }),
      productionDate,
      quantity: args.count ? Number(args.count) : 1,
    });
  }

  const rules = refs.regimes[regime];
  const result = renderLabelDocument({
    template,
    labels,
    business: { name: book.site.name, address: book.site.address ?? '' },
    regime,
    fonts: labelFonts(),
    printedAt: new Date().toISOString(),
    allergenGroups: rules.groups.map((g) => ({ code: g.code, label: g.label })),
  });
  if (!result.ok)
    fail(
      result.problems.map((p) => `${p.code}: ${p.message}`),
      1,
    );
  const pdf = await renderPdf(result.doc);
  writeFileSync(args.out, pdf);
  process.stdout.write(`Wrote ${result.labels} ${template.id} label${result.labels === 1 ? '' : 's'} to ${args.out}\n`);
}

main().catch((e: unknown) => fail([`label: ${e instanceof Error ? e.message : String(e)}`], 1));
