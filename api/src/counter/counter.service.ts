import { Injectable } from '@nestjs/common';
import type { CounterDay, CounterDayView, CounterProductsView, FieldError } from '@crumbproof/shared';
import { BooksService, type KitchenState } from '../books/books.service';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../common/current-user.decorator';
import { TransactionRunner } from '../common/transaction';
import { AppError } from '../common/app-error';
import { ApprovalStatus, counterView } from '../approvals/approval-status';
import { DeclarationsService } from '../declarations/declarations.service';
import { today } from '../ingredients/specifications/specification.dto';
import { KitchenService } from '../kitchen/kitchen.service';
import { RulesService } from '../rules/rules.service';
import { CounterDaysRepository } from './counter-days.repository';
import { CounterChannel } from './counter-channel';
import { notForSale } from './product-for-sale';

/** The counter's products with their declarations, and the products on sale each day. */
@Injectable()
export class CounterService {
  constructor(
    private readonly books: BooksService,
    private readonly kitchen: KitchenService,
    private readonly approvals: ApprovalStatus,
    private readonly declarations: DeclarationsService,
    private readonly days: CounterDaysRepository,
    private readonly channel: CounterChannel,
    private readonly rules: RulesService,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
  ) {}

  /**
   * Every product for sale with the declaration the counter serves (ApprovalStatus: the approved
   * one, or the current one, as the recipes' declaration route serves it, when the product was
   * never approved or a change waiting for approval adds an allergen or loses a claim) and its
   * approval, read from one state of the kitchen, and whether it is marked on sale today. `computedAt` is taken before the kitchen is read, so no write saved before it is
   * missing from the set.
   */
  async products(): Promise<CounterProductsView> {
    const computedAt = new Date().toISOString();
    const date = today();
    const state = await this.books.state();
    const [statuses, day] = await Promise.all([this.approvals.of(state), this.days.find(state.site.id, date)]);
    const onSale = new Set(day?.products ?? []);
    const views = statuses.map(counterView);
    // An approved copy served in place of the current declaration gets its claims' basis as of today.
    const copies = views.flatMap((v, i) => (v.declaration === statuses[i].current.served ? [] : [i]));
    const checks = await this.declarations.servedChecks(
      copies.map((i) => views[i].declaration.basis.items),
      state.heads,
    );
    copies.forEach((i, n) => (views[i] = { ...views[i], declaration: { ...views[i].declaration, claimBasis: checks[n].claimBasis } }));
    return {
      computedAt,
      date,
      regime: state.site.regime,
      rules: this.rules.counterRules(state.site.regime),
      products: statuses.map((s, i) => ({ id: s.product.id, name: s.product.name, onSale: onSale.has(s.product.id), ...views[i] })),
    };
  }

  /** The products marked on sale on a day (today when no day is given); a day never marked has none. */
  async day(date: string = today()): Promise<CounterDayView> {
    const site = await this.kitchen.current();
    const row = await this.days.find(site.id, date);
    return row
      ? { date, products: row.products, setBy: row.setByName, setAt: row.setAt.toISOString() }
      : { date, products: [], setBy: null, setAt: null };
  }

  /** Marks the products on sale on a day; each must be a product for sale. Nothing is saved when one is not. */
  async setDay(body: CounterDay, user: AuthUser): Promise<CounterDayView> {
    const state = await this.books.state();
    assertForSale(state, body.products);
    const row = await this.tx.run(async (t) => {
      const before = await this.days.find(state.site.id, body.date, t);
      const saved = await this.days.save(state.site.id, body.date, body.products, user, t);
      await this.audit.record(
        {
          action: 'counter.day-marked',
          record: { kind: 'counter-day', id: body.date },
          summary: `Marked ${body.products.length} product${body.products.length === 1 ? '' : 's'} on sale on ${body.date}.`,
          before: before ? { products: before.products } : null,
          after: { products: saved.products },
        },
        t,
      );
      await this.channel.publish({ type: 'display-changed', date: body.date }, t, state.site.id);
      return saved;
    });
    return { date: body.date, products: row.products, setBy: row.setByName, setAt: row.setAt.toISOString() };
  }
}

/** Refuses ids that are not products for sale, naming each by its place in the list. */
function assertForSale(state: KitchenState, ids: readonly string[]) {
  const fields: FieldError[] = [];
  ids.forEach((id, i) => {
    const problem = notForSale(state.book, id);
    if (problem) fields.push({ path: `products.${i}`, message: problem });
  });
  if (fields.length > 0) throw new AppError('validation', fields.map((f) => `${f.path}: ${f.message}`).join(' '), fields);
}
