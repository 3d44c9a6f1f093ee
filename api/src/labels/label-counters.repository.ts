import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { LabelBatchModel } from './label-batch.model';
import { SsccSerialModel } from './sscc-serial.model';

/** A batch code as given out: the one product and day it names. */
export interface BatchRow {
  code: string;
  productCode: string;
  day: string;
  sequence: number;
}

/**
 * The only place that reads and writes the batch codes given out and the SSCC serial counters.
 * Every read here is a locking read inside the run's transaction (SELECT … FOR UPDATE), so it
 * sees what other runs committed and holds it until this run commits or is refused.
 */
@Injectable()
export class LabelCountersRepository {
  constructor(
    @InjectModel(LabelBatchModel) private readonly batches: typeof LabelBatchModel,
    @InjectModel(SsccSerialModel) private readonly serials: typeof SsccSerialModel,
  ) {}

  /** The highest sequence given to the product on the day (0 when none was). */
  async lastSequence(siteId: number, productCode: string, day: string, t: Transaction): Promise<number> {
    const rows = await this.batches.findAll({
      where: { siteId, productCode, day },
      order: [['sequence', 'DESC']],
      limit: 1,
      transaction: t,
      lock: t.LOCK.UPDATE,
    });
    const found = rows.find((r) => r.productCode === productCode);
    return found ? found.sequence : 0;
  }

  /** The batch code as given out, compared byte for byte, or null when it never was. */
  async findBatch(siteId: number, code: string, t: Transaction): Promise<BatchRow | null> {
    const rows = await this.batches.findAll({ where: { siteId, code }, transaction: t, lock: t.LOCK.UPDATE });
    const row = rows.find((r) => r.code === code);
    return row ? { code: row.code, productCode: row.productCode, day: String(row.day), sequence: row.sequence } : null;
  }

  async addBatch(siteId: number, batch: BatchRow, t: Transaction): Promise<void> {
    await this.batches.create({ siteId, ...batch }, { transaction: t });
  }

  /**
   * Takes `count` serials in a row for the company prefix and extension digit and returns the
   * first; the counter then stands after the last. The caller checks the range fits the SSCC.
   */
  async takeSerials(siteId: number, companyPrefix: string, extension: number, count: number, t: Transaction): Promise<number> {
    const rows = await this.serials.findAll({ where: { siteId, companyPrefix, extension }, transaction: t, lock: t.LOCK.UPDATE });
    const row = rows.find((r) => r.companyPrefix === companyPrefix);
    const first = row ? Number(row.nextSerial) : 1;
    if (row) await this.serials.update({ nextSerial: first + count }, { where: { siteId, companyPrefix, extension }, transaction: t });
    else await this.serials.create({ siteId, companyPrefix, extension, nextSerial: first + count }, { transaction: t });
    return first;
  }
}
