import { Injectable } from '@nestjs/common';
import {
  addsAllergen,
  declarationInWords,
  declaredChange,
  declaredChangeInWords,
  type ApprovalRequest,
  type ApprovalStamp,
  type ApprovalsGiven,
  type ApprovalsView,
  type FieldError,
  type PendingApproval,
  KITCHEN_WRITERS,
} from '@crumbproof/shared';
import { AuditRepository } from '../audit/audit.repository';
import { AuditService } from '../audit/audit.service';
import { BooksService, type KitchenState } from '../books/books.service';
import { AppError } from '../common/app-error';
import type { AuthUser } from '../common/current-user.decorator';
import { TransactionRunner } from '../common/transaction';
import { DeclarationsService, keptCopy } from '../declarations/declarations.service';
import type { KitchenRoleRow } from '../kitchen/kitchen-roles.repository';
import { SiteRepository } from '../kitchen/site.repository';
import { closureItems } from '../rules/core/book-graph';
import { causesFor, DECLARATION_WRITES } from './approval-causes';
import { ApprovalMails } from './approval-mails';
import { ApprovalStatus, type ProductStatus } from './approval-status';
import { ApprovalsRepository, type ApprovalRow } from './approvals.repository';

export const stamp = (a: ApprovalRow): ApprovalStamp => ({
  id: a.id,
  at: a.approvedAt.toISOString(),
  by: a.approvedByName,
  role: a.approvedByRole,
  inputHash: a.inputHash,
  note: a.note,
});

/** The products waiting for a manager's approval, and the approvals themselves. */
@Injectable()
export class ApprovalsService {
  constructor(
    private readonly books: BooksService,
    private readonly status: ApprovalStatus,
    private readonly approvals: ApprovalsRepository,
    private readonly declarations: DeclarationsService,
    private readonly sites: SiteRepository,
    private readonly auditTrail: AuditRepository,
    private readonly audit: AuditService,
    private readonly tx: TransactionRunner,
    private readonly mails: ApprovalMails,
  ) {}

  /**
   * Every product for sale at the request's kitchen whose current declaration there is not the
   * one approved there, with the change in words and what caused it.
   */
  async list(user?: Pick<AuthUser, 'kitchens'>): Promise<ApprovalsView> {
    const state = await this.books.state();
    const all = await this.status.of(state);
    const waiting = all.filter((s) => s.state !== 'approved');
    const oldest = waiting.reduce<Date | null>(
      (m, s) => (s.approval && (!m || s.approval.approvedAt < m) ? s.approval.approvedAt : m),
      null,
    );
    const events = oldest ? await this.auditTrail.since(DECLARATION_WRITES, oldest) : [];
    const pending = waiting.map((s): PendingApproval => {
      if (!s.approval || !s.change)
        return {
          product: s.product.id,
          name: s.product.name,
          inputHash: s.current.inputHash,
          reason: 'first-approval',
          approved: null,
          change: null,
          words: declarationInWords(s.current.served),
          addsAllergen: false,
          causes: [],
        };
      const closure = new Set([
        ...closureItems(state.book, s.product.id).map((i) => i.id),
        ...s.approval.body.basis.items.map((i) => i.id),
      ]);
      return {
        product: s.product.id,
        name: s.product.name,
        inputHash: s.current.inputHash,
        reason: 'changed',
        approved: stamp(s.approval),
        change: s.change,
        words: declaredChangeInWords(s.change),
        addsAllergen: addsAllergen(s.change),
        causes: causesFor(events, s.approval.approvedAt, closure, state.book, state.site),
      };
    });
    return {
      kitchen: { id: state.site.id, code: state.site.code, name: state.site.name },
      kitchens: state.sites.length,
      elsewhere: await this.waitingElsewhere(state, user?.kitchens ?? []),
      regime: state.site.regime,
      pending,
      approvedCount: all.length - waiting.length,
    };
  }

  /**
   * Approves each product at the request's kitchen, at the declaration the manager saw there (its
   * inputHash); another kitchen's declaration of it waits for its own approval. Refused as a whole,
   * naming each product, when one is not for sale, is approved already, or its declaration has
   * changed since in anything a customer or a label depends on; nothing is saved then.
   */
  async approve(body: ApprovalRequest, user: Pick<AuthUser, 'id' | 'name' | 'role'>): Promise<ApprovalsGiven> {
    const given = await this.tx.run(async (t) => {
      // Writes to the book lock the same row: the state read here is every write committed before.
      await this.sites.lock(t);
      const state = await this.books.state(t);
      const fields: FieldError[] = [];
      let conflict = false;
      const forSale: string[] = [];
      body.products.forEach((p, i) => {
        const recipe = state.book.recipes.find((r) => r.id === p.product);
        if (!recipe) fields.push({ path: `products.${i}.product`, message: `There is no product '${p.product}'.` });
        else if (!recipe.sale)
          fields.push({ path: `products.${i}.product`, message: `${recipe.name} is a recipe, not for sale: there is nothing to approve.` });
        else forSale.push(p.product);
      });
      const statuses = new Map((await this.status.of(state, forSale, t)).map((s) => [s.product.id, s]));
      for (const [i, p] of body.products.entries()) {
        const s = statuses.get(p.product);
        if (!s) continue;
        const problem = await this.seenProblem(s, p.inputHash, state.site.regime);
        if (problem) {
          conflict ||= problem.conflict;
          fields.push({ path: `products.${i}.inputHash`, message: problem.message });
        }
      }
      if (fields.length > 0)
        throw new AppError(conflict ? 'conflict' : 'validation', `Nothing was approved. ${fields.map((f) => f.message).join(' ')}`, fields);
      const approvedAt = new Date();
      const out: ApprovalsGiven['approved'] = [];
      for (const p of body.products) {
        const s = statuses.get(p.product)!;
        const row = await this.approvals.add(
          {
            siteId: state.site.id,
            recipeId: s.current.recipeRowId,
            regime: state.site.regime,
            declarationId: s.current.declarationId,
            inputHash: s.current.inputHash,
            body: keptCopy(s.current.served),
            approvedBy: user.id,
            approvedByName: user.name,
            approvedByRole: user.role,
            approvedAt,
            note: body.note ?? null,
          },
          t,
        );
        out.push({
          product: s.product.id,
          name: s.product.name,
          approval: stamp(row),
          addsAllergen: s.change ? addsAllergen(s.change) : false,
        });
      }
      await this.audit.record(
        {
          action: 'approval.given',
          actor: { id: user.id, name: user.name, role: user.role },
          record: out.length === 1 ? { kind: 'product', id: out[0].product } : null,
          summary: `Approved the declaration of ${out.map((o) => `${o.name} (${o.product})`).join(', ')}${body.note ? `: ${body.note.replace(/\.$/, '')}` : ''}.`,
          before: Object.fromEntries(
            out.map((o) => {
              const was = statuses.get(o.product)!.approval;
              return [o.product, was ? { approval: was.id, inputHash: was.inputHash } : null];
            }),
          ),
          after: Object.fromEntries(
            out.map((o) => {
              const s = statuses.get(o.product)!;
              return [
                o.product,
                {
                  approval: o.approval.id,
                  inputHash: o.approval.inputHash,
                  words: s.change ? declaredChangeInWords(s.change) : declarationInWords(s.current.served),
                },
              ];
            }),
          ),
        },
        t,
      );
      await this.mails.allergenApproved(
        state.site,
        user.name,
        out.map((o) => statuses.get(o.product)!),
        t,
      );
      await this.status.approved(
        out.map((o) => o.product),
        t,
      );
      return out;
    });
    return { approved: given };
  }

  /** How many products wait for approval at each of the person's other kitchens where they may read approvals. */
  private async waitingElsewhere(state: KitchenState, kitchens: readonly KitchenRoleRow[]): Promise<ApprovalsView['elsewhere']> {
    const out: ApprovalsView['elsewhere'] = [];
    for (const site of state.sites) {
      if (site.id === state.site.id) continue;
      const role = kitchens.find((k) => k.siteId === site.id)?.role;
      if (!role || !KITCHEN_WRITERS.includes(role)) continue;
      const waiting = (await this.status.of(await this.books.stateAt(site))).filter((s) => s.state !== 'approved').length;
      if (waiting > 0) out.push({ kitchen: { id: site.id, code: site.code, name: site.name }, waiting });
    }
    return out;
  }

  /** Approves every product waiting, at its current declaration (the demo seed starts the demo kitchen approved). */
  async approveAll(user: Pick<AuthUser, 'id' | 'name' | 'role'>, note: string): Promise<ApprovalsGiven> {
    const { pending } = await this.list();
    if (pending.length === 0) return { approved: [] };
    return this.approve({ products: pending.map((p) => ({ product: p.product, inputHash: p.inputHash })), note }, user);
  }

  /** Why the declaration seen (by its input hash) cannot be approved now, or null. */
  private async seenProblem(
    s: ProductStatus,
    inputHash: string,
    regime: ApprovalRow['regime'],
  ): Promise<{ conflict: boolean; message: string } | null> {
    const name = s.product.name;
    if (s.state === 'approved')
      return { conflict: false, message: `${name}'s declaration is approved already: nothing about it waits for approval.` };
    if (inputHash === s.current.inputHash) return null;
    const seen = await this.declarations.keptByHash(s.current.recipeRowId, regime, inputHash);
    if (!seen)
      return {
        conflict: true,
        message: `${name}: the declaration given is not one of ${name}'s. Open Approvals again and approve what it shows.`,
      };
    const since = declaredChange(seen, s.current.served);
    if (since.changed)
      return {
        conflict: true,
        message: `${name}'s declaration has changed since you looked at it (${declaredChangeInWords(since).join(' ')}) Look at it again and approve.`,
      };
    return null;
  }
}
