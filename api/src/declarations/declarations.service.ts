import { createHash } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { bookRecipeSchema, type Book, type Declaration, type Regime } from '@crumbproof/shared';
import { UniqueConstraintError } from 'sequelize';
import { AppError } from '../common/app-error';
import { BooksService } from '../books/books.service';
import { parseJson } from '../kitchen/kitchen.service';
import { RecipesRepository } from '../recipes/recipes.repository';
import { RulesService } from '../rules/rules.service';
import { validationError } from '../common/zod.pipe';
import { DeclarationModel } from './declaration.model';
import type { ProductDeclaration } from '../rules/rules.service';

/**
 * Everything a product's declaration depends on: the site, every item it reaches, and the items
 * its sale details name for QUID (so a QUID that no longer matches a line is a warning, not a gap).
 */
export function closureOf(book: Book, productId: string): Book {
  const ing = new Map(book.ingredients.map((i) => [i.id, i]));
  const rec = new Map(book.recipes.map((r) => [r.id, r]));
  const seenI = new Set<string>();
  const seenR = new Set<string>();
  const visit = (id: string) => {
    if (ing.has(id)) return void seenI.add(id);
    if (!rec.has(id) || seenR.has(id)) return;
    seenR.add(id);
    const recipe = rec.get(id)!;
    for (const line of recipe.lines) visit(line.use);
    for (const named of recipe.sale?.quid ?? []) visit(named);
  };
  visit(productId);
  return {
    ...book,
    ingredients: book.ingredients.filter((i) => seenI.has(i.id)),
    recipes: book.recipes.filter((r) => seenR.has(r.id)),
  };
}

/**
 * Declarations of products, kept per recipe revision and regime and reused until anything they
 * depend on changes (an ingredient, a sub-recipe, the site's handling, the reference data).
 */
@Injectable()
export class DeclarationsService {
  constructor(
    @InjectModel(DeclarationModel) private readonly saved: typeof DeclarationModel,
    private readonly books: BooksService,
    private readonly recipes: RecipesRepository,
    private readonly rules: RulesService,
  ) {}

  /**
   * A product's declaration, from the store when nothing it depends on has changed. Callers that
   * declare many products pass the book and the recipes' heads they already read.
   */
  async forProduct(
    code: string,
    regime?: Regime,
    loaded?: { book: Book; heads: Map<string, { id: number; revision: number }> },
  ): Promise<ProductDeclaration> {
    const book = loaded?.book ?? (await this.books.exportBook());
    const recipe = book.recipes.find((r) => r.id === code);
    if (!recipe) throw new AppError('not-found', `There is no recipe '${code}'.`);
    const head = loaded?.heads.get(code) ?? (await this.recipes.findCurrent((await this.books.site())!.id, code))!;
    const useRegime = regime ?? book.site.regime;
    const slice = closureOf(book, code);
    const inputHash = createHash('sha256')
      .update(JSON.stringify({ slice, regime: useRegime, refs: this.rules.referenceVersion }))
      .digest('hex');
    const hit = await this.saved.findOne({ where: { recipeId: head.id, regime: useRegime, inputHash } });
    if (hit) return parseJson(hit.body) as ProductDeclaration;
    const declaration = this.rules.declare(slice, code, useRegime);
    try {
      await this.saved.create({ recipeId: head.id, recipeRevision: head.revision, regime: useRegime, inputHash, body: declaration });
    } catch (e) {
      if (!(e instanceof UniqueConstraintError)) throw e; // computed at the same time elsewhere
    }
    return declaration;
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

  /** The first declaration kept for each revision of a recipe, in the kitchen's regime. */
  async savedByRevision(recipeId: number): Promise<Map<number, Declaration>> {
    const site = (await this.books.site())!;
    const rows = await this.saved.findAll({ where: { recipeId, regime: site.regime }, order: [['id', 'ASC']] });
    const out = new Map<number, Declaration>();
    for (const r of rows) if (!out.has(r.recipeRevision)) out.set(r.recipeRevision, parseJson(r.body) as Declaration);
    return out;
  }

  /** Declares the given recipes (all of them when none are named), so each current revision has its declaration on record. */
  async record(ids?: readonly string[]): Promise<number> {
    const loaded = await this.loadAll();
    const todo = ids ?? loaded.book.recipes.map((r) => r.id);
    for (const id of todo) await this.forProduct(id, undefined, loaded);
    return todo.length;
  }

  private async loadAll() {
    const book = await this.books.exportBook();
    const site = (await this.books.site())!;
    const heads = new Map((await this.recipes.listCurrent(site.id)).map((r) => [r.code, { id: r.id, revision: r.revision }]));
    return { book, heads };
  }

  /** Declarations of every product for sale. */
  async all(regime?: Regime): Promise<ProductDeclaration[]> {
    const loaded = await this.loadAll();
    const out: ProductDeclaration[] = [];
    for (const r of loaded.book.recipes.filter((x) => x.sale)) out.push(await this.forProduct(r.id, regime, loaded));
    return out;
  }
}
