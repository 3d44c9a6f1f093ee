import { Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import type { Book } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { ApprovalStatus } from '../approvals/approval-status';
import { BooksService, type KitchenWritten } from '../books/books.service';
import { KitchenService } from '../kitchen/kitchen.service';
import { recipesAboveAny } from '../rules/core/book-graph';
import { CounterChannel } from './counter-channel';

/** A write touching more products than this tells the counter that any may have changed, rather than naming each. */
export const PRODUCTS_NAMED_AT_MOST = 200;

/**
 * Publishes `declarations-changed`, inside the write's own transaction, for every write that can
 * change a declaration. Every such write passes BooksService (ingredients created, edited or
 * imported from a spreadsheet, recipes saved, swaps applied, book import) or KitchenService.update
 * (the kitchen's regime and allergen handling), and approvals (ApprovalStatus), which change what
 * the counter serves. A supplier specification is kept beside its ingredient and changes no
 * declaration (nothing of it is an input of one), so it publishes nothing.
 */
@Injectable()
export class DeclarationChanges implements OnModuleInit {
  private readonly logger = new Logger(DeclarationChanges.name);

  constructor(
    private readonly books: BooksService,
    private readonly kitchen: KitchenService,
    private readonly channel: CounterChannel,
    private readonly approvals: ApprovalStatus,
  ) {}

  onModuleInit() {
    this.books.onKitchenWriting((written, after, t) => this.published(written, after, t));
    // A kitchen's new settings reach every product of its counters: no ids are named.
    this.kitchen.onUpdated((t, site) => this.channel.publish({ type: 'declarations-changed' }, t, site.id));
    // An approval, given at the request's kitchen, changes what that kitchen's counters serve of the products approved.
    this.approvals.onApproved(async (products, t) => this.tell([...products], t, (await this.kitchen.find(t))?.id ?? null));
  }

  private async published(written: KitchenWritten, after: readonly Book[], t: Transaction): Promise<void> {
    let products: string[] | null = null;
    if (!written.site) {
      try {
        products = productsTouched(written, after);
      } catch (e) {
        // When the products cannot be told, the counter is told that any may have changed.
        this.logger.warn(`Could not tell which products a write touched: ${String(e)}`);
      }
    }
    await this.tell(products, t);
  }

  /**
   * Names the products (none to name, no event), or, for null or a great many, tells that any may
   * have changed; to one kitchen's counters, or (null) to every kitchen's.
   */
  private async tell(products: string[] | null, t: Transaction, kitchen: number | null = null): Promise<void> {
    if (products === null || products.length > PRODUCTS_NAMED_AT_MOST)
      await this.channel.publish({ type: 'declarations-changed' }, t, kitchen);
    else if (products.length > 0) await this.channel.publish({ type: 'declarations-changed', products }, t, kitchen);
  }
}

/**
 * The products for sale at any kitchen made with any item written there (a kitchen's own
 * ingredient reaches its products through its substitution), and every recipe written (one just
 * taken off sale leaves the counter), in the book's order.
 */
function productsTouched(written: KitchenWritten, views: readonly Book[]): string[] {
  const saved = new Set(written.recipes);
  const touched = new Set<string>();
  for (const book of views) {
    const above = recipesAboveAny(book, [
      ...written.ingredients.filter((id) => book.ingredients.some((i) => i.id === id)),
      ...written.recipes,
    ]);
    for (const r of book.recipes) if (saved.has(r.id) || (r.sale && above.has(r.id))) touched.add(r.id);
  }
  return views[0]?.recipes.filter((r) => touched.has(r.id)).map((r) => r.id) ?? [];
}
