import { REGIMES, type Regime } from '@crumbproof/shared';
import { BookProblemsError, UnknownProductError, declareAtSite, declareSiteEach } from '../rules/core';
import { loadReferenceData } from '../rules/reference-data';
import { indentedJsonPieces } from './json-lines';
import { fail, problemLines, readSiteView } from './read-book';

/**
 * npm run declare -- BOOK.json [--site ID] [--regime EU|UK|US|CA|ANZ] [--product ID]
 * Prints {"declarations": [...]} on stdout, for the site given (a book of several sites: the
 * first by default; each declaration then names its site and the stand-ins below it); a book
 * that fails the schema or the book check, or an unknown site, exits 1 with one reason a line on
 * stderr, worded as the API words it; wrong arguments exit 2.
 */
interface Args {
  file: string;
  site?: string;
  regime?: Regime;
  product?: string;
}

const USAGE = 'Usage: npm run declare -- BOOK.json [--site ID] [--regime EU|UK|US|CA|ANZ] [--product ID]';

function parseArgs(argv: string[]): Args | string {
  let file: string | undefined;
  let site: string | undefined;
  let regime: Regime | undefined;
  let product: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--regime') {
      const r = argv[++i];
      const found = REGIMES.find((x) => x === r);
      if (!found) return `Unknown regime '${r ?? ''}'. Use one of ${REGIMES.join(', ')}.`;
      regime = found;
    } else if (a === '--site') {
      site = argv[++i];
      if (!site || site.startsWith('--')) return 'Give a site id after --site.';
    } else if (a === '--product') {
      product = argv[++i];
      if (!product) return 'Give a recipe id after --product.';
    } else if (a.startsWith('--')) return `Unknown option ${a}.`;
    else if (file) return `Give one book only (got ${file} and ${a}).`;
    else file = a;
  }
  return file ? { file, site, regime, product } : 'Give the recipe book to declare.';
}

function main(): void {
  const args = parseArgs(process.argv.slice(2));
  if (typeof args === 'string') fail([args, USAGE], 2);

  const view = readSiteView(args.file, args.site);

  const refs = loadReferenceData();
  try {
    // Every product's declaration is written as it is worked out, so the whole set is never held.
    const declarations = args.product
      ? [declareAtSite(view, args.product, refs, { regime: args.regime })]
      : declareSiteEach(view, refs, { regime: args.regime });
    for (const piece of indentedJsonPieces('declarations', declarations)) process.stdout.write(piece);
  } catch (e) {
    if (e instanceof BookProblemsError) fail(problemLines(e.problems, view), 1);
    if (e instanceof UnknownProductError) fail([e.message], 1);
    throw e;
  }
}

main();
