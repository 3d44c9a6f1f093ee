import { Injectable } from '@nestjs/common';
import type { KitchenUpdate, KitchenView } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { AuditService } from '../audit/audit.service';
import { AppError } from '../common/app-error';
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

  /** The kitchen this installation serves (one site per installation for now), or null before one is set up. */
  find(t?: Transaction): Promise<SiteRow | null> {
    return this.sites.first(t);
  }

  /** The kitchen this installation serves; refused, saying how to set one up, when there is none yet. */
  async current(t?: Transaction): Promise<SiteRow> {
    const site = await this.sites.first(t);
    if (!site) throw new AppError('not-found', 'No kitchen is set up yet. Import a recipe book first.');
    return site;
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
