import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Regime, Role, ServedDeclaration } from '@crumbproof/shared';
import { Op, type Transaction } from 'sequelize';
import { parseJson } from '../common/json-column';
import { ProductApprovalModel } from './product-approval.model';

/** An approval as kept. */
export interface ApprovalRow {
  id: number;
  recipeId: number;
  regime: Regime;
  declarationId: number;
  inputHash: string;
  /** The declaration as served when approved. */
  body: ServedDeclaration;
  approvedBy: number;
  approvedByName: string;
  approvedByRole: Role;
  approvedAt: Date;
  note: string | null;
}

export type NewApproval = Omit<ApprovalRow, 'id'> & { siteId: number };

const toRow = (m: ProductApprovalModel): ApprovalRow => ({
  id: m.id as number,
  recipeId: m.recipeId,
  regime: m.regime as Regime,
  declarationId: m.declarationId,
  inputHash: m.inputHash,
  body: parseJson(m.body) as ServedDeclaration,
  approvedBy: m.approvedBy,
  approvedByName: m.approvedByName,
  approvedByRole: m.approvedByRole as Role,
  approvedAt: m.approvedAt,
  note: m.note,
});

/** The only place that reads and adds rows of product_approvals; it never changes one (nor could it: migration 0011). */
@Injectable()
export class ApprovalsRepository {
  constructor(@InjectModel(ProductApprovalModel) private readonly approvals: typeof ProductApprovalModel) {}

  /** The latest approval of each recipe (by row id) under a regime; two queries whatever the count. */
  async latest(siteId: number, regime: Regime, recipeIds: readonly number[], t?: Transaction): Promise<Map<number, ApprovalRow>> {
    const out = new Map<number, ApprovalRow>();
    if (recipeIds.length === 0) return out;
    const newest = (await this.approvals.findAll({
      where: { siteId, regime, recipeId: { [Op.in]: [...new Set(recipeIds)] } },
      attributes: ['recipeId', [this.approvals.sequelize!.fn('MAX', this.approvals.sequelize!.col('id')), 'latest']],
      group: ['recipeId'],
      raw: true,
      transaction: t,
    })) as unknown as { recipeId: number; latest: number }[];
    if (newest.length === 0) return out;
    const rows = await this.approvals.findAll({ where: { id: { [Op.in]: newest.map((n) => n.latest) } }, transaction: t });
    for (const row of rows) out.set(row.recipeId, toRow(row));
    return out;
  }

  /** Approvals by their ids. */
  async byIds(ids: readonly number[]): Promise<Map<number, ApprovalRow>> {
    const out = new Map<number, ApprovalRow>();
    if (ids.length === 0) return out;
    for (const row of await this.approvals.findAll({ where: { id: { [Op.in]: [...new Set(ids)] } } }))
      out.set(row.id as number, toRow(row));
    return out;
  }

  async add(values: NewApproval, t: Transaction): Promise<ApprovalRow> {
    const row = await this.approvals.create({ ...values }, { transaction: t });
    return toRow(row);
  }
}
