import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { PublicPageSettings } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { PublicPageSettingsModel } from './public-page-settings.model';

/** A kitchen's public page settings as stored. */
export interface PublicPageSettingsRow extends PublicPageSettings {
  updatedAt: Date;
}

/** The only place that reads and writes the public_page_settings table (one row per kitchen, none until first saved). */
@Injectable()
export class PublicPageSettingsRepository {
  constructor(@InjectModel(PublicPageSettingsModel) private readonly settings: typeof PublicPageSettingsModel) {}

  async find(siteId: number, t?: Transaction): Promise<PublicPageSettingsRow | null> {
    const row = await this.settings.findByPk(siteId, { transaction: t });
    return row ? { enabled: Boolean(row.enabled), baseUrl: row.baseUrl, updatedAt: row.updatedAt } : null;
  }

  async save(siteId: number, values: PublicPageSettings, t?: Transaction): Promise<PublicPageSettingsRow> {
    await this.settings.upsert({ siteId, enabled: values.enabled, baseUrl: values.baseUrl, updatedAt: new Date() }, { transaction: t });
    return (await this.find(siteId, t))!;
  }
}
