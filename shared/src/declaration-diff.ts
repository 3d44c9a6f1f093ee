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

/** A line of the label as printed, before and after (null where the label has no such line). */
export interface PrintedChange {
  before: string | null;
  after: string | null;
}

/** A QUID entry whose printed text changed (the engine's own rounding), by ingredient; null where absent. */
export interface QuidChange {
  ingredient: string;
  name: string;
  before: string | null;
  after: string | null;
}

export interface DeclarationDiff {
  containsAdded: GroupChange[];
  containsRemoved: GroupChange[];
  mayContainAdded: GroupChange[];
  mayContainRemoved: GroupChange[];
  /** Every claim, changed or not, so a screen can show before and after side by side. */
  claims: ClaimChange[];
  shares: ShareChange[];
  /** The ingredient list as printed, when it changed; null when it did not. */
  ingredientsText: PrintedChange | null;
  /** The may-contain line as printed, when it changed; null when it did not. */
  mayContainText: PrintedChange | null;
  /** QUID entries whose printed text changed. */
  quid: QuidChange[];
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

function printedChange(before: string | null, after: string | null): PrintedChange | null {
  return before === after ? null : { before, after };
}

function quidChanges(before: Declaration, after: Declaration): QuidChange[] {
  const qb = new Map(before.quid.map((q) => [q.ingredient, q]));
  const qa = new Map(after.quid.map((q) => [q.ingredient, q]));
  return [...new Set([...qb.keys(), ...qa.keys()])]
    .filter((id) => qb.get(id)?.text !== qa.get(id)?.text)
    .map((id) => ({
      ingredient: id,
      name: (qa.get(id) ?? qb.get(id))!.name,
      before: qb.get(id)?.text ?? null,
      after: qa.get(id)?.text ?? null,
    }));
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
    ingredientsText: printedChange(before.ingredientsText, after.ingredientsText),
    mayContainText: printedChange(before.mayContainText ?? null, after.mayContainText ?? null),
    quid: quidChanges(before, after),
    finishedWeightG: { before: before.finishedWeightG, after: after.finishedWeightG },
    errorsAdded: [...ea].filter((m) => !eb.has(m)),
    errorsRemoved: [...eb].filter((m) => !ea.has(m)),
    changed: false,
  };
  diff.changed =
    diff.containsAdded.length + diff.containsRemoved.length + diff.mayContainAdded.length + diff.mayContainRemoved.length > 0 ||
    claims.some((c) => c.before !== c.after) ||
    shares.length > 0 ||
    diff.ingredientsText !== null ||
    diff.mayContainText !== null ||
    diff.quid.length > 0 ||
    diff.finishedWeightG.before !== diff.finishedWeightG.after;
  return diff;
}

/** A group the product gains: in what it contains (with the sources new to it) or in what it may contain. */
export interface AddedAllergen {
  allergen: string;
  label: string;
  how: 'contains' | 'may-contain';
  /** The sources new to the group (for contains: a group already there may gain a source, as pecan gains walnut). */
  sources: string[];
}

/**
 * What changed between two declarations of a product in what a customer or a label depends on:
 * contains (groups and their sources), may contain, every claim's status, the ingredient list as
 * printed, the QUID percentages as printed and the ingredients whose allergens are not known.
 * Anything else (nutrition, a finished weight that moves no percentage, the wording of a reason)
 * is left out, so a change that alters none of these needs no new approval.
 */
export interface DeclaredChange {
  added: AddedAllergen[];
  containsRemoved: GroupChange[];
  mayContainRemoved: GroupChange[];
  /** Only the claims whose status changed. */
  claims: { claim: Claim; before: ClaimStatus; after: ClaimStatus }[];
  ingredientsText: { before: string; after: string } | null;
  /** QUID entries whose printed text changed, by ingredient (null where absent). */
  quid: QuidChange[];
  /** Ingredients whose allergens became not known (no allergen statement). */
  notKnownAdded: { ingredient: string; name: string }[];
  notKnownRemoved: { ingredient: string; name: string }[];
  /** It adds an allergen (contains, may contain, or a source of one), an ingredient whose allergens are not known, or loses a claim that held. */
  urgent: boolean;
  changed: boolean;
}

const sourcesOf = (d: Declaration) => new Map(d.contains.map((c) => [c.allergen, new Set<string>(c.sources)]));

export function declaredChange(before: Declaration, after: Declaration): DeclaredChange {
  const cb = groups(before.contains);
  const ca = groups(after.contains);
  const mb = groups(before.mayContain);
  const ma = groups(after.mayContain);
  const sb = sourcesOf(before);
  const added: AddedAllergen[] = [];
  for (const c of after.contains) {
    const was = sb.get(c.allergen);
    const fresh = c.sources.filter((s) => !was?.has(s));
    if (!was || fresh.length > 0) added.push({ allergen: c.allergen, label: c.label, how: 'contains', sources: fresh });
  }
  // A may-contain of a group the product now contains is said by the contains.
  const may = new Map<string, AddedAllergen>();
  for (const g of minus(ma, mb)) if (!ca.has(g.allergen)) may.set(g.allergen, { ...g, how: 'may-contain', sources: [] });
  // A precautionary statement of a source new to the product (hazelnut beside walnuts) is news to a
  // customer who avoids that source, even when its group is declared already.
  const containedAfter = new Set(after.contains.flatMap((c) => c.sources as string[]));
  const warnedBefore = new Set([
    ...before.precautions.map((p) => p.source as string),
    ...before.contains.flatMap((c) => c.sources as string[]),
  ]);
  const labels = new Map([...ca, ...ma, ...cb, ...mb]);
  for (const p of after.precautions) {
    if (containedAfter.has(p.source) || warnedBefore.has(p.source)) continue;
    for (const g of p.allergens) {
      const entry = may.get(g) ?? { allergen: g, label: labels.get(g) ?? g, how: 'may-contain' as const, sources: [] };
      if (!entry.sources.includes(p.source)) entry.sources.push(p.source);
      may.set(g, entry);
    }
  }
  added.push(...may.values());
  const claims = CLAIMS.filter((c) => before.claims[c].status !== after.claims[c].status).map((claim) => ({
    claim,
    before: before.claims[claim].status,
    after: after.claims[claim].status,
  }));
  const quid = quidChanges(before, after);
  const ub = new Map(before.unknown.map((u) => [u.ingredient, u.name]));
  const ua = new Map(after.unknown.map((u) => [u.ingredient, u.name]));
  const notKnownAdded = [...ua].filter(([id]) => !ub.has(id)).map(([ingredient, name]) => ({ ingredient, name }));
  const notKnownRemoved = [...ub].filter(([id]) => !ua.has(id)).map(([ingredient, name]) => ({ ingredient, name }));
  const change: DeclaredChange = {
    added,
    containsRemoved: minus(cb, ca),
    mayContainRemoved: minus(mb, ma).filter((g) => !ca.has(g.allergen)),
    claims,
    ingredientsText:
      before.ingredientsText === after.ingredientsText ? null : { before: before.ingredientsText, after: after.ingredientsText },
    quid,
    notKnownAdded,
    notKnownRemoved,
    urgent: added.length > 0 || notKnownAdded.length > 0 || claims.some((c) => c.before === 'ok'),
    changed: false,
  };
  change.changed =
    added.length + change.containsRemoved.length + change.mayContainRemoved.length + claims.length + quid.length > 0 ||
    notKnownAdded.length + notKnownRemoved.length > 0 ||
    change.ingredientsText !== null;
  return change;
}

/** The change adds an allergen: a group to contains or may contain, or a source to one. */
export function addsAllergen(change: DeclaredChange): boolean {
  return change.added.length > 0;
}
