import { Injectable } from '@nestjs/common';
import {
  ALLERGEN_SOURCES,
  sourceOf,
  type BookIngredient,
  type IngredientSave,
  type IngredientRevisionView,
  type IngredientView,
} from '@crumbproof/shared';
import { z } from 'zod';
import { AppError } from '../common/app-error';
import type { Page } from '../common/total-count';
import { usedIn } from '../rules/core/book-graph';
import { BooksService } from '../books/books.service';
import { KitchenService } from '../kitchen/kitchen.service';
import { UsersRepository } from '../users/users.repository';
import { IngredientsRepository } from './ingredients.repository';

export const ingredientQuerySchema = z.strictObject({
  q: z.string().trim().max(100).optional(),
  source: z.enum(ALLERGEN_SOURCES).optional(),
  sort: z.enum(['name', 'supplier', 'updated']).optional(),
  limit: z.coerce.number().int().min(1).max(1000).optional(),
  offset: z.coerce.number().int().min(0).optional(),
});
export type IngredientQuery = z.infer<typeof ingredientQuerySchema>;

@Injectable()
export class IngredientsService {
  constructor(
    private readonly repo: IngredientsRepository,
    private readonly books: BooksService,
    private readonly kitchen: KitchenService,
    private readonly users: UsersRepository,
  ) {}

  private async siteId() {
    return (await this.kitchen.owner()).id;
  }

  async list(query: IngredientQuery = {}): Promise<Page<IngredientView>> {
    const rows = await this.repo.listCurrent(await this.siteId());
    let items = rows.map((r) => ({ id: r.code, ...r.body, revision: r.revision, updatedAt: r.updatedAt.toISOString() }));
    if (query.q) {
      const q = query.q.toLowerCase();
      items = items.filter((i) => [i.name, i.id, i.supplier ?? '', i.supplierCode ?? ''].some((f) => f.toLowerCase().includes(q)));
    }
    if (query.source) {
      const has = (list: IngredientView['mayContain'] | undefined) => (list ?? []).some((c) => sourceOf(c) === query.source);
      items = items.filter((i) => has(i.contains));
    }
    if (query.sort === 'updated') items.sort((a, b) => b.updatedAt.localeCompare(a.updatedAt));
    else if (query.sort === 'supplier')
      items.sort((a, b) => (a.supplier ?? '').localeCompare(b.supplier ?? '') || a.name.localeCompare(b.name));
    const total = items.length;
    const offset = query.offset ?? 0;
    return { items: query.limit ? items.slice(offset, offset + query.limit) : items.slice(offset), total };
  }

  async get(code: string): Promise<IngredientView> {
    const r = await this.repo.findCurrent(await this.siteId(), code);
    if (!r) throw new AppError('not-found', `There is no ingredient '${code}'.`);
    return { id: r.code, ...r.body, revision: r.revision, updatedAt: r.updatedAt.toISOString() };
  }

  async history(code: string): Promise<IngredientRevisionView[]> {
    const revs = await this.repo.history(await this.siteId(), code);
    if (!revs) throw new AppError('not-found', `There is no ingredient '${code}'.`);
    const names = new Map((await this.users.list()).map((u) => [u.id, u.name]));
    return revs.map((r) => ({
      ...r,
      authorName: r.authorId ? (names.get(r.authorId) ?? null) : null,
      createdAt: r.createdAt.toISOString(),
    }));
  }

  /** Every recipe and product that uses the ingredient at any depth, with each path. */
  async usedIn(code: string) {
    const { book } = await this.books.state();
    if (!book.ingredients.some((i) => i.id === code)) throw new AppError('not-found', `There is no ingredient '${code}'.`);
    return usedIn(book, code);
  }

  async create(item: BookIngredient, authorId: number) {
    await this.books.writeItem('ingredient', item, { authorId, note: 'Created' }, { new: true });
    return this.get(item.id);
  }

  /** Saves a new revision of an existing ingredient; refused (stale-base) when `save.baseRevision` is no longer its current revision. */
  async update(code: string, save: IngredientSave, authorId: number, note?: string) {
    const { baseRevision, ...item } = save;
    if (item.id !== code)
      throw new AppError('validation', `The body's id '${item.id}' does not match '${code}'.`, [
        { path: 'id', message: 'Must match the address.' },
      ]);
    await this.books.writeItem('ingredient', item, { authorId, note: note ?? 'Edited' }, { baseRevision });
    return this.get(code);
  }
}
