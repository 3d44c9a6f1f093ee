import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { KitchenUpdate, KitchenView } from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { SiteModel } from './site.model';

@Injectable()
export class KitchenService {
  constructor(@InjectModel(SiteModel) private readonly sites: typeof SiteModel) {}

  /** The kitchen this installation serves (one site per installation for now). */
  async current(): Promise<SiteModel> {
    const site = await this.sites.findOne({ order: [['id', 'ASC']] });
    if (!site) throw new AppError('not-found', 'No kitchen is set up yet. Import a recipe book or run the seed.');
    return site;
  }

  /** Changes the kitchen's regime, measures or allergen handling; every declaration follows. */
  async update(changes: KitchenUpdate): Promise<KitchenView> {
    const s = await this.current();
    await s.update({ ...changes, version: s.version + 1 });
    return this.view();
  }

  async view(): Promise<KitchenView> {
    const s = await this.current();
    return { id: s.id, name: s.name, address: s.address, regime: s.regime, measures: s.measures, handles: parseJson(s.handles) };
  }
}

/** MariaDB keeps JSON as LONGTEXT; the driver may hand back a string. */
export function parseJson<T>(value: T | string): T {
  return typeof value === 'string' ? (JSON.parse(value) as T) : value;
}
