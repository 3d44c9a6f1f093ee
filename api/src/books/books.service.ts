import { Injectable, Logger } from '@nestjs/common';
import {
  bookFileSchema,
  bookPlace,
  type Book,
  type BookFile,
  type BookFileIngredient,
  type BookIngredient,
  type BookProblem,
  type BookRecipe,
  type FieldError,
  type KitchenMakes,
  type NamedItem,
  type OtherSave,
  type Site,
  type Substitution,
  type StaleBase,
  diffIngredient,
  diffRecipe,
} from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { AuditService, type AuditEntry } from '../audit/audit.service';
import { deepFreeze } from '../common/deep-freeze';
import { AppError } from '../common/app-error';
import { TransactionRunner } from '../common/transaction';
import { validationError } from '../common/zod.pipe';
import { IngredientsRepository } from '../ingredients/ingredients.repository';
import { KitchenRolesRepository } from '../kitchen/kitchen-roles.repository';
import { KitchenService } from '../kitchen/kitchen.service';
import { SiteRepository, type SiteRow } from '../kitchen/site.repository';
import { RecipesRepository } from '../recipes/recipes.repository';
import { UsersRepository } from '../users/users.repository';
import { atThresholdPrecision, compare } from '../rules/core/compare';
import { sameData } from '../rules/core/same-data';
import { siteView, type SiteView } from '../rules/core/site-view';
import { indexBook, mixOfRecipe } from '../rules/core/tree';
import { RulesService } from '../rules/rules.service';

export interface ImportSummary {
  /** The book's first kitchen: created, updated or left as it was. */
  site: 'created' | 'updated' | 'unchanged';
  /** Every kitchen of the book by its id in the book (a book given as site: its one kitchen, under 'site'). */
  kitchens: Record<string, 'created' | 'updated' | 'unchanged'>;
  ingredients: { created: string[]; revised: string[]; unchanged: number };
  recipes: { created: string[]; revised: string[]; unchanged: number };
}

/** Where an item of the book is stored and which revision of it is current. */
export interface ItemHead {
  kind: 'ingredient' | 'recipe';
  /** The id of its row in the ingredients or recipes table. */
  rowId: number;
  revision: number;
}

/**
 * A kitchen as it stands: its site row and its view of the recipe book (the one-site book the
 * engine declares, with the kitchen's substitutions made), the whole book with every kitchen, and
 * the current revision of every item.
 */
export interface KitchenState {
  site: SiteRow;
  book: Book;
  /** What stood in for what at this kitchen, and the recipes for sale it does not sell. */
  view: SiteView;
  /** The whole recipe book: every kitchen, the shared ingredients and each kitchen's own, every recipe. */
  file: BookFile;
  /** Every kitchen, the book's owner first. */
  sites: SiteRow[];
  /** Every ingredient and recipe by its id in the book. */
  heads: Map<string, ItemHead>;
}

/**
 * Run inside a write's lock, on the kitchen as it stands, before anything is written: it throws to
 * refuse the write (an editor's base revision or a spreadsheet preview that is no longer current).
 */
export type WriteCheck = (state: KitchenState, t: Transaction) => Promise<void>;

/** Told, after a write has been saved, the ids of the recipes it wrote; a failure is logged, the write stays saved. */
export type RecipesWrittenListener = (ids: readonly string[]) => Promise<void>;

/** What a saved write changed: the ids of the ingredients and recipes written, and whether the kitchen's settings changed. */
export interface KitchenWritten {
  ingredients: readonly string[];
  recipes: readonly string[];
  site: boolean;
}
/**
 * Told inside every write's own transaction, after its rows and before its commit, with every
 * kitchen's view of the book as it is after the write: what a listener writes with `t` (the counter's events) is kept with the
 * write or not at all, and a listener that throws rolls the write back.
 */
export type KitchenWritingListener = (written: KitchenWritten, after: readonly Book[], t: Transaction) => Promise<void>;
/** Told after every saved write has committed, awaited before the write answers (the approvals' mail); it must not throw. */
export type KitchenSavedListener = (written: KitchenWritten) => Promise<void>;

/**
 * A kitchen read once is shared by every request until it changes, so nobody may change it in
 * place: frozen, a change throws instead of reaching another request.
 */
function freezeState(state: KitchenState): KitchenState {
  deepFreeze(state.book);
  deepFreeze(state.site);
  deepFreeze(state.view);
  deepFreeze(state.file);
  deepFreeze(state.sites);
  return state;
}

const changedAnything = (written: KitchenWritten) => written.ingredients.length > 0 || written.recipes.length > 0 || written.site;

const bodyOf = <T extends { id: string }>(item: T): Omit<T, 'id'> => {
  const { id: _id, ...body } = item;
  return body;
};

/**
 * The kitchen as one recipe book: export, import (all or nothing), and the checked write path
 * every change to ingredients and recipes goes through.
 */
@Injectable()
export class BooksService {
  private readonly logger = new Logger(BooksService.name);
  private readonly recipesWrittenListeners: RecipesWrittenListener[] = [];
  private readonly kitchenWritingListeners: KitchenWritingListener[] = [];
  private readonly kitchenSavedListeners: KitchenSavedListener[] = [];
  /** Each kitchen last read outside a write, by site id, under the site rows' versions it was read at. */
  private readonly lastRead = new Map<number, { key: string; state: Promise<KitchenState> }>();

  constructor(
    private readonly kitchen: KitchenService,
    private readonly sites: SiteRepository,
    private readonly ingredients: IngredientsRepository,
    private readonly recipes: RecipesRepository,
    private readonly rules: RulesService,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
    private readonly users: UsersRepository,
    private readonly kitchenRoles: KitchenRolesRepository,
  ) {}

  /**
   * After every write is saved, each listener is told which recipes it wrote: DeclarationsService
   * keeps the declaration of each new recipe revision, so the revision history can show it.
   */
  onRecipesWritten(listener: RecipesWrittenListener): void {
    this.recipesWrittenListeners.push(listener);
  }

  /** Inside every write (the editors, swaps, the spreadsheet import, book import), each listener is told what it changes: the counter's events. */
  onKitchenWriting(listener: KitchenWritingListener): void {
    this.kitchenWritingListeners.push(listener);
  }

  /**
   * After every saved write, awaited before the write answers, so what a listener queues (the
   * approvals' mail to the managers) is there when the caller reads on.
   */
  onKitchenSaved(listener: KitchenSavedListener): void {
    this.kitchenSavedListeners.push(listener);
  }

  private async kitchenWritten(written: KitchenWritten): Promise<void> {
    if (!changedAnything(written)) return;
    for (const listener of this.kitchenSavedListeners) await listener(written);
  }

  private async kitchenWriting(written: KitchenWritten, after: readonly Book[], t: Transaction): Promise<void> {
    if (!changedAnything(written)) return;
    for (const listener of this.kitchenWritingListeners) await listener(written, after, t);
  }

  /**
   * After the write is committed: what a listener does is kept beside it (a declaration is worked
   * out again whenever one is missing), so its failure is logged and the write still answers saved.
   */
  private async recipesWritten(ids: readonly string[]): Promise<void> {
    if (ids.length === 0) return;
    for (const listener of this.recipesWrittenListeners) {
      try {
        await listener(ids);
      } catch (e) {
        this.logger.warn(
          `The declarations of ${ids.join(', ')} were not kept after their save: ${e instanceof Error ? e.message : String(e)}`,
        );
      }
    }
  }

  /**
   * The request's kitchen as it stands now (KitchenService.current): its view of the recipe book
   * with the current revision of every item, and the whole book.
   */
  async state(t?: Transaction): Promise<KitchenState> {
    const sites = await this.sitesNow(t);
    return this.stateOf(this.kitchen.pick(sites), sites, t);
  }

  /**
   * Every kitchen's row: inside a write as its transaction sees them; outside one, this instance's
   * copy while no kitchen write has been heard (SiteRepository.allAtRequest), so a warm read of the
   * book costs no query. A write through this instance drops the copy when it commits; one through
   * another instance is heard within CHANGE_STALE_MS (1 s; typically one poll, 200 ms).
   */
  private sitesNow(t?: Transaction): Promise<readonly SiteRow[]> {
    return t ? this.sites.all(t) : this.sites.allAtRequest();
  }

  /** One kitchen as it stands now, as state gives the request's. */
  async stateAt(kitchen: SiteRow, t?: Transaction): Promise<KitchenState> {
    const sites = await this.sitesNow(t);
    const site = sites.find((s) => s.id === kitchen.id);
    if (!site) throw new AppError('not-found', `The kitchen ${kitchen.name} is no longer set up.`);
    return this.stateOf(site, sites, t);
  }

  private async stateOf(site: SiteRow, sites: readonly SiteRow[], t?: Transaction): Promise<KitchenState> {
    // Inside a write, always as the transaction sees it.
    if (t) return this.read(site, sites, t);
    // Outside one, the copy read last serves while the site rows' versions are those it was read
    // at: every write raises one of them (SiteRepository.lock on the owner, .update on a kitchen)
    // in its own transaction, on any API instance, and the change feed polls them (sitesNow), so
    // the copy's key says whether it still stands. The items are read after the site rows, so a
    // copy is never older than its key.
    const key = sites.map((s) => `${s.id}:${s.version}:${s.bookVersion}`).join(' ');
    const last = this.lastRead.get(site.id);
    if (last?.key === key) return last.state;
    const state = this.read(site, sites).then(freezeState);
    this.lastRead.set(site.id, { key, state });
    state.catch(() => {
      if (this.lastRead.get(site.id)?.state === state) this.lastRead.delete(site.id);
    });
    return state;
  }

  /** Every kitchen as it stands now, the owner first (what a change to shared items is shown against). */
  async everyKitchen(): Promise<KitchenState[]> {
    const sites = await this.sitesNow();
    return Promise.all(sites.map((s) => this.stateAt(s)));
  }

  private async read(site: SiteRow, rows: readonly SiteRow[], t?: Transaction): Promise<KitchenState> {
    const sites = [...rows];
    const owner = sites[0];
    const [ings, recs] = await Promise.all([this.ingredients.listCurrent(owner.id, t), this.recipes.listCurrent(owner.id, t)]);
    const heads = new Map<string, ItemHead>([
      ...ings.map((i) => [i.code, { kind: 'ingredient', rowId: i.id, revision: i.revision }] as const),
      ...recs.map((r) => [r.code, { kind: 'recipe', rowId: r.id, revision: r.revision }] as const),
    ]);
    const file = bookFileOf(sites, {
      ingredients: ings.map((i) => ({ id: i.code, ...i.body })),
      recipes: recs.map((r) => ({ id: r.code, ...r.body })),
    });
    const view = viewAt(file, site);
    return { site, book: view.book, view, file, sites, heads };
  }

  /** The whole recipe book as it stands now: every kitchen, in the recipe book format. */
  async exportBook(t?: Transaction): Promise<BookFile> {
    return (await this.state(t)).file;
  }

  /** What the request's kitchen makes differently from the shared book: its substitutions, and what it sells (GET /api/book/kitchen). */
  async kitchenMakes(): Promise<KitchenMakes> {
    const state = await this.state();
    const site = state.file.sites?.find((s) => s.id === state.view.site?.id);
    const ingredients = new Map(state.file.ingredients.map((i) => [i.id, i]));
    const recipes = new Map(state.file.recipes.map((r) => [r.id, r]));
    const named = (id: string): NamedItem => ({ id, name: ingredients.get(id)?.name ?? recipes.get(id)?.name ?? id });
    const lines = new Map<string, number>();
    for (const s of state.view.standIns) lines.set(s.replaces, (lines.get(s.replaces) ?? 0) + 1);
    return {
      code: state.site.code,
      name: state.site.name,
      substitutions: (site?.substitutions ?? []).map((sub) => {
        const own = ingredients.get(sub.with);
        return {
          replaces: named(sub.replaces),
          with: { ...named(sub.with), ...(own?.supplier ? { supplier: own.supplier } : {}) },
          ...(sub.note ? { note: sub.note } : {}),
          lines: lines.get(sub.replaces) ?? 0,
        };
      }),
      sells: site?.sells ? site.sells.map(named) : null,
      notSold: state.view.notSold.map(named),
    };
  }

  /**
   * Parses a book against the published schema; every problem names where it is. A book of
   * several kitchens is kept as it is (BookFile); its kitchens' views are what the engine declares.
   */
  parse(input: unknown): BookFile {
    const result = bookFileSchema.safeParse(input);
    if (!result.success)
      throw validationError(result.error, { place: bookPlace(input), code: 'book-invalid', lead: 'The recipe book is not valid.' });
    return result.data;
  }

  /**
   * Refuses a whole book (every kitchen) that cannot be declared: a book of several kitchens is
   * checked against the schema's cross-references (what each kitchen's own ingredients and
   * substitutions name), then every kitchen's view against the engine.
   */
  assertFileDeclarable(file: BookFile): void {
    if (file.sites) {
      const checked = bookFileSchema.safeParse(file);
      if (!checked.success)
        throw validationError(checked.error, { place: bookPlace(file), code: 'book-invalid', lead: 'The recipe book would not be valid.' });
      for (const s of file.sites) this.assertDeclarable(siteView(file, s.id).book);
    } else this.assertDeclarable(siteView(file).book);
  }

  /** Refuses a book the rules engine cannot declare (cycles, unknown ids, unweighable lines). */
  assertDeclarable(book: Book) {
    const problems = this.rules.check(book);
    if (problems.length > 0) throw bookRefused(problems);
  }

  /**
   * A bake loses weight, from nothing up to (not) all of it: a recipe's finished weight is above
   * zero (the schema says so) and at most what goes into it, its lines as weighed. `book` is the
   * kitchen with `recipes` in it, already found declarable (so every line can be weighed).
   */
  private assertBakeLoss(book: Book, recipes: BookRecipe[], place: (r: BookRecipe) => string) {
    const fields: FieldError[] = [];
    // One index of the book for every recipe: each one's weighed lines are worked out once.
    const index = indexBook(book);
    for (const r of recipes) {
      if (r.finishedWeightG === undefined) continue;
      const inBook = index.recipes.get(r.id);
      if (!inBook) throw new Error(`There is no recipe '${r.id}' in this book.`);
      const mix = atThresholdPrecision(mixOfRecipe(index, inBook));
      if (!compare(r.finishedWeightG, 'gt', mix)) continue;
      fields.push({
        path: place(r),
        message: `${r.name} is given a finished weight of ${r.finishedWeightG} g, more than the ${mix} g that goes into it; a bake can only lose weight. Give at most ${mix} g, or leave the finished weight out.`,
      });
    }
    if (fields.length > 0) throw new AppError('validation', fields.map((f) => f.message).join(' '), fields);
  }

  /**
   * Refuses items that name one id twice before they are merged by id into the kitchen, where
   * the second would silently replace the first and both be written to one row.
   */
  private assertDistinctIds(site: Book['site'], items: { ingredients?: BookIngredient[]; recipes?: BookRecipe[] }) {
    const book: Book = { crumbproofBook: 1, site, ingredients: items.ingredients ?? [], recipes: items.recipes ?? [] };
    const problems = this.rules.check(book).filter((p) => p.code === 'duplicate-id');
    if (problems.length > 0) throw bookRefused(problems);
  }

  /**
   * Imports a book into the installation, merging by id; all or nothing. Ingredients and recipes
   * are merged into the shared book; each kitchen of the book is matched by its id (a book given
   * as site: the one kitchen of an installation of one), created when it is new, its settings
   * taken from the book. Kitchens the book does not name are kept as they are. The installation's
   * first kitchen is everyone's already there; a later one is the importing manager's.
   */
  async importBook(input: unknown, meta: { authorId: number | null; note: string; address?: string }): Promise<ImportSummary> {
    const file = this.parse(input);
    const incoming = kitchensOf(file);
    this.assertDistinctIds(incoming[0].site, file);
    const imported = await this.tx.run(async (t) => {
      await this.sites.lock(t);
      const rows = await this.sites.all(t);
      const current = rows.length > 0 ? (await this.read(rows[0], rows, t)).file : null;
      const matched = matchKitchens(incoming, rows);
      const kitchenState: ImportSummary['kitchens'] = {};
      // The kitchens after the import, in the installation's order, new ones after.
      const after: SiteRow[] = [...rows];
      for (const { key, site, row } of matched) {
        const fields = {
          name: site.name,
          regime: site.regime,
          measures: site.measures ?? null,
          handles: site.handles,
          code: site.code,
          substitutions: site.substitutions,
          sells: site.sells,
          // A book without an address keeps the kitchen's own.
          ...(site.address !== undefined ? { address: site.address } : {}),
        };
        if (!row) {
          const created = await this.sites.create({ ...fields, address: site.address ?? meta.address ?? '' }, t);
          after.push(created);
          if (rows.length === 0 && after.length === 1) await this.kitchenRoles.grantEveryone(created.id, t);
          else if (meta.authorId !== null) await this.kitchenRoles.set(meta.authorId, created.id, 'manager', t);
          kitchenState[key] = 'created';
        } else if (!sameKitchen(row, fields)) {
          after[after.indexOf(row)] = await this.sites.update(row.id, fields, t);
          kitchenState[key] = 'updated';
        } else kitchenState[key] = 'unchanged';
      }
      const owner = after[0];
      const merged = bookFileOf(after, {
        ingredients: mergeById(current?.ingredients ?? [], file.ingredients),
        recipes: mergeById(current?.recipes ?? [], file.recipes),
      });
      this.assertFileDeclarable(merged);
      const ownView = viewAt(merged, owner).book;
      this.assertBakeLoss(ownView, file.recipes, (r) => `recipes.${file.recipes.indexOf(r)} (${r.id}).finishedWeightG`);
      const siteState = kitchenState[matched[0].key];

      const summary: ImportSummary = {
        site: siteState,
        kitchens: kitchenState,
        ingredients: { created: [], revised: [], unchanged: 0 },
        recipes: { created: [], revised: [], unchanged: 0 },
      };
      // Only what differs from the kitchen is written, in a few statements per thousand items.
      const changed = <T extends { id: string }>(items: readonly T[], existing: readonly T[], counts: ImportSummary['ingredients']) => {
        const before = new Map(existing.map((x) => [x.id, x]));
        return items.filter((item) => {
          const was = before.get(item.id);
          if (was && sameData(bodyOf(was), bodyOf(item))) {
            counts.unchanged++;
            return false;
          }
          (was ? counts.revised : counts.created).push(item.id);
          return true;
        });
      };
      const ingredients = changed(file.ingredients, current?.ingredients ?? [], summary.ingredients);
      await this.ingredients.writeMany(
        owner.id,
        ingredients.map((i) => ({ code: i.id, body: bodyOf(i) })),
        meta,
        t,
      );
      const recipes = changed(file.recipes, current?.recipes ?? [], summary.recipes);
      await this.recipes.writeMany(
        owner.id,
        recipes.map((r) => ({ code: r.id, body: bodyOf(r) })),
        meta,
        t,
      );
      const count = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;
      await this.audit.record(
        {
          action: 'book.imported',
          record: { kind: 'kitchen', id: owner.id },
          summary:
            `Imported the recipe book${meta.note ? ` (${meta.note})` : ''}: ${kitchensInWords(matched, kitchenState)}; ` +
            `${count(summary.ingredients.created.length, 'ingredient')} added, ${summary.ingredients.revised.length} revised; ` +
            `${count(summary.recipes.created.length, 'recipe')} added, ${summary.recipes.revised.length} revised.`,
          after: summary,
        },
        t,
      );
      await this.kitchenWriting(
        {
          ingredients: [...summary.ingredients.created, ...summary.ingredients.revised],
          recipes: [...summary.recipes.created, ...summary.recipes.revised],
          site: Object.values(kitchenState).some((k) => k !== 'unchanged'),
        },
        everyView(merged),
        t,
      );
      return summary;
    });
    await this.recipesWritten([...imported.recipes.created, ...imported.recipes.revised]);
    await this.kitchenWritten({
      ingredients: [...imported.ingredients.created, ...imported.ingredients.revised],
      recipes: [...imported.recipes.created, ...imported.recipes.revised],
      site: Object.values(imported.kitchens).some((k) => k !== 'unchanged'),
    });
    return imported;
  }

  /**
   * Writes ingredients and recipes as new revisions, after checking that the whole kitchen with
   * the changes can still be declared. All or nothing: when it cannot, nothing is saved.
   */
  async writeItems(
    changes: { ingredients?: BookFileIngredient[]; recipes?: BookRecipe[] },
    meta: { authorId: number | null; note: string },
    expect: 'new' | 'existing' | 'any',
    /** The write's one audit event (a swap, an import); left out, an editor's save of its one item. */
    audit?: Pick<AuditEntry, 'action' | 'record' | 'summary'>,
    /** Refuses the write when what it was prepared from is no longer current. */
    check?: WriteCheck,
  ): Promise<{ id: string; revision: number }[]> {
    const written = await this.tx.run(async (t) => {
      await this.sites.lock(t);
      const state = await this.state(t);
      const { site, book, file } = state;
      if (check) await check(state, t);
      this.assertDistinctIds(book.site, changes);
      // Ids are the whole book's, every kitchen's own ingredients too.
      const all = new Set([...file.ingredients, ...file.recipes].map((x) => x.id));
      for (const [kind, items, own] of [
        ['ingredient', changes.ingredients ?? [], file.ingredients],
        ['recipe', changes.recipes ?? [], file.recipes],
      ] as const) {
        for (const item of items) {
          const exists = own.some((x) => x.id === item.id);
          if (expect === 'new' && all.has(item.id)) {
            throw new AppError('conflict', `The id '${item.id}' is already used. Choose another id.`, [
              { path: 'id', message: 'This id is already used.' },
            ]);
          }
          if (expect === 'existing' && !exists) throw new AppError('not-found', `There is no ${kind} '${item.id}'.`);
          if (!exists && all.has(item.id)) {
            throw new AppError('conflict', `The id '${item.id}' is already used by a${kind === 'recipe' ? 'n ingredient' : ' recipe'}.`);
          }
        }
      }
      const ingredients = keepOwnership(file, changes.ingredients ?? []);
      // A new product for sale goes on sale at the kitchen it is created at, which a kitchen that
      // sells only what its list names adds it to; the other kitchens' lists are theirs to change.
      const created = (changes.recipes ?? []).filter((r) => r.sale && !state.heads.has(r.id)).map((r) => r.id);
      const sellsAfter =
        site.sells !== null && created.length > 0 ? [...site.sells, ...created.filter((id) => !site.sells!.includes(id))] : null;
      const mergedFile: BookFile = {
        ...file,
        ...(sellsAfter && file.sites ? { sites: file.sites.map((s) => (s.id === site.code ? { ...s, sells: sellsAfter } : s)) } : {}),
        ingredients: mergeById(file.ingredients, ingredients),
        recipes: mergeById(file.recipes, changes.recipes ?? []),
      };
      this.assertFileDeclarable(mergedFile);
      const merged = viewAt(mergedFile, site).book;
      const recipes = changes.recipes ?? [];
      this.assertBakeLoss(merged, recipes, (r) => (recipes.length === 1 ? 'finishedWeightG' : `recipes.${r.id}.finishedWeightG`));
      const owner = state.sites[0];
      const written: { id: string; revision: number }[] = [];
      for (const ing of ingredients) {
        written.push({ id: ing.id, revision: await this.ingredients.write(owner.id, ing.id, bodyOf(ing), meta, t) });
      }
      for (const rec of changes.recipes ?? []) {
        written.push({ id: rec.id, revision: await this.recipes.write(owner.id, rec.id, bodyOf(rec), meta, t) });
      }
      if (sellsAfter) await this.sites.update(site.id, { sells: sellsAfter }, t);
      await this.audit.record(itemsWritten(file, changes, written, meta.note, audit), t);
      await this.kitchenWriting(
        { ingredients: (changes.ingredients ?? []).map((i) => i.id), recipes: (changes.recipes ?? []).map((r) => r.id), site: false },
        everyView(mergedFile),
        t,
      );
      return written;
    });
    await this.recipesWritten((changes.recipes ?? []).map((r) => r.id));
    await this.kitchenWritten({
      ingredients: (changes.ingredients ?? []).map((i) => i.id),
      recipes: (changes.recipes ?? []).map((r) => r.id),
      site: false,
    });
    return written;
  }

  /**
   * An editor's save of one item. A new one (expect 'new') has no base; an existing one names the
   * revision the editor started from, and is refused (stale-base, nothing saved) when someone
   * else saved the item since: the refusal says who saved which revision when, and what changed.
   */
  async writeItem(
    kind: 'ingredient' | 'recipe',
    item: BookIngredient | BookRecipe,
    meta: { authorId: number | null; note: string },
    expect: { new: true } | { baseRevision: number },
  ): Promise<number> {
    const changes = kind === 'ingredient' ? { ingredients: [item as BookIngredient] } : { recipes: [item as BookRecipe] };
    const check: WriteCheck | undefined =
      'baseRevision' in expect ? (state, t) => this.assertBase(kind, item.id, expect.baseRevision, state, t) : undefined;
    const [written] = await this.writeItems(changes, meta, 'new' in expect ? 'new' : 'existing', undefined, check);
    return written.revision;
  }

  /** Runs a check on the kitchen as it stands inside the kitchen's lock, writing nothing (an import with nothing to write). */
  async readLocked(check: WriteCheck): Promise<void> {
    await this.tx.run(async (t) => {
      await this.sites.lock(t);
      await check(await this.state(t), t);
    });
  }

  /** Who saved the current revision of each item, and when (read in the write's transaction). */
  async currentSaves(
    state: KitchenState,
    ids: readonly string[],
    t: Transaction,
  ): Promise<Map<string, { revision: number; authorName: string | null; savedAt: string }>> {
    const authors = new Map((await this.users.list()).map((u) => [u.id, u.name]));
    const found = new Map<string, { revision: number; authorName: string | null; savedAt: string }>();
    for (const id of ids) {
      const head = state.heads.get(id);
      if (!head) continue;
      const repo = head.kind === 'ingredient' ? this.ingredients : this.recipes;
      const [current] = await repo.revisionsFrom(head.rowId, head.revision, t);
      if (current)
        found.set(id, {
          revision: current.revision,
          authorName: current.authorId ? (authors.get(current.authorId) ?? null) : null,
          savedAt: current.createdAt.toISOString(),
        });
    }
    return found;
  }

  /** Every write checks its base against the current revision inside the kitchen's lock: no save replaces one it has not seen. */
  private async assertBase(kind: 'ingredient' | 'recipe', id: string, base: number, state: KitchenState, t: Transaction): Promise<void> {
    const head = state.heads.get(id);
    // An id that is not this kind's is refused by the write itself, as not found or as used.
    if (!head || head.kind !== kind || head.revision === base) return;
    if (base > head.revision) {
      throw new AppError(
        'validation',
        `The ${kind} '${id}' has no revision ${base}: its current revision is ${head.revision}. Reload it, then save again.`,
        [{ path: 'baseRevision', message: `There is no revision ${base}; the current one is ${head.revision}.` }],
      );
    }
    const stale = await this.staleBase(kind, id, base, state, t);
    const last = stale.saves[stale.saves.length - 1];
    const who = (save: OtherSave) => save.authorName ?? 'someone without a kitchen account';
    const what = stale.changes.length > 0 ? stale.changes.map((c) => c.text).join(' ') : 'No field changed.';
    throw new AppError(
      'stale-base',
      `Someone else saved this ${kind} while you were editing: ${who(last)} saved revision ${last.revision} at ${savedAtWords(last.savedAt)}` +
        `${stale.saves.length > 1 ? ` (${stale.saves.length} saves since your revision ${base})` : ''}. ${what} ` +
        `Nothing was saved. Reload their version, or copy your values over theirs and save again.`,
      undefined,
      undefined,
      { stale },
    );
  }

  /** The saves of an item after `base`, each with what it changed, and what they changed together. */
  private async staleBase(
    kind: 'ingredient' | 'recipe',
    id: string,
    base: number,
    state: KitchenState,
    t: Transaction,
  ): Promise<StaleBase> {
    const head = state.heads.get(id)!;
    const names = new Map([...state.file.ingredients, ...state.file.recipes].map((x) => [x.id, x.name]));
    const revisions =
      kind === 'ingredient'
        ? await this.ingredients.revisionsFrom(head.rowId, base, t)
        : await this.recipes.revisionsFrom(head.rowId, base, t);
    const diff = (before: (typeof revisions)[number]['body'], after: (typeof revisions)[number]['body']) =>
      kind === 'ingredient'
        ? diffIngredient(before as Omit<BookIngredient, 'id'>, after as Omit<BookIngredient, 'id'>)
        : diffRecipe(before as Omit<BookRecipe, 'id'>, after as Omit<BookRecipe, 'id'>, (use) => names.get(use));
    const authors = new Map((await this.users.list()).map((u) => [u.id, u.name]));
    const [first, ...later] = revisions;
    const saves = later.map((r, i) => ({
      revision: r.revision,
      authorId: r.authorId,
      authorName: r.authorId ? (authors.get(r.authorId) ?? null) : null,
      savedAt: r.createdAt.toISOString(),
      note: r.note,
      changes: diff(i === 0 ? first.body : later[i - 1].body, r.body),
    }));
    const current = revisions[revisions.length - 1];
    return {
      kind,
      id,
      name: current.body.name,
      baseRevision: base,
      currentRevision: head.revision,
      saves,
      changes: diff(first.body, current.body),
      current: { id, ...current.body },
    };
  }
}

/** "2026-12-02 15:50 UTC": when a save was made, as a refusal's message says it. */
export function savedAtWords(iso: string): string {
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}

/**
 * The audit event of a write of items: the record before (null for a new one) and after, one item
 * as its body, several by kind and id.
 */
function itemsWritten(
  book: Pick<BookFile, 'ingredients' | 'recipes'>,
  changes: { ingredients?: BookIngredient[]; recipes?: BookRecipe[] },
  written: { id: string; revision: number }[],
  note: string,
  audit: Pick<AuditEntry, 'action' | 'record' | 'summary'> | undefined,
): AuditEntry {
  const previous = (item: { id: string }, kind: 'ingredient' | 'recipe') => {
    const found = (kind === 'ingredient' ? book.ingredients : book.recipes).find((x) => x.id === item.id);
    return found ? bodyOf(found) : null;
  };
  const items = [
    ...(changes.ingredients ?? []).map((i) => ({ kind: 'ingredient' as const, item: i })),
    ...(changes.recipes ?? []).map((r) => ({ kind: 'recipe' as const, item: r })),
  ];
  if (!audit && items.length === 1) {
    const [{ kind, item }] = items;
    const before = previous(item, kind);
    const revision = written.find((w) => w.id === item.id)?.revision;
    return {
      action: kind === 'ingredient' ? 'ingredient.saved' : 'recipe.saved',
      record: { kind, id: item.id },
      summary: `${before ? 'Revised' : 'Created'} the ${kind} ${item.name} (${item.id}), revision ${revision}: ${note}.`,
      before,
      after: bodyOf(item),
    };
  }
  const byKind = (pick: (entry: (typeof items)[number]) => unknown) => ({
    ingredients: Object.fromEntries(items.filter((e) => e.kind === 'ingredient').map((e) => [e.item.id, pick(e)])),
    recipes: Object.fromEntries(items.filter((e) => e.kind === 'recipe').map((e) => [e.item.id, pick(e)])),
  });
  return {
    action: audit?.action ?? 'recipe.saved',
    record: audit?.record ?? null,
    summary: audit?.summary ?? `${note}: ${written.map((w) => `${w.id} (revision ${w.revision})`).join(', ')}.`,
    before: byKind((e) => previous(e.item, e.kind)),
    after: byKind((e) => bodyOf(e.item)),
  };
}

function mergeById<T extends { id: string }>(base: T[], incoming: T[]): T[] {
  const map = new Map(base.map((x) => [x.id, x]));
  for (const x of incoming) map.set(x.id, x);
  return [...map.values()];
}

/** Shown in full in the message; the rest are counted (all are in `problems`). */
const PROBLEMS_IN_MESSAGE = 10;

/**
 * Refuses a book the rules engine cannot declare: every problem goes to the client as it is, with
 * the ids it involves, and the message says them all in words (the first ten, then how many more).
 */
export function bookRefused(problems: BookProblem[]): AppError {
  const shown = problems.slice(0, PROBLEMS_IN_MESSAGE).map((p) => p.message);
  const rest = problems.length - shown.length;
  const more = rest > 0 ? ` And ${rest} more problem${rest > 1 ? 's' : ''}.` : '';
  return new AppError(problems[0].code, `${shown.join(' ')}${more}`, undefined, problems);
}

/**
 * A kitchen's own ingredient stays its own, and a shared one shared: a save that leaves onlyAt out
 * keeps what the book has, and one that names another kitchen (or a new item naming one, which
 * would stand in nowhere without a substitution) is refused. Moving an ingredient between kitchens
 * is a change of the recipe book, with its substitutions.
 */
function keepOwnership(file: BookFile, incoming: readonly BookFileIngredient[]): BookFileIngredient[] {
  const current = new Map(file.ingredients.map((i) => [i.id, i]));
  return incoming.map((item) => {
    const was = current.get(item.id);
    if (item.onlyAt === undefined) return was?.onlyAt !== undefined ? { ...item, onlyAt: was.onlyAt } : item;
    if (was && was.onlyAt === item.onlyAt) return item;
    const where = was?.onlyAt !== undefined ? `is kept at the kitchen '${was.onlyAt}'` : was ? 'is shared by every kitchen' : 'is new';
    throw new AppError(
      'validation',
      `${item.name} ${where}, and a save cannot make it the kitchen '${item.onlyAt}'s own: change that in the recipe book, with the kitchen's substitution, and import it.`,
      [{ path: 'onlyAt', message: 'A save cannot change which kitchen keeps an ingredient.' }],
    );
  });
}

/** A kitchen of a book being imported: its key in the summary, and its fields as a site row keeps them. */
interface IncomingKitchen {
  key: string;
  site: Site & { code: string | null; substitutions: Substitution[]; sells: string[] | null };
}

/** The kitchens a book gives: its one kitchen (a book given as site, under the key 'site'), or each of its sites. */
function kitchensOf(file: BookFile): IncomingKitchen[] {
  if (file.site) return [{ key: 'site', site: { ...file.site, code: null, substitutions: [], sells: null } }];
  return (file.sites ?? []).map(({ id, substitutions, sells, ...site }) => ({
    key: id,
    site: { ...site, code: id, substitutions: substitutions ?? [], sells: sells ?? null },
  }));
}

/**
 * Each kitchen of the book with the installation's row it updates (none: a new one). A kitchen is
 * matched by its id in the book; the book's first kitchen also takes the installation's one
 * kitchen when that has no id yet (a kitchen set up from a book given as site). A book given as
 * site reaches the one kitchen of an installation of one, and is refused by one of several.
 */
function matchKitchens(incoming: IncomingKitchen[], rows: SiteRow[]): Array<IncomingKitchen & { row: SiteRow | null }> {
  const byCode = new Map(rows.flatMap((r) => (r.code !== null ? [[r.code, r] as const] : [])));
  if (incoming[0].site.code === null && rows.length > 1)
    throw new AppError(
      'book-invalid',
      `This installation has ${rows.length} kitchens (${rows.map((r) => r.code ?? r.name).join(', ')}), and this book gives one kitchen as site, without an id: give the book its kitchens as sites, each with its id.`,
      [{ path: 'site', message: 'Give the kitchens as sites, each with its id.' }],
    );
  return incoming.map((k, i) => {
    if (k.site.code === null) return { ...k, row: rows[0] ?? null };
    const row = byCode.get(k.site.code) ?? (i === 0 && rows.length === 1 && rows[0].code === null ? rows[0] : null);
    return { ...k, row };
  });
}

/** Whether a kitchen's row already holds every field the book gives it. */
function sameKitchen(row: SiteRow, fields: Partial<SiteRow>): boolean {
  return (Object.keys(fields) as (keyof SiteRow)[]).every((k) => sameData(row[k] ?? null, fields[k] ?? null));
}

function kitchensInWords(matched: IncomingKitchen[], state: ImportSummary['kitchens']): string {
  if (matched.length === 1) return `kitchen ${state[matched[0].key]}`;
  return matched.map((k) => `${k.site.name} ${state[k.key]}`).join(', ');
}

/**
 * The whole book as the installation keeps it: a book given as site for an installation of one
 * kitchen without an id (as it was set up), or every kitchen as sites.
 */
export function bookFileOf(sites: readonly SiteRow[], items: Pick<BookFile, 'ingredients' | 'recipes'>): BookFile {
  const fields = (s: SiteRow): Site => ({
    name: s.name,
    ...(s.address ? { address: s.address } : {}),
    regime: s.regime,
    ...(s.measures ? { measures: s.measures } : {}),
    handles: s.handles,
  });
  if (sites.length === 1 && sites[0].code === null) return { crumbproofBook: 1, site: fields(sites[0]), ...items };
  return {
    crumbproofBook: 1,
    sites: sites.map((s) => ({
      id: s.code ?? `kitchen-${s.id}`,
      ...fields(s),
      ...(s.substitutions.length > 0 ? { substitutions: s.substitutions } : {}),
      ...(s.sells !== null ? { sells: s.sells } : {}),
    })),
    ...items,
  };
}

/** One kitchen's view of the whole book (see siteView). */
export function viewAt(file: BookFile, site: SiteRow): SiteView {
  return file.sites ? siteView(file, site.code ?? `kitchen-${site.id}`) : siteView(file);
}

/** Every kitchen's view of the whole book: what a write is told it changed. */
function everyView(file: BookFile): Book[] {
  return file.sites ? file.sites.map((s) => siteView(file, s.id).book) : [siteView(file).book];
}
