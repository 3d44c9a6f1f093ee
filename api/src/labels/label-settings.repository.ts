import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { LabelSettingsModel } from './label-settings.model';

/** A kitchen's label settings as stored. */
export interface LabelSettingsRow {
  batchPattern: string;
  gs1CompanyPrefix: string | null;
  ssccExtension: number;
  caseIndicator: number;
}

function toRow(m: LabelSettingsModel): LabelSettingsRow {
  return {
    batchPattern: m.batchPattern,
    gs1CompanyPrefix: m.gs1CompanyPrefix,
    ssccExtension: Number(m.ssccExtension),
    caseIndicator: Number(m.caseIndicator),
  };
}

/** The only place that reads and writes the label_settings table (one row per kitchen, none until first saved or printed). */
@Injectable()
export class LabelSettingsRepository {
  constructor(@InjectModel(LabelSettingsModel) private readonly settings: typeof LabelSettingsModel) {}

  async find(siteId: number, t?: Transaction): Promise<LabelSettingsRow | null> {
    const row = await this.settings.findByPk(siteId, { transaction: t });
    return row ? toRow(row) : null;
  }

  async save(siteId: number, values: LabelSettingsRow, t?: Transaction): Promise<LabelSettingsRow> {
    await this.settings.upsert({ siteId, ...values }, { transaction: t });
    return (await this.find(siteId, t))!;
  }

  /**
   * Locks the kitchen's label settings until the transaction ends (writing `defaults` first when
   * the kitchen has none yet), so print runs of one kitchen give out batch codes and serials one
   * at a time; returns the settings as locked. This is the run's first statement, so every read
   * after it sees what earlier runs committed.
   */
  async lockForRun(siteId: number, defaults: LabelSettingsRow, t: Transaction): Promise<LabelSettingsRow> {
    await this.settings.sequelize!.query(
      'INSERT INTO label_settings (site_id, batch_pattern, gs1_company_prefix, sscc_extension, case_indicator, updated_at) VALUES (?, ?, ?, ?, ?, NOW(3)) ON DUPLICATE KEY UPDATE site_id = site_id',
      {
        replacements: [siteId, defaults.batchPattern, defaults.gs1CompanyPrefix, defaults.ssccExtension, defaults.caseIndicator],
        transaction: t,
      },
    );
    const row = await this.settings.findByPk(siteId, { transaction: t, lock: t.LOCK.UPDATE });
    return toRow(row!);
  }
}
