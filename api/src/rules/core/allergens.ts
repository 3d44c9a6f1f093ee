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
  type Provenance,
  type Site,
  type SourceEntry,
  type UnknownAllergens,
  type VagueHit,
  type VagueMention,
  VIA_LISTED_AT_MOST,
} from '@crumbproof/shared';
import { scanCompositionShared } from './composition-scan';
import type { AllergenGroup, Exemption, Lexicon, RegimeRules } from './reference-schema';
import { PATH_SEPARATOR, type RolledLeaf } from './tree';

export interface SourceUse {
  source: AllergenSource;
  form?: ExemptForm;
  species?: string;
  /** 'composition': found by the composition scan although the supplier's list omits it. */
  origin: 'supplier' | 'composition' | 'sulphite-content';
  /** The composition text that named it. */
  term?: string;
}

export function normalise(entry: SourceEntry): Omit<SourceUse, 'origin'> {
  return typeof entry === 'string' ? { source: entry } : { ...entry };
}

/** What an ingredient brings wherever it is used, before any regime is applied. */
export interface IngredientFacts {
  ingredient: BookIngredient;
  /** False when the supplier gave no allergen statement (contains left out). */
  known: boolean;
  contains: SourceUse[];
  mayContain: SourceUse[];
  scan: CompositionTerms;
}

/** One leaf of a product: its ingredient's facts at its place (tree.ts rollDown). */
export type Leaf = RolledLeaf<IngredientFacts>;

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
export function declaredUses(facts: Pick<IngredientFacts, 'contains'>, rules: RegimeRules, sulphitesDeclared: boolean): SourceUse[] {
  return facts.contains.filter((u) => !exemptionOf(u, rules) && (u.source !== 'sulphites' || sulphitesDeclared));
}

const pushUnique = <T>(list: T[], item: T) => {
  if (!list.includes(item)) list.push(item);
};

/**
 * A via list that takes each distinct path once, shortened as VIA_LISTED_AT_MOST says: its first
 * paths in leaf order, then only the first path through each place not yet listed (a line of the
 * product's own recipe, in the mix and by contact apart), the others counted into `more` of the
 * entry it fills. Paths are told apart by identity: rollDown gives two leaves with the same ids one
 * array, and only when the product has such leaves (`repeated`) can a path come again after
 * another; one leaf adding itself twice (two sources of one group) is the path just added.
 */
export class PathList {
  private last: string[] | undefined;
  private readonly seen: Set<string[]> | undefined;
  /** The places listed, each line's id; by contact with a mark after it. */
  private readonly places = new Set<string>();
  private more = 0;
  /** `list` starts empty; `leftOut` is told the count of paths left out each time it grows. */
  constructor(
    readonly list: string[][],
    repeated: boolean,
    private readonly leftOut: (count: number) => void,
  ) {
    this.seen = repeated ? new Set() : undefined;
  }
  add(path: string[], contact: boolean): void {
    if (path === this.last) return;
    if (this.seen) {
      if (this.seen.has(path)) return;
      this.seen.add(path);
    }
    this.last = path;
    const place = contact ? `${path[1] ?? ''}${PATH_SEPARATOR}` : (path[1] ?? '');
    if (this.list.length < VIA_LISTED_AT_MOST || !this.places.has(place)) {
      this.list.push(path);
      this.places.add(place);
    } else this.leftOut(++this.more);
  }
}

/**
 * A citation as people read it: reference-data/regimes.json tags each citation with how it was
 * confirmed ([read] in the published text, [memory] recalled); that tag is for the data's
 * maintainers, not for a declaration's reader.
 */
export function citation(text: string): string {
  return text.replace(/\s*\[(read|memory|computed|inspected)\]/g, '').trim();
}

/** Who made a precautionary statement: the supplier's list, or the composition text. */
export function precautionWho(facts: Pick<IngredientFacts, 'ingredient'>, use: Pick<SourceUse, 'origin'>): string {
  return use.origin === 'composition' ? `Composition of ${facts.ingredient.name}` : `Supplier of ${facts.ingredient.name}`;
}

export const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

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

/** The words of a vague composition term, as the warning and the vague list say them. */
export function vagueMessage(ingredient: BookIngredient, hit: VagueHit): string {
  const what = hit.precautionary ? `says it may contain '${hit.matched}' and so ${hit.message}` : `${hit.message} ('${hit.matched}')`;
  return `The composition of ${ingredient.name} ${what}. Ask the supplier which.`;
}

/**
 * What one ingredient gives each allergen list under one regime, wherever it is used: worked out
 * once per ingredient and regime, and added at each leaf with the leaf's path.
 */
export interface AllergenDigest {
  /** The groups of each declared use, with sulphites left out ([0]) or declared ([1]). */
  contains: [ContainsPart[], ContainsPart[]];
  precautions: PrecautionPart[];
  exempt: ExemptPart[];
  vague: VaguePart[];
}
interface ContainsPart {
  group: AllergenGroup;
  source: AllergenSource;
  species?: string;
}
interface PrecautionPart {
  /** One statement per origin, ingredient and source. */
  key: string;
  source: AllergenSource;
  allergens: string[];
  origin: 'supplier' | 'composition';
  message: string;
}
interface ExemptPart {
  key: string;
  source: AllergenSource;
  form: ExemptForm;
  basis: string;
}
interface VaguePart {
  /** One mention per ingredient, word and clause. */
  key: string;
  term: string;
  precautionary: boolean;
  mayMean: AllergenSource[];
  message: string;
}

export function allergenDigest(facts: IngredientFacts, rules: RegimeRules): AllergenDigest {
  const id = facts.ingredient.id;
  const containsParts = (sulphitesDeclared: boolean): ContainsPart[] =>
    declaredUses(facts, rules, sulphitesDeclared).flatMap((use) =>
      groupsOf(use.source, rules).map((group) => ({ group, source: use.source, ...(use.species ? { species: use.species } : {}) })),
    );
  const precautions: PrecautionPart[] = [];
  for (const use of facts.mayContain) {
    if (exemptionOf(use, rules)) continue;
    const allergens = groupsOf(use.source, rules).map((g) => g.code);
    if (allergens.length === 0) continue;
    const origin = use.origin === 'composition' ? 'composition' : 'supplier';
    precautions.push({
      key: `${origin}|${id}|${use.source}`,
      source: use.source,
      allergens,
      origin,
      message: `${precautionWho(facts, use)}: may contain ${SOURCE_LABELS[use.source]}`,
    });
  }
  const exempt: ExemptPart[] = [];
  for (const use of facts.contains) {
    const ex = exemptionOf(use, rules);
    if (!ex || !use.form) continue;
    exempt.push({ key: `${use.source}|${use.form}`, source: use.source, form: use.form, basis: citation(ex.basis) });
  }
  const vague = facts.scan.vague.map((hit) => {
    const term = hit.matched.toLowerCase();
    return {
      key: `${term}|${String(hit.precautionary)}`,
      term,
      precautionary: hit.precautionary,
      mayMean: hit.mayMean,
      message: vagueMessage(facts.ingredient, hit),
    };
  });
  return { contains: [containsParts(false), containsParts(true)], precautions, exempt, vague };
}

export interface AllergenLists {
  contains: ContainedAllergen[];
  precautions: PrecautionStatement[];
  vague: VagueMention[];
  unknown: UnknownAllergens[];
  exempt: ExemptUse[];
}

/**
 * Contains, precautionary statements, vague mentions, unknowns and exempt forms of a product's
 * leaves in one pass, each entry where its first leaf puts it with its distinct paths (PathList).
 * Contains: the declared uses (exempt forms left out; sulphites only when the product declares
 * them), a path through a contact line also in contactVia: still in the food, so declared
 * (Regulation (EU) No 1169/2011 Art. 9(1)(c) and 21). Precautions: every precautionary
 * statement with the source it names, each leaf's supplier list and composition clause (exempt
 * forms left out), then the kitchen's shared handling ('segregated' gives none); kept whatever
 * the product contains; a source no group of the regime holds is left out, as the declaration
 * says nothing of it.
 */
export function allergenLists(
  leaves: readonly Leaf[],
  repeated: boolean,
  digestOf: (facts: IngredientFacts) => AllergenDigest,
  site: Site,
  rules: RegimeRules,
  sulphitesDeclared: boolean,
): AllergenLists {
  const found = new Map<string, { entry: ContainedAllergen; via: PathList; contactVia?: PathList }>();
  const statements = new Map<string, PathList>();
  const precautions: PrecautionStatement[] = [];
  const vagueKept = new Map<string, PathList>();
  const vague: VagueMention[] = [];
  const unknownKept = new Map<string, PathList>();
  const unknown: UnknownAllergens[] = [];
  const exemptKept = new Map<string, PathList>();
  const exempt: ExemptUse[] = [];
  const add = <T extends Provenance>(kept: Map<string, PathList>, out: T[], key: string, leaf: Leaf, make: () => T) => {
    let list = kept.get(key);
    if (!list) {
      const item = make();
      out.push(item);
      list = new PathList(item.via, repeated, (n) => (item.viaMore = n));
      kept.set(key, list);
    }
    list.add(leaf.path, leaf.contact);
  };
  const side = sulphitesDeclared ? 1 : 0;
  for (const leaf of leaves) {
    const facts = leaf.facts;
    const i = facts.ingredient;
    const path = leaf.path;
    const digest = digestOf(facts);
    for (const part of digest.contains[side]) {
      let at = found.get(part.group.code);
      if (!at) {
        const entry: ContainedAllergen = { allergen: part.group.code, label: part.group.label, sources: [], via: [] };
        at = { entry, via: new PathList(entry.via, repeated, (n) => (entry.viaMore = n)) };
        found.set(part.group.code, at);
      }
      const entry = at.entry;
      pushUnique(entry.sources, part.source);
      if (part.species) {
        entry.species ??= [];
        pushUnique(entry.species, part.species);
      }
      at.via.add(path, leaf.contact);
      if (leaf.contact)
        (at.contactVia ??= new PathList((entry.contactVia = []), repeated, (n) => (entry.contactViaMore = n))).add(path, true);
    }
    for (const part of digest.precautions) {
      add(statements, precautions, part.key, leaf, () => ({
        source: part.source,
        allergens: [...part.allergens],
        origin: part.origin,
        ingredient: i.id,
        ingredientName: i.name,
        controls: null,
        via: [],
        message: part.message,
      }));
    }
    for (const part of digest.vague) {
      add(vagueKept, vague, `${i.id}|${part.key}`, leaf, () => ({
        ingredient: i.id,
        name: i.name,
        term: part.term,
        precautionary: part.precautionary,
        mayMean: [...part.mayMean],
        via: [],
        message: part.message,
      }));
    }
    if (!facts.known) add(unknownKept, unknown, i.id, leaf, () => ({ ingredient: i.id, name: i.name, via: [] }));
    for (const part of digest.exempt) {
      add(exemptKept, exempt, `${i.id}|${part.key}`, leaf, () => ({
        ingredient: i.id,
        name: i.name,
        source: part.source,
        form: part.form,
        basis: part.basis,
        via: [],
      }));
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
        precautions.push({
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
  return { contains: rules.groups.flatMap((g) => found.get(g.code)?.entry ?? []), precautions, vague, unknown, exempt };
}
