import { Injectable, Logger } from '@nestjs/common';
import {
  bookFileSchema,
  bookPlace,
  type Book,
  type BookFile,
  type BookIngredient,
  type BookProblem,
  type BookRecipe,
  type FieldError,
  type OtherSave,
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
import { KitchenService } from '../kitchen/kitchen.service';
import { SiteRepository, type SiteRow } from '../kitchen/site.repository';
import { RecipesRepository } from '../recipes/recipes.repository';
import { UsersRepository } from '../users/users.repository';
import { atThresholdPrecision, compare } from '../rules/core/compare';
import { sameData } from '../rules/core/same-data';
import { siteView } from '../rules/core/site-view';
import { buildTree } from '../rules/core/tree';
import { RulesService } from '../rules/rules.service';

export interface ImportSummary {
  site: 'created' | 'updated' | 'unchanged';
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

/** The kitchen as it stands: its site row, its recipe book, and the current revision of every item. */
export interface KitchenState {
  site: SiteRow;
  book: Book;
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
 * Told inside every write's own transaction, after its rows and before its commit, with the book as
 * it is after the write: what a listener writes with `t` (the counter's events) is kept with the
 * write or not at all, and a listener that throws rolls the write back.
 */
export type KitchenWritingListener = (written: KitchenWritten, after: Book, t: Transaction) => Promise<void>;
/** Told after every saved write has committed, awaited before the write answers (the approvals' mail); it must not throw. */
export type KitchenSavedListener = (written: KitchenWritten) => Promise<void>;

/**
 * A kitchen read once is shared by every request until it changes, so nobody may change it in
 * place: frozen, a change throws instead of reaching another request.
 */
function freezeState(state: KitchenState): KitchenState {
  deepFreeze(state.book);
  deepFreeze(state.site);
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
  /** The kitchen last read outside a write, under the site row's versions it was read at. */
  private lastRead: { key: string; state: Promise<KitchenState> } | null = null;

  constructor(
    private readonly kitchen: KitchenService,
    private readonly sites: SiteRepository,
    private readonly ingredients: IngredientsRepository,
    private readonly recipes: RecipesRepository,
    private readonly rules: RulesService,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
    private readonly users: UsersRepository,
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

  private async kitchenWriting(written: KitchenWritten, after: Book, t: Transaction): Promise<void> {
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

  /** The whole kitchen as it stands now: the recipe book with the current revision of every item. */
  async state(t?: Transaction): Promise<KitchenState> {
    const site = await this.kitchen.current(t);
    // Inside a write, always as the transaction sees it.
    if (t) return this.read(site, t);
    // Outside one, the copy read last serves while the site row's versions are those it was read
    // at: every write raises one of them (SiteRepository.lock, .update) in its own transaction, on
    // any API instance, so one small read of the site row tells whether the copy still stands.
    // The items are read after the site row, so a copy is never older than its key.
    const key = `${site.id}:${site.version}:${site.bookVersion}`;
    if (this.lastRead?.key !== key) {
      const state = this.read(site).then(freezeState);
      this.lastRead = { key, state };
      state.catch(() => {
        if (this.lastRead?.state === state) this.lastRead = null;
      });
    }
    return this.lastRead.state;
  }

  private async read(site: SiteRow, t?: Transaction): Promise<KitchenState> {
    const [ings, recs] = await Promise.all([this.ingredients.listCurrent(site.id, t), this.recipes.listCurrent(site.id, t)]);
    const heads = new Map<string, ItemHead>([
      ...ings.map((i) => [i.code, { kind: 'ingredient', rowId: i.id, revision: i.revision }] as const),
      ...recs.map((r) => [r.code, { kind: 'recipe', rowId: r.id, revision: r.revision }] as const),
    ]);
    const book: Book = {
      crumbproofBook: 1,
      site: {
        name: site.name,
        ...(site.address ? { address: site.address } : {}),
        regime: site.regime,
        ...(site.measures ? { measures: site.measures } : {}),
        handles: site.handles,
      },
      ingredients: ings.map((i) => ({ id: i.code, ...i.body })),
      recipes: recs.map((r) => ({ id: r.code, ...r.body })),
    };
    return { site, book, heads };
  }

  /** The whole kitchen as it stands now, in the recipe book format. */
  async exportBook(t?: Transaction): Promise<Book> {
    return (await this.state(t)).book;
  }

  /**
   * Parses a book against the published schema; every problem names where it is. The kitchen
   * holds one site: a book of one site given as sites reads as the same book given as site, and a
   * book of several sites is refused, as is what the kitchen cannot keep of a site yet (its
   * substitutions, a sells list that leaves a recipe for sale out).
   */
  parse(input: unknown): Book {
    const result = bookFileSchema.safeParse(input);
    if (!result.success)
      throw validationError(result.error, { place: bookPlace(input), code: 'book-invalid', lead: 'The recipe book is not valid.' });
    const refused = oneKitchenProblems(result.data);
    if (refused.length > 0)
      throw new AppError(
        'book-invalid',
        `The recipe book is not valid. ${refused.map((f) => `${f.path}: ${f.message}`).join(' ')}`,
        refused,
      );
    return siteView(result.data).book;
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
    for (const r of recipes) {
      if (r.finishedWeightG === undefined) continue;
      const mix = atThresholdPrecision(buildTree(book, r.id).mixG);
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

  /** Imports a book into the kitchen, merging by id; all or nothing. */
  async importBook(input: unknown, meta: { authorId: number | null; note: string; address?: string }): Promise<ImportSummary> {
    const book = this.parse(input);
    this.assertDistinctIds(book.site, book);
    const imported = await this.tx.run(async (t) => {
      await this.sites.lock(t);
      const site = await this.kitchen.find(t);
      const current = site ? (await this.read(site, t)).book : null;
      const merged: Book = {
        ...book,
        ingredients: mergeById(current?.ingredients ?? [], book.ingredients),
        recipes: mergeById(current?.recipes ?? [], book.recipes),
      };
      this.assertDeclarable(merged);
      this.assertBakeLoss(merged, book.recipes, (r) => `recipes.${book.recipes.indexOf(r)} (${r.id}).finishedWeightG`);

      let siteRow = site;
      let siteState: ImportSummary['site'] = 'unchanged';
      const siteFields = {
        name: book.site.name,
        regime: book.site.regime,
        measures: book.site.measures ?? null,
        handles: book.site.handles,
        ...(book.site.address !== undefined ? { address: book.site.address } : {}),
      };
      // A book without an address keeps the kitchen's own.
      const kept = current?.site.address;
      const wanted = book.site.address === undefined && kept ? { ...book.site, address: kept } : book.site;
      if (!siteRow) {
        siteRow = await this.sites.create({ ...siteFields, address: book.site.address ?? meta.address ?? '' }, t);
        siteState = 'created';
      } else if (!sameData(current?.site, wanted)) {
        siteRow = await this.sites.update(siteRow.id, siteFields, t);
        siteState = 'updated';
      }

      const summary: ImportSummary = {
        site: siteState,
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
      const ingredients = changed(book.ingredients, current?.ingredients ?? [], summary.ingredients);
      await this.ingredients.writeMany(
        siteRow.id,
        ingredients.map((i) => ({ code: i.id, body: bodyOf(i) })),
        meta,
        t,
      );
      const recipes = changed(book.recipes, current?.recipes ?? [], summary.recipes);
      await this.recipes.writeMany(
        siteRow.id,
        recipes.map((r) => ({ code: r.id, body: bodyOf(r) })),
        meta,
        t,
      );
      const count = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;
      await this.audit.record(
        {
          action: 'book.imported',
          record: { kind: 'kitchen', id: siteRow.id },
          summary:
            `Imported the recipe book${meta.note ? ` (${meta.note})` : ''}: kitchen ${siteState}; ` +
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
          site: siteState !== 'unchanged',
        },
        merged,
        t,
      );
      return summary;
    });
    await this.recipesWritten([...imported.recipes.created, ...imported.recipes.revised]);
    await this.kitchenWritten({
      ingredients: [...imported.ingredients.created, ...imported.ingredients.revised],
      recipes: [...imported.recipes.created, ...imported.recipes.revised],
      site: imported.site !== 'unchanged',
    });
    return imported;
  }

  /**
   * Writes ingredients and recipes as new revisions, after checking that the whole kitchen with
   * the changes can still be declared. All or nothing: when it cannot, nothing is saved.
   */
  async writeItems(
    changes: { ingredients?: BookIngredient[]; recipes?: BookRecipe[] },
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
      const { site, book } = state;
      if (check) await check(state, t);
      this.assertDistinctIds(book.site, changes);
      const all = new Set([...book.ingredients, ...book.recipes].map((x) => x.id));
      for (const [kind, items, own] of [
        ['ingredient', changes.ingredients ?? [], book.ingredients],
        ['recipe', changes.recipes ?? [], book.recipes],
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
      const merged: Book = {
        ...book,
        ingredients: mergeById(book.ingredients, changes.ingredients ?? []),
        recipes: mergeById(book.recipes, changes.recipes ?? []),
      };
      this.assertDeclarable(merged);
      const recipes = changes.recipes ?? [];
      this.assertBakeLoss(merged, recipes, (r) => (recipes.length === 1 ? 'finishedWeightG' : `recipes.${r.id}.finishedWeightG`));
      const written: { id: string; revision: number }[] = [];
      for (const ing of changes.ingredients ?? []) {
        written.push({ id: ing.id, revision: await this.ingredients.write(site.id, ing.id, bodyOf(ing), meta, t) });
      }
      for (const rec of changes.recipes ?? []) {
        written.push({ id: rec.id, revision: await this.recipes.write(site.id, rec.id, bodyOf(rec), meta, t) });
      }
      await this.audit.record(itemsWritten(book, changes, written, meta.note, audit), t);
      await this.kitchenWriting(
        { ingredients: (changes.ingredients ?? []).map((i) => i.id), recipes: (changes.recipes ?? []).map((r) => r.id), site: false },
        merged,
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
    const names = new Map([...state.book.ingredients, ...state.book.recipes].map((x) => [x.id, x.name]));
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
  book: Book,
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
 * What a book holds that this kitchen, one site, cannot keep: several sites, a site's
 * substitutions, and a sells list leaving out a recipe for sale (the kitchen sells every one).
 */
function oneKitchenProblems(file: BookFile): FieldError[] {
  const sites = file.sites ?? [];
  if (sites.length > 1)
    return [
      {
        path: 'sites',
        message: `This book has ${sites.length} sites (${sites.map((s) => s.id).join(', ')}), and Crumbproof here holds one kitchen: import a book of one site, given as site or as sites with that site alone.`,
      },
    ];
  const [site] = sites;
  if (!site) return [];
  const place = `sites.0 (${site.id})`;
  const fields: FieldError[] = [];
  if (site.substitutions && site.substitutions.length > 0)
    fields.push({
      path: `${place}.substitutions`,
      message: `The kitchen keeps no substitutions yet, so its recipes would not say which ingredient stands in for which: name the ingredient the kitchen uses in its recipes' lines, or leave the substitutions out.`,
    });
  const sells = new Set(site.sells ?? file.recipes.map((r) => r.id));
  const unsold = file.recipes.filter((r) => r.sale && !sells.has(r.id));
  if (unsold.length > 0)
    fields.push({
      path: `${place}.sells`,
      message: `The kitchen sells every recipe with sale details, and sells leaves out ${unsold.map((r) => r.name).join(', ')}: list them too, or leave sells out.`,
    });
  return fields;
}
