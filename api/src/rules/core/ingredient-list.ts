import type { DeclarationNotice, DeclaredIngredient } from '@crumbproof/shared';
import { compare, round } from './compare';
import type { RegimeRules } from './reference-schema';
import type { ProductTree, TreeNode } from './tree';

/** Added water is recognised by the ingredient's isWater flag, or by an id or name of 'water'. */
export function isWater(node: TreeNode): boolean {
  const i = node.ingredient;
  return !!i && (i.isWater === true || i.id.toLowerCase() === 'water' || i.name.trim().toLowerCase() === 'water');
}

export interface IngredientList {
  entries: DeclaredIngredient[];
  warnings: DeclarationNotice[];
}

/**
 * The ingredient list: each level in descending order of weight at the time of use
 * (EU 1169/2011 Art. 18 and Annex VII; 21 CFR 101.4(a)(1)), ties kept in line order,
 * contact lines at the end of their level. A sub-recipe appears under its own name with its
 * own ingredients in brackets in their own order, whatever its share: the 2 % option of
 * Annex VII E.2(a) is only for compounds defined in Union law, and keeping the brackets never
 * loses an allergen.
 *
 * Added water (EU/UK, Regulation (EU) No 1169/2011 Annex VII Part A point 1): placed by its
 * weight in the finished product, taken as the level's finished weight minus the other
 * ingredients used (never more than the water used, never below 0); left out when that is at
 * most 5 % of the finished product, compared at the threshold precision (compare.ts). Its
 * percent is then its share of the finished product. Regimes without that derogation list
 * added water by the weight used.
 */
export function ingredientList(tree: ProductTree, rules: RegimeRules, groupsAt: (node: TreeNode) => string[]): IngredientList {
  const warnings: DeclarationNotice[] = [];

  const level = (nodes: TreeNode[], finishedG: number, parentPercent: number, of: string): DeclaredIngredient[] => {
    const omitUpTo = rules.addedWater.omitUpToPercent;
    const othersG = nodes.filter((n) => !isWater(n)).reduce((s, n) => s + n.usedG, 0);
    const entries: DeclaredIngredient[] = [];
    for (const node of nodes) {
      let orderWeightG = node.usedG;
      let percent = node.share * 100;
      if (omitUpTo !== null && isWater(node) && node.role !== 'contact') {
        const inFinished = Math.max(0, Math.min(node.usedG, finishedG - othersG));
        const shareOfFinished = finishedG > 0 ? (100 * inFinished) / finishedG : 0;
        if (compare(shareOfFinished, 'lte', omitUpTo)) {
          warnings.push({
            code: 'added-water-omitted',
            ingredient: node.id,
            message: `${node.name} is left out of the list: about ${round(shareOfFinished, 1)} % of ${of} as finished is added water, at most ${omitUpTo} % (${rules.addedWater.basis}).`,
          });
          continue;
        }
        orderWeightG = inFinished;
        percent = (parentPercent * shareOfFinished) / 100;
      }
      const children =
        node.kind === 'recipe' && node.recipe
          ? level(node.children, node.recipe.finishedWeightG ?? node.children.reduce((s, c) => s + c.usedG, 0), node.share * 100, node.name)
          : [];
      entries.push({
        id: node.id,
        name: node.name,
        kind: node.kind,
        percent,
        orderWeightG,
        allergens: groupsAt(node),
        role: node.role,
        children,
      });
    }
    const used = entries.filter((e) => e.role !== 'contact');
    const contact = entries.filter((e) => e.role === 'contact');
    // Array.prototype.sort is stable: equal weights keep their line order.
    return [...used.sort((a, b) => b.orderWeightG - a.orderWeightG), ...contact];
  };

  return { entries: level(tree.children, tree.finishedG, 100, tree.recipe.name), warnings };
}
