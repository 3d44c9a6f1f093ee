import { Injectable } from '@nestjs/common';
import { declaredChange, type BookRecipe, type CounterApproval, type DeclaredChange, type ServedDeclaration } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import type { KitchenState } from '../books/books.service';
import { DeclarationsService, type KeptServed } from '../declarations/declarations.service';
import { ApprovalsRepository, type ApprovalRow } from './approvals.repository';

/** Where a product for sale stands: its current declaration against its latest approval under the kitchen's regime. */
export interface ProductStatus {
  product: BookRecipe;
  /** The current declaration, always fresh (DeclarationsService.keptForProducts). */
  current: KeptServed;
  approval: ApprovalRow | null;
  /** From the approved declaration to the current one; null when never approved. */
  change: DeclaredChange | null;
  /**
   * approved: the current declaration is the approved one in everything a customer or a label
   * depends on; pending: it differs; never-approved: no approval under the regime yet.
   */
  state: 'approved' | 'pending' | 'never-approved';
}

/** Told, inside the approvals' transaction, the products whose declarations were approved. */
export type ApprovedListener = (products: readonly string[], t: Transaction) => Promise<void>;

/**
 * Whether each product waits for a manager's approval, worked out from the current book every time
 * and never kept: the current declaration (as every screen serves it) is compared with the
 * approved one by `declaredChange` (shared/src/declaration-diff.ts). A change anywhere below a
 * product (an ingredient, a sub-recipe at any depth, the kitchen's handling) gives it a fresh
 * declaration, so it reaches every product above it without anything being told.
 */
@Injectable()
export class ApprovalStatus {
  private readonly approvedListeners: ApprovedListener[] = [];

  constructor(
    private readonly declarations: DeclarationsService,
    private readonly approvals: ApprovalsRepository,
  ) {}

  /** The products for sale named (every one when none are), in the order asked; one query of approvals. */
  async of(state: KitchenState, codes?: readonly string[], t?: Transaction): Promise<ProductStatus[]> {
    const products = codes ? codes.map((c) => state.book.recipes.find((r) => r.id === c)!) : state.book.recipes.filter((r) => r.sale);
    const current = await this.declarations.keptForProducts(
      products.map((p) => p.id),
      undefined,
      state,
    );
    const latest = await this.approvals.latest(
      state.site.id,
      state.site.regime,
      current.map((c) => c.recipeRowId),
      t,
    );
    return products.map((product, i) => {
      const approval = latest.get(current[i].recipeRowId) ?? null;
      if (!approval) return { product, current: current[i], approval, change: null, state: 'never-approved' };
      const change = declaredChange(approval.body, current[i].served);
      return { product, current: current[i], approval, change, state: change.changed ? 'pending' : 'approved' };
    });
  }

  onApproved(listener: ApprovedListener): void {
    this.approvedListeners.push(listener);
  }

  /**
   * Tells every listener, inside the approvals' transaction: what a listener writes with `t` (the
   * counter's events) is kept with the approvals or not at all, and a listener that throws rolls them back.
   */
  async approved(products: readonly string[], t: Transaction): Promise<void> {
    for (const listener of this.approvedListeners) await listener(products, t);
  }
}

/**
 * What the counter serves of a product and how it says so. Approved: the current declaration
 * (equal to the approved one in all a customer depends on). Pending: the approved one, unless
 * the change adds an allergen (or an ingredient whose allergens are not known) or loses a claim,
 * which a customer must hear at once: then the current one. Never approved: the current one.
 */
export function counterView(s: ProductStatus): { declaration: ServedDeclaration; approval: CounterApproval } {
  if (s.state === 'never-approved' || !s.approval || !s.change)
    return { declaration: s.current.served, approval: { state: 'never-approved', serves: 'current' } };
  const stamp = { approvedAt: s.approval.approvedAt.toISOString(), approvedBy: s.approval.approvedByName };
  if (s.state === 'approved') return { declaration: s.current.served, approval: { state: 'approved', ...stamp } };
  const urgent = s.change.urgent;
  return {
    declaration: urgent ? s.current.served : s.approval.body,
    approval: {
      state: 'pending',
      ...stamp,
      serves: urgent ? 'current' : 'approved',
      adds: s.change.added,
      losesClaims: s.change.claims.filter((c) => c.before === 'ok').map((c) => c.claim),
      notKnown: s.change.notKnownAdded.map((n) => n.name),
    },
  };
}
