import { Injectable } from '@nestjs/common';
import {
  addedName,
  addsAllergen,
  declaredChange,
  declaredChangeInWords,
  type LabelRunLogItem,
  type StaleHandledRequest,
  type StaleLabel,
} from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { ApprovalsRepository } from '../approvals/approvals.repository';
import { AuditService } from '../audit/audit.service';
import { BooksService } from '../books/books.service';
import { AppError } from '../common/app-error';
import type { AuthUser } from '../common/current-user.decorator';
import { TransactionRunner } from '../common/transaction';
import { LabelPrinter } from './label-printer';
import { LabelRunsRepository } from './label-runs.repository';
import { LabelStaleRepository } from './label-stale.repository';
import type { PrintSource } from './labels.service';

const longDate = (d: Date) => d.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/**
 * Labels out of date: a printed item (a product's labels, or its entry on the allergen chart)
 * whose product has an approval newer than the print that differs from what was printed, in
 * anything a customer or a label depends on. Worked out from the print log and the approvals every
 * time; a manager's handled mark against that approval takes it off the list until a later approval.
 */
@Injectable()
export class StaleLabelsService {
  constructor(
    private readonly books: BooksService,
    private readonly runs: LabelRunsRepository,
    private readonly approvals: ApprovalsRepository,
    private readonly handled: LabelStaleRepository,
    private readonly printer: LabelPrinter,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
  ) {}

  /** Every printed item out of date and not marked handled, newest print first. */
  async list(t?: Transaction): Promise<StaleLabel[]> {
    const state = await this.books.state(t);
    const products = state.book.recipes.filter((r) => r.sale);
    const rowIds = new Map(products.map((p) => [p.id, state.heads.get(p.id)!.rowId]));
    const latest = await this.approvals.latest(state.site.id, state.site.regime, [...rowIds.values()], t);
    const approved = products.filter((p) => latest.has(rowIds.get(p.id)!)).map((p) => p.id);
    const [prints, handled] = await Promise.all([
      this.runs.printsOfProducts<LabelRunLogItem, PrintSource>(state.site.id, approved),
      this.handled.handledKeys(state.site.id, t),
    ]);
    const out: StaleLabel[] = [];
    for (const p of prints) {
      const approval = latest.get(rowIds.get(p.line.productCode)!);
      if (!approval || !p.source || approval.approvedAt <= p.run.printedAt) continue;
      if (p.source.declaration.regime !== approval.regime) continue;
      if (handled.has(`${p.run.id}-${p.position}-${approval.id}`)) continue;
      const change = declaredChange(p.source.declaration, approval.body);
      if (!change.changed) continue;
      const name = state.book.recipes.find((r) => r.id === p.line.productCode)?.name ?? p.line.productCode;
      const chart = this.printer.template(p.run.template)?.template.purpose === 'chart';
      const printed = longDate(p.run.printedAt);
      const missing = change.added.map(addedName);
      const action = chart
        ? `Reprint the allergen chart printed on ${printed} (run ${p.run.id}): ${name} has changed since.`
        : missing.length > 0
          ? `Withdraw batch ${p.line.batch}'s labels of ${name}: they do not say ${missing.join(', ')}.`
          : `Relabel batch ${p.line.batch} of ${name}, printed on ${printed}: its labels no longer say what it is made of.`;
      out.push({
        id: `${p.run.id}-${p.position}`,
        run: p.run.id,
        printedAt: p.run.printedAt.toISOString(),
        template: p.run.template,
        chart,
        product: p.line.productCode,
        name,
        batch: p.line.batch,
        productionDate: p.run.productionDate,
        quantity: p.line.quantity,
        action,
        words: declaredChangeInWords(change),
        addsAllergen: addsAllergen(change),
        approvedAt: approval.approvedAt.toISOString(),
      });
    }
    return out;
  }

  /** Marks a printed item's out-of-date labels handled, with what was done; refused when it is not on the list. */
  async markHandled(id: string, body: StaleHandledRequest, user: AuthUser): Promise<{ id: string; handled: true }> {
    if (!/^[1-9]\d{0,8}-\d{1,4}$/.test(id)) throw new AppError('not-found', `There are no out-of-date labels '${id}'.`);
    return this.tx.run(async (t) => {
      const stale = (await this.list(t)).find((s) => s.id === id);
      if (!stale)
        throw new AppError(
          'not-found',
          `There are no out-of-date labels '${id}': they were marked handled already, or what they say is still approved.`,
        );
      const state = await this.books.state(t);
      const rowId = state.heads.get(stale.product)!.rowId;
      const approval = (await this.approvals.latest(state.site.id, state.site.regime, [rowId], t)).get(rowId)!;
      const [run, position] = id.split('-').map(Number);
      const handledAt = new Date();
      await this.handled.add(
        {
          siteId: state.site.id,
          runId: run,
          position,
          approvalId: approval.id,
          note: body.note,
          handledBy: user.id,
          handledByName: user.name,
          handledAt,
        },
        t,
      );
      await this.audit.record(
        {
          action: 'label-stale.handled',
          record: { kind: 'label-run', id: run },
          summary: `Marked handled: ${stale.action} ${body.note}`,
          after: { item: id, product: stale.product, batch: stale.batch, approval: approval.id, note: body.note },
        },
        t,
      );
      return { id, handled: true as const };
    });
  }
}
