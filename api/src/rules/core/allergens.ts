import {
  CONTROL_LABELS,
  SOURCE_LABELS,
  type AllergenSource,
  type BookIngredient,
  type CompositionTerms,
  type ContainedAllergen,
  type ExemptForm,
  type ExemptUse,
  type MayContainAllergen,
  type PrecautionStatement,
  type Site,
  type SourceEntry,
  type UnknownAllergens,
} from '@crumbproof/shared';
import { scanCompositionShared } from './composition-scan';
import type { AllergenGroup, Exemption, Lexicon, RegimeRules } from './reference-schema';
import { pathKey, type TreeNode } from './tree';

export interface SourceUse {
  source: AllergenSource;
  form?: ExemptForm;
  species?: string;
  /** 'composition': found by the composition scan although the supplier's list omits it. */
  origin: 'supplier' | 'composition' | 'sulphite-content';
  /** The composition text that named it. */
  term?: string;
}

/** What one leaf of the tree brings, before any regime is applied. */
export interface LeafFacts {
  node: TreeNode;
  ingredient: BookIngredient;
  /** False when the supplier gave no allergen statement (contains left out). */
  known: boolean;
  contains: SourceUse[];
  mayContain: SourceUse[];
  scan: CompositionTerms;
}

export function normalise(entry: SourceEntry): Omit<SourceUse, 'origin'> {
  return typeof entry === 'string' ? { source: entry } : { ...entry };
}

/** What an ingredient brings wherever it is used: a leaf's facts without its place in the tree. */
export type IngredientFacts = Omit<LeafFacts, 'node'>;

/** Supplier statement, composition scan and stated sulphite content of one ingredient. */
export function ingredientFacts(ingredient: BookIngredient, lexicon: Lexicon): IngredientFacts {
  const scan = scanCompositionShared(ingredient.composition ?? '', lexicon);
  const contains: SourceUse[] = (ingredient.contains ?? []).map((e) => ({ ...normalise(e), origin: 'supplier' }));
  for (const hit of scan.allergens) {
    if (!contains.some((c) => c.source === hit.source)) {
      contains.push({ source: hit.source, ...(hit.species ? { species: hit.species } : {}), origin: 'composition', term: hit.matched });
    }
  }
  if ((ingredient.sulphiteMgPerKg ?? 0) > 0 && !contains.some((c) => c.source === 'sulphites')) {
    contains.push({ source: 'sulphites', origin: 'sulphite-content' });
  }
  const mayContain: SourceUse[] = ingredient.mayContain.map((e) => ({ ...normalise(e), origin: 'supplier' as const }));
  for (const hit of scan.precautionary) {
    if (!mayContain.some((m) => m.source === hit.source) && !contains.some((c) => c.source === hit.source)) {
      mayContain.push({ source: hit.source, origin: 'composition', term: hit.matched });
    }
  }
  return { ingredient, known: ingredient.contains !== undefined, contains, mayContain, scan };
}

/**
 * Supplier statement, composition scan and stated sulphite content of each leaf. `known` keeps
 * each ingredient's facts once worked out (by id, for one book and lexicon), shared by every leaf
 * that uses it; they are never changed after.
 */
export function leafFacts(leaves: TreeNode[], lexicon: Lexicon, known = new Map<string, IngredientFacts>()): LeafFacts[] {
  return leaves.map((node) => {
    const ingredient = node.ingredient;
    if (!ingredient) throw new Error(`${node.name} is not an ingredient.`);
    let facts = known.get(ingredient.id);
    if (!facts) {
      facts = ingredientFacts(ingredient, lexicon);
      known.set(ingredient.id, facts);
    }
    const { known: isKnown, contains, mayContain, scan } = facts;
    return { node, ingredient, known: isKnown, contains, mayContain, scan };
  });
}

const groupsBySource = new WeakMap<RegimeRules, Map<AllergenSource, AllergenGroup[]>>();
/** The regime's groups a source counts under, in the regime's order (worked out once per regime and source; never change it). */
export function groupsOf(source: AllergenSource, rules: RegimeRules): readonly AllergenGroup[] {
  let bySource = groupsBySource.get(rules);
  if (!bySource) {
    bySource = new Map();
    groupsBySource.set(rules, bySource);
  }
  let groups = bySource.get(source);
  if (!groups) {
    groups = rules.groups.filter((g) => g.members.includes(source));
    bySource.set(source, groups);
  }
  return groups;
}

/** The exemption that keeps this use out of the declaration under this regime, if any. */
export function exemptionOf(use: Pick<SourceUse, 'source' | 'form'>, rules: RegimeRules): Exemption | undefined {
  if (!use.form) return undefined;
  return rules.exemptions.find((e) => e.source === use.source && e.form === use.form && !e.declared);
}

/** Sources this leaf declares under the regime (exempt forms left out; sulphites only when the product declares them). */
export function declaredUses(facts: LeafFacts, rules: RegimeRules, sulphitesDeclared: boolean): SourceUse[] {
  return facts.contains.filter((u) => !exemptionOf(u, rules) && (u.source !== 'sulphites' || sulphitesDeclared));
}

const pushUnique = <T>(list: T[], item: T) => {
  if (!list.includes(item)) list.push(item);
};
/** The keys of the paths already in each via list, so a path is found in it without joining every other. */
const pathKeys = new WeakMap<string[][], Set<string>>();
/** Adds a path to a via list unless the same path is in it already: each distinct path once. */
export const pushPath = (list: string[][], path: string[], key = pathKey(path)) => {
  let keys = pathKeys.get(list);
  if (!keys) {
    keys = new Set(list.map(pathKey));
    pathKeys.set(list, keys);
  }
  if (keys.has(key)) return;
  keys.add(key);
  list.push(path);
};

export function containsFor(all: LeafFacts[], rules: RegimeRules, sulphitesDeclared: boolean): ContainedAllergen[] {
  const found = new Map<string, ContainedAllergen>();
  for (const facts of all) {
    for (const use of declaredUses(facts, rules, sulphitesDeclared)) {
      for (const group of groupsOf(use.source, rules)) {
        const entry = found.get(group.code) ?? { allergen: group.code, label: group.label, sources: [], via: [] };
        pushUnique(entry.sources, use.source);
        if (use.species) {
          entry.species ??= [];
          pushUnique(entry.species, use.species);
        }
        pushPath(entry.via, facts.node.path, facts.node.key);
        // Still in the food, so declared here (Regulation (EU) No 1169/2011 Art. 9(1)(c) and 21),
        // and said to come through contact.
        if (facts.node.role === 'contact') pushPath((entry.contactVia ??= []), facts.node.path, facts.node.key);
        found.set(group.code, entry);
      }
    }
  }
  return rules.groups.flatMap((g) => found.get(g.code) ?? []);
}

/**
 * A citation as people read it: reference-data/regimes.json tags each citation with how it was
 * confirmed ([read] in the published text, [memory] recalled); that tag is for the data's
 * maintainers, not for a declaration's reader.
 */
export function citation(text: string): string {
  return text.replace(/\s*\[(read|memory|computed|inspected)\]/g, '').trim();
}

export function exemptUses(all: LeafFacts[], rules: RegimeRules): ExemptUse[] {
  const out: ExemptUse[] = [];
  for (const facts of all) {
    for (const use of facts.contains) {
      const ex = exemptionOf(use, rules);
      if (!ex || !use.form) continue;
      const same = out.find((o) => o.ingredient === facts.ingredient.id && o.source === use.source && o.form === use.form);
      if (same) pushPath(same.via, facts.node.path, facts.node.key);
      else
        out.push({
          ingredient: facts.ingredient.id,
          name: facts.ingredient.name,
          source: use.source,
          form: use.form,
          basis: citation(ex.basis),
          via: [facts.node.path],
        });
    }
  }
  return out;
}

export function unknownFor(all: LeafFacts[]): UnknownAllergens[] {
  const out: UnknownAllergens[] = [];
  const byIngredient = new Map<string, UnknownAllergens>();
  for (const facts of all.filter((f) => !f.known)) {
    const same = byIngredient.get(facts.ingredient.id);
    if (same) pushPath(same.via, facts.node.path, facts.node.key);
    else {
      const entry = { ingredient: facts.ingredient.id, name: facts.ingredient.name, via: [facts.node.path] };
      byIngredient.set(entry.ingredient, entry);
      out.push(entry);
    }
  }
  return out;
}

/** Who made a precautionary statement: the supplier's list, or the composition text. */
export function precautionWho(facts: LeafFacts, use: SourceUse): string {
  return use.origin === 'composition' ? `Composition of ${facts.ingredient.name}` : `Supplier of ${facts.ingredient.name}`;
}

export const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * Every precautionary statement with the source it names: each leaf's supplier list and
 * composition clause (exempt forms left out), then the kitchen's shared handling ('segregated'
 * gives none). Kept whatever the product contains; a source no group of the regime holds is left
 * out, as the declaration says nothing of it.
 */
export function precautionsFor(all: LeafFacts[], site: Site, rules: RegimeRules): PrecautionStatement[] {
  const out: PrecautionStatement[] = [];
  const statements = new Map<string, PrecautionStatement>();
  for (const facts of all) {
    for (const use of facts.mayContain) {
      if (exemptionOf(use, rules)) continue;
      const allergens = groupsOf(use.source, rules).map((g) => g.code);
      if (allergens.length === 0) continue;
      const origin = use.origin === 'composition' ? 'composition' : 'supplier';
      const statementKey = `${origin}|${facts.ingredient.id}|${use.source}`;
      const same = statements.get(statementKey);
      if (same) {
        pushPath(same.via, facts.node.path, facts.node.key);
        continue;
      }
      const statement: PrecautionStatement = {
        source: use.source,
        allergens,
        origin,
        ingredient: facts.ingredient.id,
        ingredientName: facts.ingredient.name,
        controls: null,
        via: [facts.node.path],
        message: `${precautionWho(facts, use)}: may contain ${SOURCE_LABELS[use.source]}`,
      };
      statements.set(statementKey, statement);
      out.push(statement);
    }
  }
  for (const handled of site.handles) {
    switch (handled.controls) {
      case 'segregated':
        break;
      case 'shared-equipment':
      case 'shared-area': {
        const allergens = groupsOf(handled.allergen, rules).map((g) => g.code);
        if (allergens.length === 0) break;
        out.push({
          source: handled.allergen,
          allergens,
          origin: 'kitchen',
          ingredient: null,
          ingredientName: null,
          controls: handled.controls,
          via: [],
          message: `${capitalise(SOURCE_LABELS[handled.allergen])}: ${CONTROL_LABELS[handled.controls]}`,
        });
        break;
      }
      default: {
        const never: never = handled.controls;
        throw new Error(`Unknown control ${String(never)}`);
      }
    }
  }
  return out;
}

/**
 * The may-contain line's groups, from the precautionary statements: a group the product contains
 * is never repeated, and a statement said twice is kept once.
 */
export function mayContainFor(
  precautions: PrecautionStatement[],
  rules: RegimeRules,
  contained: ContainedAllergen[],
): MayContainAllergen[] {
  const found = new Map<string, MayContainAllergen>();
  for (const p of precautions) {
    for (const group of rules.groups.filter((g) => p.allergens.includes(g.code))) {
      if (contained.some((c) => c.allergen === group.code)) continue;
      const entry = found.get(group.code) ?? { allergen: group.code, label: group.label, why: [] };
      pushUnique(entry.why, p.message);
      found.set(group.code, entry);
    }
  }
  return rules.groups.flatMap((g) => found.get(g.code) ?? []);
}
