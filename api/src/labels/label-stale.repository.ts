import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { LabelStaleHandledModel } from './label-stale-handled.model';

export interface NewStaleHandled {
  siteId: number;
  runId: number;
  position: number;
  approvalId: number;
  note: string;
  handledBy: number;
  handledByName: string;
  handledAt: Date;
}

/** The only place that reads and adds rows of label_stale_handled; it never changes one (nor could it: migration 0011). */
@Injectable()
export class LabelStaleRepository {
  constructor(@InjectModel(LabelStaleHandledModel) private readonly handled: typeof LabelStaleHandledModel) {}

  /** Every handled mark of the kitchen, as `${run}-${position}-${approval}` keys. */
  async handledKeys(siteId: number, t?: Transaction): Promise<Set<string>> {
    const rows = await this.handled.findAll({ where: { siteId }, attributes: ['runId', 'position', 'approvalId'], transaction: t });
    return new Set(rows.map((r) => `${r.runId}-${r.position}-${r.approvalId}`));
  }

  async add(values: NewStaleHandled, t: Transaction): Promise<number> {
    const row = await this.handled.create({ ...values }, { transaction: t });
    return row.id as number;
  }
}
