import { Injectable } from '@nestjs/common';
import type { KitchenUpdate, KitchenView } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { AuditService } from '../audit/audit.service';
import { AppError } from '../common/app-error';
import { currentRequest } from '../common/request-context';
import { TransactionRunner } from '../common/transaction';
import { SiteRepository, type SiteRow } from './site.repository';

@Injectable()
export class KitchenService {
  private readonly updatedListeners: ((t: Transaction) => Promise<void>)[] = [];

  constructor(
    private readonly sites: SiteRepository,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
  ) {}

  /**
   * Told inside every change of the kitchen's settings, in its transaction (the counter's events):
   * what a listener writes with `t` is kept with the change or not at all.
   */
  onUpdated(listener: (t: Transaction) => Promise<void>): void {
    this.updatedListeners.push(listener);
  }

  /**
   * The kitchen the request is for (RolesGuard sets it from the request and the person's roles);
   * outside a request, or on a route for no kitchen in particular, the book's owner. Null before
   * any kitchen is set up.
   */
  async find(t?: Transaction): Promise<SiteRow | null> {
    const kitchenId = currentRequest()?.kitchenId;
    if (kitchenId === undefined || kitchenId === null) return this.sites.first(t);
    const site = await this.sites.byId(kitchenId, t);
    if (!site) throw new AppError('not-found', 'That kitchen is no longer set up. Choose one of your kitchens.');
    return site;
  }

  /** The kitchen the request is for (see find); refused, saying how to set one up, when there is none yet. */
  async current(t?: Transaction): Promise<SiteRow> {
    const site = await this.find(t);
    if (!site) throw new AppError('not-found', 'No kitchen is set up yet. Import a recipe book first.');
    return site;
  }

  /**
   * Of the installation's kitchens as just read (owner first), the one the request is for (see
   * find): what a reader that needs every row anyway takes without a second read.
   */
  pick(sites: readonly SiteRow[]): SiteRow {
    const kitchenId = currentRequest()?.kitchenId;
    const site = kitchenId === undefined || kitchenId === null ? sites[0] : sites.find((s) => s.id === kitchenId);
    if (!site)
      throw new AppError(
        'not-found',
        sites.length === 0
          ? 'No kitchen is set up yet. Import a recipe book first.'
          : 'That kitchen is no longer set up. Choose one of your kitchens.',
      );
    return site;
  }

  /** The kitchen that owns the recipe book (the first set up): every ingredient and recipe row is keyed by it. */
  async owner(t?: Transaction): Promise<SiteRow> {
    const site = await this.sites.first(t);
    if (!site) throw new AppError('not-found', 'No kitchen is set up yet. Import a recipe book first.');
    return site;
  }

  /** Every kitchen of the installation, the owner first. */
  all(t?: Transaction): Promise<SiteRow[]> {
    return this.sites.all(t);
  }

  /** Changes the kitchen's regime, measures or allergen handling; every declaration follows. */
  async update(changes: KitchenUpdate): Promise<KitchenView> {
    const updated = await this.tx.run(async (t) => {
      const site = await this.current(t);
      const after = view(await this.sites.update(site.id, changes, t));
      const before = view(site);
      const fields = (Object.keys(changes) as (keyof KitchenUpdate)[]).join(', ');
      await this.audit.record(
        { action: 'kitchen.updated', record: { kind: 'kitchen', id: site.id }, summary: `Changed the kitchen’s ${fields}.`, before, after },
        t,
      );
      for (const listener of this.updatedListeners) await listener(t);
      return after;
    });
    return updated;
  }

  async view(): Promise<KitchenView> {
    return view(await this.current());
  }
}

function view(s: SiteRow): KitchenView {
  return { id: s.id, name: s.name, address: s.address, regime: s.regime, measures: s.measures, handles: s.handles };
}
