import { createHash } from 'node:crypto';
import { Injectable, type OnModuleInit } from '@nestjs/common';
import { bookRecipeSchema, type Book, type Declaration, type ProductDeclaration, type Regime } from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { validationError } from '../common/zod.pipe';
import { BooksService, type KitchenState } from '../books/books.service';
import { KitchenService } from '../kitchen/kitchen.service';
import { closureOf } from '../rules/core/book-graph';
import { RulesService } from '../rules/rules.service';
import { DeclarationsRepository } from './declarations.repository';

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
  ) {}

  /** Every recipe revision saved keeps the declaration it was saved with, for the revision history. */
  onModuleInit() {
    this.books.onRecipesWritten(async (ids) => {
      await this.record(ids);
    });
  }

  /**
   * A product's declaration, from the store when nothing it depends on has changed. Callers that
   * declare many products pass the kitchen they already read.
   */
  async forProduct(code: string, regime?: Regime, state?: KitchenState): Promise<ProductDeclaration> {
    const { book, heads } = state ?? (await this.books.state());
    const head = heads.get(code);
    if (!head || head.kind !== 'recipe') throw new AppError('not-found', `There is no recipe '${code}'.`);
    const useRegime = regime ?? book.site.regime;
    const slice = closureOf(book, code);
    const inputHash = createHash('sha256')
      .update(JSON.stringify({ slice, regime: useRegime, refs: this.rules.referenceVersion }))
      .digest('hex');
    const hit = await this.kept.find(head.rowId, useRegime, inputHash);
    if (hit) return hit.body;
    const declaration = this.rules.declare(slice, code, useRegime);
    const kept = await this.kept.add({
      recipeId: head.rowId,
      recipeRevision: head.revision,
      regime: useRegime,
      inputHash,
      body: declaration,
    });
    return kept.body;
  }

  /** Declares a recipe as edited but not saved: the live panel beside the editor. Nothing is stored. */
  async preview(input: unknown, regime?: Regime): Promise<ProductDeclaration> {
    const parsed = bookRecipeSchema.safeParse(input);
    if (!parsed.success) throw validationError(parsed.error);
    const book = await this.books.exportBook();
    const merged: Book = { ...book, recipes: [...book.recipes.filter((r) => r.id !== parsed.data.id), parsed.data] };
    this.books.assertDeclarable(merged);
    return this.rules.declare(closureOf(merged, parsed.data.id), parsed.data.id, regime ?? book.site.regime);
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
    for (const id of todo) await this.forProduct(id, undefined, state);
    return todo.length;
  }

  /** Declarations of every product for sale. */
  async all(regime?: Regime): Promise<ProductDeclaration[]> {
    const state = await this.books.state();
    const out: ProductDeclaration[] = [];
    for (const r of state.book.recipes.filter((x) => x.sale)) out.push(await this.forProduct(r.id, regime, state));
    return out;
  }
}
