import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { MEASURE_SYSTEMS, REGIMES, siteSchema } from '@crumbproof/shared';
import { z } from 'zod';
import { AppError } from '../common/app-error';
import { SiteModel } from './site.model';

export interface KitchenView {
  id: number;
  name: string;
  address: string;
  regime: SiteModel['regime'];
  measures: SiteModel['measures'];
  handles: SiteModel['handles'];
}

export const kitchenUpdateSchema = z
  .strictObject({
    name: z.string().trim().min(1, 'Give the kitchen a name.').max(160).optional(),
    address: z.string().trim().max(300).optional(),
    regime: z.enum(REGIMES).optional(),
    measures: z.enum(MEASURE_SYSTEMS).nullable().optional(),
    handles: siteSchema.shape.handles.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.')
  .refine((v) => !v.handles || new Set(v.handles.map((h) => h.allergen)).size === v.handles.length, {
    message: 'List each allergen source once.',
    path: ['handles'],
  });
export type KitchenUpdate = z.infer<typeof kitchenUpdateSchema>;

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
