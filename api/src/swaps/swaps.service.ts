import { Injectable } from '@nestjs/common';
import {
  diffDeclarations,
  type BookFile,
  type SwapApplied,
  type SwapPreview,
  type SwapProduct,
  type SwapRequest,
} from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { BooksService, viewAt } from '../books/books.service';
import type { SiteRow } from '../kitchen/site.repository';
import { planSwap, swapAtSite, type SwapPlan } from '../rules/core/swap-plan';
import { RulesService } from '../rules/rules.service';

/**
 * The swap check: replace one ingredient (or sub-recipe) by another in one recipe or in every
 * recipe that uses it, and see what every affected product would declare at every kitchen of the
 * installation, before saving. The recipes are shared, so a swap reaches every kitchen that sells
 * a product made with them; each kitchen's products are declared as it makes them.
 */
@Injectable()
export class SwapsService {
  constructor(
    private readonly books: BooksService,
    private readonly rules: RulesService,
  ) {}

  /** The swap as planned by the rules core on the whole book, or its refusal. */
  private plan(book: BookFile, req: SwapRequest): SwapPlan<BookFile> {
    const result = planSwap(book, req);
    if (!result.ok) throw new AppError(result.refusal.code, result.refusal.message, result.refusal.fields);
    return result.plan;
  }

  /**
   * What the swap would change at every kitchen: the request's kitchen first, then the others in
   * the order they were set up, each product declared before and after under that kitchen's
   * regime, handling and substitutions. A kitchen that does not sell a product, or makes it the
   * same either way, does not list it.
   */
  async preview(req: SwapRequest): Promise<SwapPreview> {
    const state = await this.books.state();
    const plan = this.plan(state.file, req);
    this.books.assertFileDeclarable(plan.after);
    const kitchens = [state.site, ...state.sites.filter((s) => s.id !== state.site.id)];
    const products: SwapProduct[] = [];
    const counted: SwapPreview['kitchens'] = [];
    for (const site of kitchens) {
      const kitchen = kitchenOf(site);
      const before = viewAt(state.file, site);
      const after = viewAt(plan.after, site);
      const reached = swapAtSite(plan, before, after).map(({ product, standIns }): SwapProduct => {
        const b = this.rules.declare(before.book, product);
        const a = this.rules.declare(after.book, product);
        return { kitchen, product, name: a.name, before: b, after: a, diff: diffDeclarations(b, a), standIns };
      });
      products.push(...reached.sort((x, y) => x.name.localeCompare(y.name)));
      counted.push({ ...kitchen, products: reached.length });
    }
    return {
      from: plan.from,
      to: plan.to,
      recipes: plan.changed.map((r) => ({ id: r.id, name: r.name, lines: r.lines.filter((l) => l.use === req.to).length })),
      kitchens: counted,
      products,
    };
  }

  /**
   * Writes new revisions of every changed recipe of the shared book in one transaction, checked
   * against every kitchen's view (BooksService.writeItems); each keeps the declaration it was saved with.
   */
  async apply(req: SwapRequest, authorId: number): Promise<SwapApplied> {
    const planned = await this.books.state();
    const { from, to, changed } = this.plan(planned.file, req);
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

function kitchenOf(site: SiteRow): SwapProduct['kitchen'] {
  return { id: site.id, code: site.code, name: site.name, regime: site.regime };
}
