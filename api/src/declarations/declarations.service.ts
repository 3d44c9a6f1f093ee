import { createHash } from 'node:crypto';
import { Injectable, type OnModuleInit } from '@nestjs/common';
import {
  bookRecipeSchema,
  type Book,
  type ClaimBasis,
  type Declaration,
  type DeclarationBasisItem,
  type PreviewDeclaration,
  type ProductDeclaration,
  type Regime,
  type ServedDeclaration,
  type StandIn,
} from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { deepFreeze } from '../common/deep-freeze';
import { prepareJson, type PreparedJson } from '../common/prepared-json';
import { validationError } from '../common/zod.pipe';
import { BooksService, type KitchenState } from '../books/books.service';
import { KitchenService } from '../kitchen/kitchen.service';
import { bookClosures, closureItems, closureOf, type BookClosures, type BookItemRef } from '../rules/core/book-graph';
import { standInsOf, type SiteView } from '../rules/core/site-view';
import { canonicalJsonKept } from '../rules/core/same-data';
import { RulesService } from '../rules/rules.service';
import {
  SpecificationsService,
  claimBasisOf,
  overdueWarnings,
  type SpecificationStanding,
} from '../ingredients/specifications/specifications.service';
import { DeclarationsRepository } from './declarations.repository';

/** A served declaration with the kept row it comes from and the hash of its inputs. */
export interface KeptServed {
  served: ServedDeclaration;
  declarationId: number;
  inputHash: string;
  /** The product's row in the recipes table. */
  recipeRowId: number;
}

/**
 * A served declaration as a record keeps it (an approval's copy, a print log's source): without
 * the claims' basis, which only the day it is served can say.
 */
export function keptCopy(served: ServedDeclaration): ServedDeclaration {
  const { claimBasis: _today, ...kept } = served;
  return kept;
}

/** What DeclarationsService.servedChecks adds to a declaration as it is served. */
export interface ServedChecks {
  reviewWarnings?: ServedDeclaration['reviewWarnings'];
  claimBasis: ClaimBasis;
}

/** Recipes declared and kept per step of `record` (each step one lookup and a few inserts). */
const RECORD_CHUNK = 500;

/**
 * Declarations of products, kept per recipe revision and regime and reused until anything they
 * depend on changes (an ingredient, a sub-recipe, the site's handling, the reference data).
 */
@Injectable()
export class DeclarationsService implements OnModuleInit {
  constructor(
    private readonly kept: DeclarationsRepository,
    private readonly books: BooksService,
    private readonly kitchen: KitchenService,
    private readonly rules: RulesService,
    private readonly specifications: SpecificationsService,
  ) {}

  /** What was found or kept for each product of a kitchen state, by regime and code (see keptForProducts). */
  private readonly keptOf = new WeakMap<KitchenState, Map<string, KeptServed>>();
  /**
   * The answers of the declaration routes as sent, by regime and product (or every product for
   * sale), for each kitchen state and the day they were served on (see prepared).
   */
  private readonly preparedOf = new WeakMap<KitchenState, Map<string, { today: string; answer: Promise<PreparedJson> }>>();
  /** What declaring the products of each kitchen state shares, worked out as first asked for (see workOf). */
  private readonly worksOf = new WeakMap<KitchenState, KitchenWork>();
  /** The review-by dates of each kitchen state's ingredients (see standingOf). */
  private readonly reviewByOf = new WeakMap<KitchenState['heads'], Promise<Map<number, string>>>();

  /** Every recipe revision saved keeps the declaration it was saved with, for the revision history. */
  onModuleInit() {
    this.books.onRecipesWritten(async (ids) => {
      await this.record(ids);
    });
  }

  /**
   * A product's declaration with where it comes from, from the store when nothing it depends on
   * has changed. It is kept under a hash of everything it is computed from: the product's closure
   * (each item's body and current revision, as the kitchen makes it), the kitchen and its settings' version, the regime
   * and the reference data; so `computedAt` is when it was computed for exactly these inputs.
   * Callers that declare many products pass the kitchen they already read.
   */
  async forProduct(code: string, regime?: Regime, state?: KitchenState): Promise<ServedDeclaration> {
    const [served] = await this.forProducts([code], regime, state);
    return served;
  }

  /**
   * Declarations of several products from one state of the kitchen, as forProduct gives each: the
   * kept ones are found in one query, and only those missing are computed and kept.
   */
  async forProducts(codes: readonly string[], regime?: Regime, state?: KitchenState): Promise<ServedDeclaration[]> {
    return (await this.keptForProducts(codes, regime, state)).map((k) => k.served);
  }

  /**
   * As forProducts, with each declaration's kept row and input hash: what an approval names, and
   * what a print run records it printed.
   */
  async keptForProducts(codes: readonly string[], regime?: Regime, state?: KitchenState): Promise<KeptServed[]> {
    const kitchen = state ?? (await this.books.state());
    const { site, book, heads, view } = kitchen;
    const useRegime = regime ?? book.site.regime;
    // The kitchen read last is shared by every request until it changes (BooksService.state), and
    // what was found or kept for it stands as long: a product served again costs no query here.
    let memo = this.keptOf.get(kitchen);
    if (!memo) this.keptOf.set(kitchen, (memo = new Map<string, KeptServed>()));
    const missing = [...new Set(codes)].filter((code) => !memo.has(`${useRegime} ${code}`));
    const { inputs, found, added } = await this.keep(missing, useRegime, kitchen, (keys) => this.kept.findMany(useRegime, keys));
    for (const { code, head, items, inputHash } of inputs) {
      const key = `${head.rowId} ${inputHash}`;
      const kept = found.get(key) ?? added.get(key);
      if (!kept) throw new Error(`The declaration of ${code} was not kept`);
      memo.set(
        `${useRegime} ${code}`,
        deepFreeze({
          declarationId: kept.id,
          inputHash,
          recipeRowId: head.rowId,
          served: {
            ...kept.body,
            basis: {
              computedAt: kept.computedAt.toISOString(),
              regime: useRegime,
              items,
              siteVersion: site.version,
              kitchen: { id: site.id, name: site.name },
              ...standInsAt(view, code),
            },
          },
        }),
      );
    }
    const out = codes.map((code) => memo.get(`${useRegime} ${code}`)!);
    const checks = await this.servedChecks(
      out.map((k) => k.served.basis.items),
      heads,
    );
    return out.map((kept, n) => ({ ...kept, served: { ...kept.served, ...checks[n] } }));
  }

  /**
   * What keeping declarations of a kitchen state's products shares, for the state: the closures of
   * its book, the canonical text of each of its items (for the input hashes), each item as a basis
   * names it, and a declarer of its book under each regime (productDeclarer: one run for all).
   */
  private workOf(state: KitchenState): KitchenWork {
    let work = this.worksOf.get(state);
    if (work) return work;
    const { book, heads } = state;
    const names = new Map([...book.ingredients, ...book.recipes].map((x) => [x.id, x.name]));
    const basisItems = new Map<string, DeclarationBasisItem>();
    const declarers = new Map<Regime, (code: string) => ProductDeclaration>();
    work = {
      closures: bookClosures(book),
      texts: new WeakMap(),
      basisItem: ({ id, kind }) => {
        let item = basisItems.get(id);
        if (!item) basisItems.set(id, (item = { id, kind, name: names.get(id)!, revision: heads.get(id)!.revision }));
        return item;
      },
      declarer: (regime) => {
        let declarer = declarers.get(regime);
        if (!declarer) declarers.set(regime, (declarer = this.rules.declarer(book, regime)));
        return declarer;
      },
    };
    this.worksOf.set(state, work);
    return work;
  }

  /**
   * The inputs of each product named, with what `find` finds kept for them (their rows to serve,
   * or only which are kept to record) and those it does not find declared and kept.
   */
  private async keep<Found extends { has(key: string): boolean }>(
    missing: readonly string[],
    useRegime: Regime,
    kitchen: KitchenState,
    find: (keys: { recipeId: number; inputHash: string }[]) => Promise<Found>,
  ) {
    const { site, heads } = kitchen;
    const work = this.workOf(kitchen);
    const inputs = missing.map((code) => {
      const head = heads.get(code);
      if (!head || head.kind !== 'recipe') throw new AppError('not-found', `There is no recipe '${code}'.`);
      const slice = work.closures.of(code);
      const items = work.closures.items(code).map(work.basisItem);
      // The same bytes as canonicalJson of these inputs, with the text of each item of the book written once for the state.
      const inputHash = createHash('sha256')
        .update(
          canonicalJsonKept(
            { slice, items, siteId: site.id, siteVersion: site.version, regime: useRegime, refs: this.rules.referenceVersion },
            work.texts,
          ),
        )
        .digest('hex');
      return { code, head, items, inputHash };
    });
    const found = await find(inputs.map((i) => ({ recipeId: i.head.rowId, inputHash: i.inputHash })));
    const declareOne = work.declarer(useRegime);
    const added = await this.kept.addMany(
      inputs
        .filter(({ head, inputHash }) => !found.has(`${head.rowId} ${inputHash}`))
        .map(({ code, head, inputHash }) => ({
          recipeId: head.rowId,
          recipeRevision: head.revision,
          regime: useRegime,
          inputHash,
          body: declareOne(code),
        })),
    );
    return { inputs, found, added };
  }

  /**
   * What is worked out as declarations are served, from today's date, so a kept declaration never
   * freezes it: the review warnings of ingredients whose newest specification is overdue, and the
   * basis of the claims (ClaimBasis). Read from each declaration's items (its basis items), so an
   * approved copy gets today's answer for the leaves it was computed from; one query for all.
   */
  async servedChecks(
    itemsOf: readonly (readonly Omit<DeclarationBasisItem, 'revision'>[])[],
    heads: KitchenState['heads'],
  ): Promise<ServedChecks[]> {
    const leavesOf = itemsOf.map((items) =>
      items
        .filter((i) => i.kind === 'ingredient')
        .map((i) => {
          const head = heads.get(i.id);
          return { rowId: head?.kind === 'ingredient' ? head.rowId : null, id: i.id, name: i.name };
        }),
    );
    const known = leavesOf.flat().flatMap((l) => (l.rowId === null ? [] : [{ ...l, rowId: l.rowId }]));
    const standing = await this.standingOf(heads);
    const warnings = overdueWarnings(known, standing);
    return leavesOf.map((leaves) => {
      const found = leaves.flatMap((l) => (warnings.has(l.id) ? [warnings.get(l.id)!] : []));
      return { ...(found.length > 0 ? { reviewWarnings: found } : {}), claimBasis: claimBasisOf(leaves, standing) };
    });
  }

  /**
   * Today's date and the newest review-by date of every ingredient of a kitchen state, read in one
   * query the first time the state is served and kept with it: a new specification is written
   * under the kitchen's lock, so it comes with a new state. Today is taken at every call, so a
   * review date passing at midnight shows at once.
   */
  private async standingOf(heads: KitchenState['heads']): Promise<SpecificationStanding> {
    let reviewBy = this.reviewByOf.get(heads);
    if (!reviewBy) {
      const ingredients = [...heads.values()].flatMap((h) => (h.kind === 'ingredient' ? [{ rowId: h.rowId }] : []));
      reviewBy = this.specifications.standing(ingredients).then((s) => s.reviewBy);
      this.reviewByOf.set(heads, reviewBy);
      reviewBy.catch(() => this.reviewByOf.delete(heads));
    }
    return { today: this.specifications.today(), reviewBy: await reviewBy };
  }

  /**
   * A product's served declaration (forProduct) as the bytes GET /api/recipes/:code/declaration
   * sends, with their entity tag: serialised once per kitchen state, regime and day, so a warm read
   * is neither declared, hashed nor serialised again. The kitchen state is this instance's copy
   * (BooksService.state), which any write that can change a declaration replaces.
   */
  async preparedFor(code: string, regime?: Regime): Promise<PreparedJson> {
    const state = await this.books.state();
    return this.prepared(state, `${regime ?? state.book.site.regime} ${code}`, () => this.forProduct(code, regime, state));
  }

  /** Every product for sale's served declaration (all) as GET /api/declarations sends it, kept as preparedFor keeps one. */
  async preparedAll(regime?: Regime): Promise<PreparedJson> {
    const state = await this.books.state();
    return this.prepared(state, `${regime ?? state.book.site.regime} *`, () => this.allOf(state, regime));
  }

  private prepared(state: KitchenState, key: string, serve: () => Promise<unknown>): Promise<PreparedJson> {
    const today = this.specifications.today();
    let byKey = this.preparedOf.get(state);
    if (!byKey) this.preparedOf.set(state, (byKey = new Map<string, { today: string; answer: Promise<PreparedJson> }>()));
    const kept = byKey.get(key);
    // What is served depends on the day too (review warnings, the claims' basis): a new day, a new answer.
    if (kept?.today === today) return kept.answer;
    const answer = serve().then(prepareJson);
    byKey.set(key, { today, answer });
    answer.catch(() => {
      if (byKey.get(key)?.answer === answer) byKey.delete(key);
    });
    return answer;
  }

  /** The declaration kept for a recipe (by its row id) under a regime and input hash, or null when there is none. */
  async keptByHash(recipeRowId: number, regime: Regime, inputHash: string): Promise<ProductDeclaration | null> {
    return (await this.kept.find(recipeRowId, regime, inputHash))?.body ?? null;
  }

  /**
   * Declares a recipe as edited but not saved: the live panel beside the editor, with the basis
   * its claims would have today. Nothing is stored.
   */
  async preview(input: unknown, regime?: Regime): Promise<PreviewDeclaration> {
    const parsed = bookRecipeSchema.safeParse(input);
    if (!parsed.success) throw validationError(parsed.error);
    const { book, heads } = await this.books.state();
    const merged: Book = { ...book, recipes: [...book.recipes.filter((r) => r.id !== parsed.data.id), parsed.data] };
    this.books.assertDeclarable(merged);
    const declaration = this.rules.declare(closureOf(merged, parsed.data.id), parsed.data.id, regime ?? book.site.regime);
    const names = new Map(merged.ingredients.map((i) => [i.id, i.name]));
    const items = closureItems(merged, parsed.data.id).map(({ id, kind }) => ({ id, kind, name: names.get(id) ?? id }));
    const [{ claimBasis }] = await this.servedChecks([items], heads);
    return { ...declaration, claimBasis };
  }

  /** The first declaration kept for each revision of a recipe (by its row id), in the kitchen's regime. */
  async savedByRevision(recipeRowId: number): Promise<Map<number, Declaration>> {
    const site = await this.kitchen.current();
    return this.kept.firstOfEachRevision(recipeRowId, site.regime);
  }

  /** Declares the given recipes (all of them when none are named), so each current revision has its declaration on record. */
  async record(ids?: readonly string[]): Promise<number> {
    const state = await this.books.state();
    const todo = ids ?? state.book.recipes.map((r) => r.id);
    // Kept, not served: neither read back nor held with the state (an import records thousands),
    // so each is found in the store when it is first served. Those served already are kept.
    const regime = state.book.site.regime;
    const memo = this.keptOf.get(state);
    const missing = [...new Set(todo)].filter((code) => !memo?.has(`${regime} ${code}`));
    for (let from = 0; from < missing.length; from += RECORD_CHUNK)
      // Only which are kept already is asked: their bodies are not read.
      await this.keep(missing.slice(from, from + RECORD_CHUNK), regime, state, (keys) => this.kept.existing(regime, keys));
    return todo.length;
  }

  /** Declarations of every product for sale, each with where it comes from. */
  async all(regime?: Regime): Promise<ServedDeclaration[]> {
    return this.allOf(await this.books.state(), regime);
  }

  private allOf(state: KitchenState, regime?: Regime): Promise<ServedDeclaration[]> {
    return this.forProducts(
      state.book.recipes.filter((x) => x.sale).map((r) => r.id),
      regime,
      state,
    );
  }
}

/** What keeping the declarations of one kitchen state's products shares (DeclarationsService.workOf). */
interface KitchenWork {
  closures: BookClosures;
  texts: WeakMap<object, string>;
  basisItem: (item: BookItemRef) => DeclarationBasisItem;
  declarer: (regime: Regime) => (code: string) => ProductDeclaration;
}

/** The lines below a product made at the view's kitchen with its own ingredient, as a basis names them (none: nothing). */
function standInsAt(view: SiteView, code: string): { standIns?: StandIn[] } {
  if (view.standIns.length === 0) return {};
  const found = standInsOf(view, code);
  return found.length > 0 ? { standIns: found } : {};
}
