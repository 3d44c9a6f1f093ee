import { Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { ApprovalStatus } from '../approvals/approval-status';
import { BooksService, type KitchenWritten } from '../books/books.service';
import { KitchenService } from '../kitchen/kitchen.service';
import { recipesAbove } from '../rules/core/book-graph';
import { CounterEvents } from './counter-events';

/**
 * Publishes `declarations-changed` after every saved write that can change a declaration. Every
 * such write passes BooksService (ingredients created, edited or imported from a spreadsheet,
 * recipes saved, swaps applied, book import) or KitchenService.update (the kitchen's regime and
 * allergen handling), and after approvals (ApprovalStatus), which change what the counter serves. A supplier specification is kept beside its ingredient and changes no
 * declaration (nothing of it is an input of one), so it publishes nothing.
 */
@Injectable()
export class DeclarationChanges implements OnModuleInit {
  private readonly logger = new Logger(DeclarationChanges.name);

  constructor(
    private readonly books: BooksService,
    private readonly kitchen: KitchenService,
    private readonly events: CounterEvents,
    private readonly approvals: ApprovalStatus,
  ) {}

  onModuleInit() {
    this.books.onKitchenWritten((written) => {
      void this.published(written);
    });
    // New settings reach every product: no ids are named.
    this.kitchen.onUpdated(() => this.events.publish({ type: 'declarations-changed' }));
    // An approval changes what the counter serves of the products approved.
    this.approvals.onApproved((products) => this.events.publish({ type: 'declarations-changed', products: [...products] }));
  }

  private async published(written: KitchenWritten): Promise<void> {
    if (!this.events.listening) return;
    if (written.site) {
      this.events.publish({ type: 'declarations-changed' });
      return;
    }
    try {
      const products = await this.productsTouched(written);
      if (products.length > 0) this.events.publish({ type: 'declarations-changed', products });
    } catch (e) {
      // The write is saved: when the products cannot be told, the counter is told that any may have changed.
      this.logger.warn(`Could not tell which products a write touched: ${String(e)}`);
      this.events.publish({ type: 'declarations-changed' });
    }
  }

  /**
   * The products for sale made with any item written, and every recipe written (one just taken off
   * sale leaves the counter), in the book's order.
   */
  private async productsTouched(written: KitchenWritten): Promise<string[]> {
    const { book } = await this.books.state();
    const above = new Set<string>();
    for (const id of [...written.ingredients, ...written.recipes]) for (const r of recipesAbove(book, id)) above.add(r);
    const saved = new Set(written.recipes);
    return book.recipes.filter((r) => saved.has(r.id) || (r.sale && above.has(r.id))).map((r) => r.id);
  }
}
