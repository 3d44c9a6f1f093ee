import { readFileSync } from 'node:fs';
import { REGIMES, bookPlace, bookSchema, formatIssue, type Regime } from '@crumbproof/shared';
import { BookProblemsError, UnknownProductError, checkBook, declareProduct, declareProducts } from '../rules/core';
import { loadReferenceData } from '../rules/reference-data';
import { indentedJsonPieces } from './json-lines';

/**
 * npm run declare -- BOOK.json [--regime EU|UK|US|CA|ANZ] [--product ID]
 * Prints {"declarations": [...]} on stdout; a book that fails the schema or the book check
 * exits 1 with one reason a line on stderr, worded as the API words it; wrong arguments exit 2.
 */
interface Args {
  file: string;
  regime?: Regime;
  product?: string;
}

const USAGE = 'Usage: npm run declare -- BOOK.json [--regime EU|UK|US|CA|ANZ] [--product ID]';

function parseArgs(argv: string[]): Args | string {
  let file: string | undefined;
  let regime: Regime | undefined;
  let product: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--regime') {
      const r = argv[++i];
      const found = REGIMES.find((x) => x === r);
      if (!found) return `Unknown regime '${r ?? ''}'. Use one of ${REGIMES.join(', ')}.`;
      regime = found;
    } else if (a === '--product') {
      product = argv[++i];
      if (!product) return 'Give a recipe id after --product.';
    } else if (a.startsWith('--')) return `Unknown option ${a}.`;
    else if (file) return `Give one book only (got ${file} and ${a}).`;
    else file = a;
  }
  return file ? { file, regime, product } : 'Give the recipe book to declare.';
}

function fail(lines: string[], code: number): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

function main(): void {
  const args = parseArgs(process.argv.slice(2));
  if (typeof args === 'string') fail([args, USAGE], 2);

  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(args.file, 'utf8'));
  } catch (e) {
    fail([`book-invalid: cannot read ${args.file} as JSON: ${e instanceof Error ? e.message : String(e)}`], 1);
  }
  const parsed = bookSchema.safeParse(raw);
  if (!parsed.success)
    fail(
      parsed.error.issues.map((issue) => `book-invalid: ${formatIssue(issue, bookPlace(raw))}`),
      1,
    );
  const book = parsed.data;

  const problems = checkBook(book);
  if (problems.length > 0)
    fail(
      problems.map((p) => `${p.code}: ${p.message}`),
      1,
    );

  const refs = loadReferenceData();
  try {
    const out = args.product
      ? { declarations: [declareProduct(book, args.product, refs, { regime: args.regime })] }
      : declareProducts(book, refs, { regime: args.regime });
    for (const piece of indentedJsonPieces('declarations', out.declarations)) process.stdout.write(piece);
  } catch (e) {
    if (e instanceof BookProblemsError)
      fail(
        e.problems.map((p) => `${p.code}: ${p.message}`),
        1,
      );
    if (e instanceof UnknownProductError) fail([e.message], 1);
    throw e;
  }
}

main();
