import type { BookIngredient, DeclarationNotice, DeclaredIngredient } from '@crumbproof/shared';
import { compare, round } from './compare';
import type { RegimeRules } from './reference-schema';
import type { LineNode, LineTree } from './tree';

const WATER = new WeakMap<BookIngredient, boolean>();
/** Added water is recognised by the ingredient's isWater flag, or by an id or name of 'water' (worked out once per ingredient). */
export function isWater(node: Pick<LineNode, 'ingredient'>): boolean {
  const i = node.ingredient;
  if (!i) return false;
  let water = WATER.get(i);
  if (water === undefined) {
    water = i.isWater === true || i.id.toLowerCase() === 'water' || i.name.trim().toLowerCase() === 'water';
    WATER.set(i, water);
  }
  return water;
}

/** The children of an entry with none, one array for all (never changed). */
const NO_ENTRIES = Object.freeze([]) as unknown as DeclaredIngredient[];

interface Bake {
  ratio: number;
  in: string;
}

export interface IngredientList {
  entries: DeclaredIngredient[];
  warnings: DeclarationNotice[];
}

/**
 * The ingredient list: each level in descending order of weight at the time of use
 * (Regulation (EU) No 1169/2011 Art. 18 and Annex VII; 21 CFR 101.4(a)(1)), ties kept in line
 * order, contact lines at the end of their level (an ingredient also used in the mix at that
 * level is listed once, in its place by weight). A sub-recipe appears under its own name with
 * its own ingredients in brackets in their own order, whatever its share: the 2 % option of
 * Annex VII Part E point 2(a) is only for compounds defined in Union law, and keeping the
 * brackets never loses an allergen. No 2 % threshold is therefore applied.
 *
 * Added water (EU/UK, Regulation (EU) No 1169/2011 Annex VII Part A point 1: listed by its
 * weight in the finished product, "the total finished product − the total of the other
 * ingredients used"; need not be listed at no more than 5 % of the finished product): placed by
 * the level's finished weight minus the other ingredients used at that level (never more than
 * the water used, never below 0), and left out when that is at most 5 % of the level as finished,
 * compared at the threshold precision (compare.ts). Its percent is then its share of the
 * finished level. The level's finished weight is:
 * - the product: its finishedWeightG, else its mix (nothing known to be lost);
 * - a sub-recipe with a finishedWeightG of its own: that weight (its own bake loss);
 * - a sub-recipe without one (a dough or choux paste kept unbaked and baked as part of the
 *   product): its mix × the finished/mix ratio of the nearest recipe above it that has a
 *   finished weight, i.e. it loses the product's own bake loss in proportion to its weight.
 *   A sub-recipe added after baking should record its finished weight (its mix when nothing is
 *   lost), so that its water is not taken to have baked off.
 * Regimes without that derogation list added water by the weight used.
 */
/** `groupsAt` gives a node's groups; the list never changes the array it gives. */
export function ingredientList(tree: LineTree, rules: RegimeRules, groupsAt: (node: LineNode) => string[]): IngredientList {
  const warnings: DeclarationNotice[] = [];
  const omitUpTo = rules.addedWater.omitUpToPercent;
  const mixOf = (nodes: LineNode[]) => nodes.reduce((s, n) => s + n.usedG, 0);

  /** `bake`: finished weight / mix of the nearest recipe at or above this level that has a finished weight, and its name. */
  const level = (nodes: LineNode[], finishedG: number, bake: Bake, parentPercent: number, of: string): DeclaredIngredient[] => {
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
      let children = NO_ENTRIES;
      if (node.kind === 'recipe' && node.recipe) {
        const mix = mixOf(node.children);
        const own = node.recipe.finishedWeightG;
        const childBake = own !== undefined ? { ratio: mix > 0 ? own / mix : 1, in: node.name } : bake;
        const of = own !== undefined ? node.name : `${node.name} baked as part of ${bake.in}`;
        children = level(node.children, own ?? mix * bake.ratio, childBake, node.share * 100, of);
      }
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
    // An ingredient used in the mix and also by contact (flour in the dough and on the tin) is
    // listed once, in its place by weight; one used only by contact once at the end of its level.
    const contact: DeclaredIngredient[] = [];
    for (const e of entries.filter((x) => x.role === 'contact')) {
      const same = used.find((u) => u.id === e.id) ?? contact.find((c) => c.id === e.id);
      if (!same) {
        contact.push(e);
        continue;
      }
      // A new array: an entry's groups may be the item's own, shared by every entry of it (groupsAt).
      const more = e.allergens.filter((a) => !same.allergens.includes(a));
      if (more.length > 0) same.allergens = [...same.allergens, ...more];
    }
    // Array.prototype.sort is stable: equal weights keep their line order.
    return [...used.sort((a, b) => b.orderWeightG - a.orderWeightG), ...contact];
  };

  const product: Bake = { ratio: tree.mixG > 0 ? tree.finishedG / tree.mixG : 1, in: tree.recipe.name };
  return { entries: level(tree.children, tree.finishedG, product, 100, tree.recipe.name), warnings };
}
