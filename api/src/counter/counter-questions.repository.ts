import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { parseJson } from '../common/json-column';
import { CounterQuestionModel } from './counter-question.model';

/** A question as stored. */
export interface CounterQuestionRow {
  id: number;
  productCode: string;
  productName: string;
  avoid: string[];
  note: string | null;
  askedByName: string;
  askedAt: Date;
  answer: { text: string; by: string; at: Date } | null;
}

export interface NewCounterQuestion {
  productCode: string;
  productName: string;
  avoid: string[];
  note: string | null;
  askedBy: number;
  askedByName: string;
}

function toRow(m: CounterQuestionModel): CounterQuestionRow {
  return {
    id: m.id as number,
    productCode: m.productCode,
    productName: m.productName,
    avoid: parseJson(m.avoid) as string[],
    note: m.note,
    askedByName: m.askedByName,
    askedAt: m.createdAt,
    answer: m.answer !== null && m.answeredAt ? { text: m.answer, by: m.answeredByName ?? '', at: m.answeredAt } : null,
  };
}

/** The only place that reads and writes the counter_questions table. */
@Injectable()
export class CounterQuestionsRepository {
  constructor(@InjectModel(CounterQuestionModel) private readonly questions: typeof CounterQuestionModel) {}

  async add(siteId: number, values: NewCounterQuestion, t?: Transaction): Promise<CounterQuestionRow> {
    return toRow(await this.questions.create({ siteId, ...values }, { transaction: t }));
  }

  /** Newest first; `open` keeps only those not answered yet. */
  async list(siteId: number, open: boolean): Promise<CounterQuestionRow[]> {
    const where = open ? { siteId, answeredAt: null } : { siteId };
    const rows = await this.questions.findAll({ where, order: [['id', 'DESC']] });
    return rows.map(toRow);
  }

  /** Locks the question until the transaction ends, so two answers at once do not both pass as the first. */
  async lock(siteId: number, id: number, t: Transaction): Promise<CounterQuestionRow | null> {
    const row = await this.questions.findOne({ where: { siteId, id }, transaction: t, lock: t.LOCK.UPDATE });
    return row ? toRow(row) : null;
  }

  async answer(id: number, answer: { text: string; by: number; byName: string }, t: Transaction): Promise<CounterQuestionRow> {
    await this.questions.update(
      { answer: answer.text, answeredBy: answer.by, answeredByName: answer.byName, answeredAt: new Date() },
      { where: { id }, transaction: t },
    );
    return toRow((await this.questions.findByPk(id, { transaction: t }))!);
  }
}
