import { Injectable } from '@nestjs/common';
import { diffDeclarations, type Book, type BookRecipe, type SwapApplied, type SwapPreview, type SwapRequest } from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { usedIn } from '../rules/core/book-graph';
import { BooksService, bookRefused } from '../books/books.service';
import { RulesService } from '../rules/rules.service';

/**
 * The swap check: replace one ingredient (or sub-recipe) by another in one recipe or in every
 * recipe that uses it, and see what every affected product would declare, before saving.
 */
@Injectable()
export class SwapsService {
  constructor(
    private readonly books: BooksService,
    private readonly rules: RulesService,
  ) {}

  private plan(book: Book, req: SwapRequest): { changed: BookRecipe[]; after: Book } {
    const items = new Map([...book.ingredients, ...book.recipes].map((x) => [x.id, x]));
    if (!items.has(req.from))
      throw new AppError('not-found', `There is no ingredient or recipe '${req.from}' to replace.`, [
        { path: 'from', message: 'Unknown id.' },
      ]);
    if (!items.has(req.to))
      throw new AppError('not-found', `There is no ingredient or recipe '${req.to}' to use instead.`, [
        { path: 'to', message: 'Unknown id.' },
      ]);
    if (req.from === req.to)
      throw new AppError('validation', 'Choose a replacement that differs from the ingredient it replaces.', [
        { path: 'to', message: 'Same as the ingredient replaced.' },
      ]);
    if (req.recipe && !book.recipes.some((r) => r.id === req.recipe)) {
      throw new AppError('not-found', `There is no recipe '${req.recipe}'.`, [{ path: 'recipe', message: 'Unknown recipe.' }]);
    }
    const changed: BookRecipe[] = [];
    const recipes = book.recipes.map((r) => {
      if (req.recipe && r.id !== req.recipe) return r;
      if (!r.lines.some((l) => l.use === req.from)) return r;
      const next: BookRecipe = { ...r, lines: r.lines.map((l) => (l.use === req.from ? { ...l, use: req.to } : l)) };
      // A percentage asked for the replaced ingredient is asked for its replacement.
      if (next.sale?.quid?.includes(req.from)) {
        next.sale = { ...next.sale, quid: [...new Set(next.sale.quid.map((q) => (q === req.from ? req.to : q)))] };
      }
      changed.push(next);
      return next;
    });
    if (changed.length === 0) {
      const where = req.recipe ? `${items.get(req.recipe)!.name}` : 'any recipe';
      throw new AppError('validation', `${items.get(req.from)!.name} is not used directly in ${where}, so there is nothing to swap.`, [
        { path: 'from', message: 'Not used here.' },
      ]);
    }
    return { changed, after: { ...book, recipes } };
  }

  async preview(req: SwapRequest): Promise<SwapPreview> {
    const before = await this.books.exportBook();
    const { changed, after } = this.plan(before, req);
    const problems = this.rules.check(after);
    if (problems.length > 0) throw bookRefused(problems);
    const affected = new Set<string>();
    for (const r of changed) {
      if (r.sale) affected.add(r.id);
      for (const u of usedIn(after, r.id)) if (u.forSale) affected.add(u.id);
    }
    const products = [...affected].map((id) => {
      const b = this.rules.declare(before, id);
      const a = this.rules.declare(after, id);
      return { product: id, name: a.name, before: b, after: a, diff: diffDeclarations(b, a) };
    });
    const name = (id: string) => [...before.ingredients, ...before.recipes].find((x) => x.id === id)!.name;
    return {
      from: { id: req.from, name: name(req.from) },
      to: { id: req.to, name: name(req.to) },
      recipes: changed.map((r) => ({ id: r.id, name: r.name, lines: r.lines.filter((l) => l.use === req.to).length })),
      products: products.sort((x, y) => x.name.localeCompare(y.name)),
    };
  }

  /** Writes new revisions of every changed recipe in one transaction; each keeps the declaration it was saved with. */
  async apply(req: SwapRequest, authorId: number): Promise<SwapApplied> {
    const book = await this.books.exportBook();
    const { changed } = this.plan(book, req);
    const name = (id: string) => [...book.ingredients, ...book.recipes].find((x) => x.id === id)!.name;
    const written = await this.books.writeItems(
      { recipes: changed },
      { authorId, note: `Swapped ${name(req.from)} for ${name(req.to)}` },
      'existing',
    );
    return { recipes: written };
  }
}
