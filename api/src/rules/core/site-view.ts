import type {
  Book,
  BookFile,
  BookRecipe,
  BookSite,
  ProductDeclaration,
  Regime,
  Sale,
  Site,
  SiteProductDeclaration,
  StandIn,
  Substitution,
} from '@crumbproof/shared';
import { checkBook } from './book-check';
import { closureItems } from './book-graph';
import { BookProblemsError, UnknownSiteError } from './errors';
import { declareProduct, productDeclarer } from './product';
import type { ReferenceData } from './reference-schema';

/** One site's view of a recipe book: the one-site book the engine declares, and what stood in for what. */
export interface SiteView {
  /** The site it answers for; null for a book of one kitchen given as site (no id). */
  site: { id: string; name: string } | null;
  book: Book;
  /** Every recipe line made with the site's own ingredient in place of the shared one, in book order. */
  standIns: StandIn[];
  /** The recipes for sale in the book that this site does not sell (its sells leaves them out). */
  notSold: string[];
}

/** The book's sites by id and name, first the default; none for a book of one kitchen given as site. */
export function sitesOf(file: BookFile): Array<{ id: string; name: string }> {
  return (file.sites ?? []).map((s) => ({ id: s.id, name: s.name }));
}

/**
 * One site's view of a checked book file (`bookFileSchema`), as the one-site book the engine
 * declares: the site's regime, measures and handling; the shared ingredients and the site's own
 * (other sites' own left out); every recipe, each line of a replaced ingredient made with the
 * site's own (recorded in `standIns`, and QUID names followed); sale details kept only on what the
 * site sells. Without `siteId`, the book's first site. A book given as site reads as it is.
 * Throws UnknownSiteError for an id the book has no site of.
 */
export function siteView(file: BookFile, siteId?: string): SiteView {
  if (file.site) {
    if (siteId !== undefined) throw new UnknownSiteError(siteId, []);
    return { site: null, book: oneSiteBook(file.site, file), standIns: [], notSold: [] };
  }
  const sites = file.sites ?? [];
  const site = siteId === undefined ? sites[0] : sites.find((s) => s.id === siteId);
  if (!site) throw new UnknownSiteError(siteId ?? '', sitesOf(file));

  const byReplaced = new Map((site.substitutions ?? []).map((s) => [s.replaces, s]));
  const names = new Map(file.ingredients.map((i) => [i.id, i.name]));
  const sells = site.sells ? new Set(site.sells) : null;
  const standIns: StandIn[] = [];
  const recipes = file.recipes.map((recipe) => {
    const lines = recipe.lines.map((line, index) => {
      const sub = byReplaced.get(line.use);
      if (!sub) return line;
      standIns.push(standIn(recipe, index + 1, sub, names));
      return { ...line, use: sub.with };
    });
    const sold = recipe.sale && (!sells || sells.has(recipe.id));
    const sale = sold ? followQuid(recipe.sale!, byReplaced) : undefined;
    return lines.some((l, i) => l !== recipe.lines[i]) || sale !== recipe.sale ? withSale({ ...recipe, lines }, sale) : recipe;
  });
  const notSold = file.recipes.filter((r) => r.sale && sells && !sells.has(r.id)).map((r) => r.id);
  const ingredients = file.ingredients.filter((i) => i.onlyAt === undefined || i.onlyAt === site.id);
  return { site: { id: site.id, name: site.name }, book: oneSiteBook(siteFields(site), { ingredients, recipes }), standIns, notSold };
}

/** The stand-ins below a product of the view (its own recipe and every sub-recipe it reaches), in the order of its walk. */
export function standInsOf(view: SiteView, productId: string): StandIn[] {
  return closureItems(view.book, productId)
    .filter((item) => item.kind === 'recipe')
    .flatMap((item) => view.standIns.filter((s) => s.recipe === item.id));
}

/**
 * A product's declaration at the view's site: the engine's, with the site and the stand-ins below
 * it for a book of several sites; exactly the engine's for a book of one kitchen given as site.
 */
export function declareAtSite(
  view: SiteView,
  productId: string,
  refs: ReferenceData,
  opts: { regime?: Regime } = {},
): ProductDeclaration | SiteProductDeclaration {
  const declaration = declareProduct(view.book, productId, refs, opts);
  return view.site ? { ...declaration, site: view.site, standIns: standInsOf(view, productId) } : declaration;
}

/**
 * Every product for sale at the view's site, in book order, each worked out as it is read: the
 * book checked once (BookProblemsError before the first, as declareAtSite throws) and every
 * product declared through one run (productDeclarer), so a sub-recipe many products share is
 * worked out once and a whole book's declarations need never be held at once.
 */
export function* declareSiteEach(
  view: SiteView,
  refs: ReferenceData,
  opts: { regime?: Regime } = {},
): Generator<ProductDeclaration | SiteProductDeclaration> {
  const problems = checkBook(view.book);
  if (problems.length > 0) throw new BookProblemsError(problems);
  const declareOne = productDeclarer(view.book, refs, opts);
  for (const recipe of view.book.recipes) {
    if (!recipe.sale) continue;
    const declaration = declareOne(recipe.id);
    yield view.site ? { ...declaration, site: view.site, standIns: standInsOf(view, recipe.id) } : declaration;
  }
}

/** Every product for sale at the view's site, in book order (declareSiteEach, held in one list). */
export function declareSite(
  view: SiteView,
  refs: ReferenceData,
  opts: { regime?: Regime } = {},
): { declarations: Array<ProductDeclaration | SiteProductDeclaration> } {
  return { declarations: [...declareSiteEach(view, refs, opts)] };
}

function standIn(recipe: BookRecipe, line: number, sub: Substitution, names: Map<string, string>): StandIn {
  return {
    recipe: recipe.id,
    line,
    replaces: sub.replaces,
    replacesName: names.get(sub.replaces) ?? sub.replaces,
    with: sub.with,
    withName: names.get(sub.with) ?? sub.with,
    ...(sub.note !== undefined ? { note: sub.note } : {}),
  };
}

/** QUID names the ingredient the line is made with. */
function followQuid(sale: Sale, byReplaced: Map<string, Substitution>): Sale {
  if (!sale.quid?.some((q) => byReplaced.has(q))) return sale;
  return { ...sale, quid: sale.quid.map((q) => byReplaced.get(q)?.with ?? q) };
}

function withSale(recipe: BookRecipe, sale: Sale | undefined): BookRecipe {
  const { sale: _dropped, ...rest } = recipe;
  return sale ? { ...rest, sale } : rest;
}

/** A site of several as the one-site book's site: its fields as a book given as site has them. */
function siteFields(site: BookSite): Site {
  return {
    name: site.name,
    ...(site.address !== undefined ? { address: site.address } : {}),
    regime: site.regime,
    ...(site.measures !== undefined ? { measures: site.measures } : {}),
    handles: site.handles,
  };
}

function oneSiteBook(site: Site, items: Pick<BookFile, 'ingredients' | 'recipes'>): Book {
  return {
    crumbproofBook: 1,
    site,
    ingredients: items.ingredients.map(({ onlyAt: _kept, ...ingredient }) => ingredient),
    recipes: items.recipes,
  };
}
