import { Injectable } from '@nestjs/common';
import { diffDeclarations, type Book, type SwapApplied, type SwapPreview, type SwapRequest } from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { BooksService } from '../books/books.service';
import { planSwap, type SwapPlan } from '../rules/core/swap-plan';
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

  /** The swap as planned by the rules core, or its refusal. */
  private plan(book: Book, req: SwapRequest): SwapPlan {
    const result = planSwap(book, req);
    if (!result.ok) throw new AppError(result.refusal.code, result.refusal.message, result.refusal.fields);
    return result.plan;
  }

  async preview(req: SwapRequest): Promise<SwapPreview> {
    const { book: before } = await this.books.state();
    const { from, to, changed, after, products } = this.plan(before, req);
    this.books.assertDeclarable(after);
    const declared = products.map((id) => {
      const b = this.rules.declare(before, id);
      const a = this.rules.declare(after, id);
      return { product: id, name: a.name, before: b, after: a, diff: diffDeclarations(b, a) };
    });
    return {
      from,
      to,
      recipes: changed.map((r) => ({ id: r.id, name: r.name, lines: r.lines.filter((l) => l.use === req.to).length })),
      products: declared.sort((x, y) => x.name.localeCompare(y.name)),
    };
  }

  /** Writes new revisions of every changed recipe in one transaction; each keeps the declaration it was saved with. */
  async apply(req: SwapRequest, authorId: number): Promise<SwapApplied> {
    const planned = await this.books.state();
    const { from, to, changed } = this.plan(planned.book, req);
    const written = await this.books.writeItems(
      { recipes: changed },
      { authorId, note: `Swapped ${from.name} for ${to.name}` },
      'existing',
      {
        action: 'swap.applied',
        record: req.recipe ? { kind: 'recipe', id: req.recipe } : { kind: 'ingredient', id: from.id },
        summary: `Swapped ${from.name} (${from.id}) for ${to.name} (${to.id}) in ${changed.map((r) => r.name).join(', ')}.`,
      },
      // A recipe saved between the plan and the write would be replaced unseen: refuse instead.
      (now) => {
        const moved = changed.filter((r) => now.heads.get(r.id)?.revision !== planned.heads.get(r.id)?.revision);
        if (moved.length > 0)
          throw new AppError(
            'conflict',
            `${moved.map((r) => r.name).join(', ')} ${moved.length === 1 ? 'was' : 'were'} saved while the swap was being applied. Nothing was saved; check the swap again.`,
          );
        return Promise.resolve();
      },
    );
    return { recipes: written };
  }
}
