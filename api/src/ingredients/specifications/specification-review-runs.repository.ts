import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { SpecificationReview } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { parseJson } from '../../common/json-column';
import { SpecificationReviewRunModel } from './specification-review-run.model';

export interface ReviewRun {
  day: string;
  overdue: SpecificationReview[];
  dueSoon: SpecificationReview[];
  mailId: string | null;
  createdAt: Date;
}

/** The only place that reads and writes specification_review_runs. */
@Injectable()
export class SpecificationReviewRunsRepository {
  constructor(@InjectModel(SpecificationReviewRunModel) private readonly runs: typeof SpecificationReviewRunModel) {}

  /** The day's run, locked until the transaction ends, so two instances cannot both look at one day. */
  async findLocked(siteId: number, day: string, t: Transaction): Promise<ReviewRun | null> {
    const row = await this.runs.findOne({ where: { siteId, day }, transaction: t, lock: t.LOCK.UPDATE });
    return row ? toRun(row) : null;
  }

  async add(siteId: number, run: Omit<ReviewRun, 'createdAt'>, t: Transaction): Promise<ReviewRun> {
    const row = await this.runs.create({ siteId, day: run.day, overdue: run.overdue, dueSoon: run.dueSoon, mailId: run.mailId } as never, {
      transaction: t,
    });
    return toRun(row);
  }
}

function toRun(row: SpecificationReviewRunModel): ReviewRun {
  return {
    day: row.day,
    overdue: parseJson(row.overdue as SpecificationReview[] | string),
    dueSoon: parseJson(row.dueSoon as SpecificationReview[] | string),
    mailId: row.mailId === null ? null : String(row.mailId),
    createdAt: row.createdAt,
  };
}
