import { CLAIMS, type Claim, type ClaimStatus } from './allergens';
import type { ClaimReason, Declaration, DeclaredIngredient } from './declaration';
import { round } from './round';

/**
 * What changed between two declarations of a product: the swap check and the revision history
 * both show this, so it is computed once, here.
 */
export interface GroupChange {
  allergen: string;
  label: string;
}

export interface ClaimChange {
  claim: Claim;
  before: ClaimStatus;
  after: ClaimStatus;
  /** Why the claim stands as it does afterwards (every leaf that still stops it). */
  reasons: ClaimReason[];
}

export interface ShareChange {
  id: string;
  name: string;
  /** Percent of the product's mix before and after; null where absent. */
  before: number | null;
  after: number | null;
}

export interface DeclarationDiff {
  containsAdded: GroupChange[];
  containsRemoved: GroupChange[];
  mayContainAdded: GroupChange[];
  mayContainRemoved: GroupChange[];
  /** Every claim, changed or not, so a screen can show before and after side by side. */
  claims: ClaimChange[];
  shares: ShareChange[];
  finishedWeightG: { before: number; after: number };
  errorsAdded: string[];
  errorsRemoved: string[];
  /** True when anything a label or the counter shows is different. */
  changed: boolean;
}

const groups = (list: { allergen: string; label: string }[]) => new Map(list.map((g) => [g.allergen, g.label]));

function minus(a: Map<string, string>, b: Map<string, string>): GroupChange[] {
  return [...a].filter(([k]) => !b.has(k)).map(([allergen, label]) => ({ allergen, label }));
}

function flatten(items: DeclaredIngredient[], out = new Map<string, { name: string; percent: number }>()) {
  for (const i of items) {
    const prev = out.get(i.id);
    out.set(i.id, { name: i.name, percent: (prev?.percent ?? 0) + i.percent });
    flatten(i.children, out);
  }
  return out;
}

export function diffDeclarations(before: Declaration, after: Declaration): DeclarationDiff {
  const cb = groups(before.contains);
  const ca = groups(after.contains);
  const mb = groups(before.mayContain);
  const ma = groups(after.mayContain);
  const claims = CLAIMS.map((claim) => ({
    claim,
    before: before.claims[claim].status,
    after: after.claims[claim].status,
    reasons: after.claims[claim].reasons,
  }));
  const sb = flatten(before.ingredients);
  const sa = flatten(after.ingredients);
  const ids = new Set([...sb.keys(), ...sa.keys()]);
  const shares: ShareChange[] = [];
  for (const id of ids) {
    const b = sb.get(id);
    const a = sa.get(id);
    const bp = b ? round(b.percent, 2) : null;
    const ap = a ? round(a.percent, 2) : null;
    if (bp !== ap) shares.push({ id, name: (a ?? b)!.name, before: bp, after: ap });
  }
  const eb = new Set(before.errors.map((e) => e.message));
  const ea = new Set(after.errors.map((e) => e.message));
  const diff: DeclarationDiff = {
    containsAdded: minus(ca, cb),
    containsRemoved: minus(cb, ca),
    mayContainAdded: minus(ma, mb),
    mayContainRemoved: minus(mb, ma),
    claims,
    shares,
    finishedWeightG: { before: before.finishedWeightG, after: after.finishedWeightG },
    errorsAdded: [...ea].filter((m) => !eb.has(m)),
    errorsRemoved: [...eb].filter((m) => !ea.has(m)),
    changed: false,
  };
  diff.changed =
    diff.containsAdded.length + diff.containsRemoved.length + diff.mayContainAdded.length + diff.mayContainRemoved.length > 0 ||
    claims.some((c) => c.before !== c.after) ||
    shares.length > 0 ||
    before.ingredientsText !== after.ingredientsText ||
    diff.finishedWeightG.before !== diff.finishedWeightG.after;
  return diff;
}
