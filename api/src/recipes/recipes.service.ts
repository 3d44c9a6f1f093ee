import { Injectable } from '@nestjs/common';
import {
  diffDeclarations,
  type BookRecipe,
  type RecipeSave,
  type RecipeRevisionView,
  type RecipeView,
  type Regime,
} from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { usedIn } from '../rules/core/book-graph';
import { BooksService } from '../books/books.service';
import { DeclarationsService } from '../declarations/declarations.service';
import { KitchenService } from '../kitchen/kitchen.service';
import { UsersRepository } from '../users/users.repository';
import { RecipesRepository } from './recipes.repository';

@Injectable()
export class RecipesService {
  constructor(
    private readonly repo: RecipesRepository,
    private readonly books: BooksService,
    private readonly declarations: DeclarationsService,
    private readonly kitchen: KitchenService,
    private readonly users: UsersRepository,
  ) {}

  private async siteId() {
    return (await this.kitchen.owner()).id;
  }

  async list(): Promise<RecipeView[]> {
    const rows = await this.repo.listCurrent(await this.siteId());
    return rows.map((r) => ({ id: r.code, ...r.body, revision: r.revision, updatedAt: r.updatedAt.toISOString() }));
  }

  async get(code: string): Promise<RecipeView> {
    const r = await this.repo.findCurrent(await this.siteId(), code);
    if (!r) throw new AppError('not-found', `There is no recipe '${code}'.`);
    return { id: r.code, ...r.body, revision: r.revision, updatedAt: r.updatedAt.toISOString() };
  }

  async history(code: string): Promise<RecipeRevisionView[]> {
    const site = await this.siteId();
    const revs = await this.repo.history(site, code);
    if (!revs) throw new AppError('not-found', `There is no recipe '${code}'.`);
    const head = (await this.repo.findCurrent(site, code))!;
    const saved = await this.declarations.savedByRevision(head.id);
    const names = new Map((await this.users.list()).map((u) => [u.id, u.name]));
    const oldestFirst = [...revs].reverse();
    const views = oldestFirst.map((r, i) => {
      const declaration = saved.get(r.revision) ?? null;
      const previous = i > 0 ? (saved.get(oldestFirst[i - 1].revision) ?? null) : null;
      return {
        revision: r.revision,
        note: r.note,
        authorId: r.authorId,
        authorName: r.authorId ? (names.get(r.authorId) ?? null) : null,
        createdAt: r.createdAt.toISOString(),
        body: r.body,
        declaration,
        diff: declaration && previous ? diffDeclarations(previous, declaration) : null,
      };
    });
    return views.reverse();
  }

  /**
   * A product's declaration for a regime (the kitchen's by default), from the store when nothing it
   * depends on has changed, as the bytes the route sends (DeclarationsService.preparedFor).
   */
  declaration(code: string, regime?: Regime) {
    return this.declarations.preparedFor(code, regime);
  }

  /** Every recipe that uses this one at any depth. */
  async usedIn(code: string) {
    const { book } = await this.books.state();
    if (!book.recipes.some((r) => r.id === code)) throw new AppError('not-found', `There is no recipe '${code}'.`);
    return usedIn(book, code);
  }

  async create(item: BookRecipe, authorId: number) {
    await this.books.writeItem('recipe', item, { authorId, note: 'Created' }, { new: true });
    return this.get(item.id);
  }

  /** Saves a new revision of an existing recipe; refused (stale-base) when `save.baseRevision` is no longer its current revision. */
  async update(code: string, save: RecipeSave, authorId: number, note?: string) {
    const { baseRevision, ...item } = save;
    if (item.id !== code)
      throw new AppError('validation', `The body's id '${item.id}' does not match '${code}'.`, [
        { path: 'id', message: 'Must match the address.' },
      ]);
    await this.books.writeItem('recipe', item, { authorId, note: note ?? 'Edited' }, { baseRevision });
    return this.get(code);
  }
}
