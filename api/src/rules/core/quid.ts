import type { DeclarationNotice, QuidEntry } from '@crumbproof/shared';
import { compare, round } from './compare';
import type { LineNode, LineTree } from './tree';

/** Every node of the tree, depth first, each before its children. */
function all(nodes: LineNode[], out: LineNode[] = []): LineNode[] {
  for (const n of nodes) {
    out.push(n);
    all(n.children, out);
  }
  return out;
}

/** Whole numbers from 1 % up, one decimal below (rounding is common practice, not fixed by the Regulation; from memory). */
export function formatPercent(percent: number): string {
  return compare(percent, 'gte', 1) ? `${round(percent, 0)}%` : `${round(percent, 1)}%`;
}

const lowerFirst = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);

/**
 * QUID for the ids in sale.quid, related to the finished product after moisture loss
 * (Regulation (EU) No 1169/2011 Annex VIII point 4(a)): 100 × weight used / finished weight.
 * The weight used adds every use of the id in the product (sub-recipes scaled to the amount
 * used). When any one figure or the total of those shown "exceeds 100 %" (compared at the
 * threshold precision, compare.ts: exactly 100 % does not exceed it), every entry is given as
 * "prepared with X g of Y per 100 g" instead.
 */
export function quidFor(tree: LineTree, ids: string[]): { quid: QuidEntry[]; errors: DeclarationNotice[] } {
  const nodes = ids.length === 0 ? [] : all(tree.children).filter((n) => n.role !== 'contact');
  const errors: DeclarationNotice[] = [];
  const found = ids.flatMap((id) => {
    const uses = nodes.filter((n) => n.id === id);
    const grams = uses.reduce((s, n) => s + n.massG, 0);
    if (uses.length === 0 || grams <= 0) {
      errors.push({
        code: 'quid-not-in-product',
        ingredient: id,
        message: `The quantity of '${id}' is asked for, but ${tree.recipe.name} does not use it.`,
      });
      return [];
    }
    return [{ id, name: uses[0].name, percent: tree.finishedG > 0 ? (100 * grams) / tree.finishedG : 0 }];
  });
  const total = found.reduce((s, f) => s + f.percent, 0);
  const perHundred = found.some((f) => compare(f.percent, 'gt', 100)) || compare(total, 'gt', 100);
  const quid = found.map((f) => ({
    ingredient: f.id,
    name: f.name,
    percent: f.percent,
    text: perHundred
      ? `Prepared with ${round(f.percent, 1)} g of ${lowerFirst(f.name)} per 100 g`
      : `${f.name} ${formatPercent(f.percent)}`,
  }));
  return { quid, errors };
}
