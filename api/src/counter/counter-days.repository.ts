import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { parseJson } from '../common/json-column';
import { CounterDayModel } from './counter-day.model';

/** The products on sale on a day as stored. */
export interface CounterDayRow {
  day: string;
  products: string[];
  setByName: string;
  setAt: Date;
}

/** The only place that reads and writes the counter_days table (one row per kitchen and day, none until marked). */
@Injectable()
export class CounterDaysRepository {
  constructor(@InjectModel(CounterDayModel) private readonly days: typeof CounterDayModel) {}

  async find(siteId: number, day: string, t?: Transaction): Promise<CounterDayRow | null> {
    const row = await this.days.findOne({ where: { siteId, day }, transaction: t });
    return row ? { day: row.day, products: parseJson(row.products) as string[], setByName: row.setByName, setAt: row.updatedAt } : null;
  }

  /** Marks the products on sale on a day, in place of what was marked before. */
  async save(siteId: number, day: string, products: string[], by: { id: number; name: string }, t?: Transaction): Promise<CounterDayRow> {
    await this.days.upsert({ siteId, day, products, setBy: by.id, setByName: by.name, updatedAt: new Date() }, { transaction: t });
    return (await this.find(siteId, day, t))!;
  }
}
