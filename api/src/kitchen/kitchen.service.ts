import { Injectable } from '@nestjs/common';
import type { KitchenUpdate, KitchenView } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { AppError } from '../common/app-error';
import { SiteRepository, type SiteRow } from './site.repository';

@Injectable()
export class KitchenService {
  private readonly updatedListeners: (() => void)[] = [];

  constructor(private readonly sites: SiteRepository) {}

  /** Told after every saved change of the kitchen's settings (the counter's events); a listener must not throw. */
  onUpdated(listener: () => void): void {
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
    const site = await this.current();
    const updated = view(await this.sites.update(site.id, changes));
    for (const listener of this.updatedListeners) listener();
    return updated;
  }

  async view(): Promise<KitchenView> {
    return view(await this.current());
  }
}

function view(s: SiteRow): KitchenView {
  return { id: s.id, name: s.name, address: s.address, regime: s.regime, measures: s.measures, handles: s.handles };
}
