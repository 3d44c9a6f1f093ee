import { SOURCE_LABELS } from '../allergens';
import type { ClaimReason, ContainedAllergen, IdPath, PrecautionStatement } from '../declaration';
import type { ProductDeclaration } from '../product-declaration';
import type { CounterRules } from './ask';
import { entriesAlong, nameOf, throughContact } from './precautions';

/**
 * A product's declaration in sentences a person reads out to a customer at the counter: what it
 * has and where, what it may contain and why, what is not known, whether it is vegan and
 * vegetarian and why, and the usual caution. Every phrase is said once: allergens found in the
 * same places are said together, a statement's reasons are gathered per ingredient.
 */
export interface ReadAloud {
  /** "It has wheat, so gluten, in the Vanilla sponge and the Sweet shortcrust; and milk in the Butter." */
  contains: string;
  /** "It is made on equipment shared with sesame." "The supplier of Dark chocolate says it may contain hazelnut." */
  mayContain: string[];
  /** "Not known: Sugar sprinkles has no allergen statement, so nothing can be said of its allergens." */
  notKnown: string[];
  /** "It is vegan: none of its 9 ingredients is of animal origin, as recorded." / "It is not vegan: …" */
  claims: string[];
  /** Sources present in a form the law exempts from declaration, said so that nobody is surprised. */
  notes: string[];
  caution: string;
  /** Everything above, in the order it is read. */
  sentences: string[];
}

export const COUNTER_CAUTION =
  'This answer comes from the recipes and supplier information recorded in this kitchen. Cross-contact can happen in any kitchen. If in doubt, ask the kitchen; for a severe allergy, talk to the manager.';

/** Spoken names of the groups that gather several sources (common practice); others are said by their sources. */
const FAMILY_NAMES: Record<string, string> = { gluten: 'gluten', nuts: 'tree nuts', 'tree-nuts': 'tree nuts', wheat: 'wheat' };

/** "a", "a and b", "a, b and c". */
function listed(items: readonly string[], word = 'and'): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} ${word} ${items[items.length - 1]}`;
}

const unique = <T>(items: readonly T[]): T[] => items.filter((x, i) => items.indexOf(x) === i);
const stop = (sentence: string) => sentence.replace(/\.$/, '');

/** Where a path brings something: the first item under the product ("the Vanilla sponge"). */
function placeOf(declaration: ProductDeclaration, path: IdPath): string {
  const top = path[1];
  return top === undefined ? declaration.name : `the ${nameOf(declaration, top)}`;
}

/** The places of a group's paths: "in the Vanilla sponge and the Butter", "from the Plain flour it touches in the making". */
function placesOf(declaration: ProductDeclaration, via: IdPath[]): string {
  const mixed = unique(via.filter((p) => !throughContact(declaration, p)).map((p) => placeOf(declaration, p)));
  const touched = unique(
    via
      .filter((p) => throughContact(declaration, p))
      .map((p) => {
        const entries = entriesAlong(declaration, p);
        const line = entries.find((e) => e.role === 'contact');
        return `the ${line?.name ?? nameOf(declaration, p[p.length - 1] ?? '')}`;
      }),
  );
  const parts: string[] = [];
  if (mixed.length > 0) parts.push(`in ${listed(mixed)}`);
  if (touched.length > 0) parts.push(`from ${listed(touched)} it touches in the making`);
  return parts.join(' and ');
}

function sourcesSaid(entry: ContainedAllergen): string {
  const names = entry.sources.map((s) => SOURCE_LABELS[s]);
  const species = entry.species && entry.species.length > 0 ? ` (${listed(entry.species)})` : '';
  return `${listed(names)}${species}`;
}

function containsSentence(declaration: ProductDeclaration, rules: CounterRules): string {
  const clauses: Array<{ key: string; sources: string; families: string[]; places: string }> = [];
  for (const entry of declaration.contains) {
    const sources = sourcesSaid(entry);
    const places = placesOf(declaration, entry.via);
    const group = rules.groups.find((g) => g.code === entry.allergen);
    const family = (group?.sources.length ?? 0) > 1 ? (FAMILY_NAMES[entry.allergen] ?? entry.label) : null;
    const key = `${sources}|${places}`;
    const same = clauses.find((c) => c.key === key);
    const families = family && !entry.sources.some((s) => SOURCE_LABELS[s] === family) ? [family] : [];
    if (same) same.families = unique([...same.families, ...families]);
    else clauses.push({ key, sources, families, places });
  }
  if (clauses.length === 0) {
    return declaration.unknown.length > 0
      ? 'None of the allergens the law lists is recorded in it, but the record is incomplete.'
      : 'None of the allergens the law lists is recorded in it.';
  }
  const byPlace: Array<{ places: string; items: string[] }> = [];
  for (const c of clauses) {
    const item = `${c.sources}${c.families.length > 0 ? `, so ${listed(c.families)},` : ''}`;
    const same = byPlace.find((b) => b.places === c.places);
    if (same) same.items.push(item);
    else byPlace.push({ places: c.places, items: [item] });
  }
  const said = byPlace.map((b) => `${listed(b.items)} ${b.places}`);
  return said.length === 1 ? `It has ${said[0]}.` : `It has ${said.slice(0, -1).join('; ')}; and ${said[said.length - 1]}.`;
}

/**
 * The precautionary statements, gathered: the kitchen's handling first, then what each supplier's
 * list and each composition says. A source the product has is not said again as a may-contain
 * (sesame on shared equipment, in a product with sesame); a source of a group it has that it does
 * not have itself is (may contain walnut, in a pecan tart).
 */
function mayContainSentences(declaration: ProductDeclaration): string[] {
  const has = new Set(declaration.contains.flatMap((c) => c.sources));
  const precautions = declaration.precautions.filter((p) => !has.has(p.source));
  const named = (items: PrecautionStatement[]) => listed(unique(items.map((p) => SOURCE_LABELS[p.source])));
  const out: string[] = [];
  const equipment = precautions.filter((p) => p.origin === 'kitchen' && p.controls === 'shared-equipment');
  if (equipment.length > 0) out.push(`It is made on equipment shared with ${named(equipment)}.`);
  const area = precautions.filter((p) => p.origin === 'kitchen' && p.controls === 'shared-area');
  const areaSources = unique(area.map((p) => p.source));
  if (area.length > 0) out.push(`It is made in an area where ${named(area)} ${areaSources.length > 1 ? 'are' : 'is'} handled.`);
  for (const reason of ['supplier', 'composition'] as const) {
    const of = precautions.filter((p) => p.origin === reason);
    const byNamed: Array<{ named: string; ingredients: string[] }> = [];
    for (const ingredient of unique(of.map((p) => p.ingredientName ?? ''))) {
      const what = named(of.filter((p) => (p.ingredientName ?? '') === ingredient));
      const same = byNamed.find((b) => b.named === what);
      if (same) same.ingredients.push(ingredient);
      else byNamed.push({ named: what, ingredients: [ingredient] });
    }
    for (const b of byNamed) {
      const many = b.ingredients.length > 1;
      out.push(
        reason === 'supplier'
          ? `The supplier${many ? 's' : ''} of ${listed(b.ingredients)} say${many ? '' : 's'} it may contain ${b.named}.`
          : `The ingredients text${many ? 's' : ''} of ${listed(b.ingredients)} say${many ? '' : 's'} it may contain ${b.named}.`,
      );
    }
  }
  for (const v of declaration.vague.filter((x) => x.precautionary)) {
    out.push(`The ingredients text of ${v.name} says it may contain ${v.term}, without saying which.`);
  }
  return unique(out);
}

function notKnownSentences(declaration: ProductDeclaration): string[] {
  const out: string[] = [];
  const names = declaration.unknown.map((u) => u.name);
  if (names.length === 1) out.push(`Not known: ${names[0]} has no allergen statement, so nothing can be said of its allergens.`);
  if (names.length > 1) out.push(`Not known: ${listed(names)} have no allergen statement, so nothing can be said of their allergens.`);
  for (const v of declaration.vague.filter((x) => !x.precautionary)) {
    out.push(`Not known: the ingredients text of ${v.name} names ${v.term} without saying which.`);
  }
  if (declaration.sulphites.status === 'not-known') {
    const touched = declaration.sulphites.missing.filter((m) => m.reason === 'contact-line').map((m) => m.name);
    out.push(
      touched.length > 0
        ? `Whether it has sulphites above the labelling threshold is not known: ${listed(touched)} ${touched.length > 1 ? 'bring' : 'brings'} them through contact, which is not weighed.`
        : 'Whether it has sulphites above the labelling threshold is not known.',
    );
  }
  return out;
}

/** Distinct ingredients (leaves) of the product, contact lines included. */
function leafCount(declaration: ProductDeclaration): number {
  const ids = new Set<string>();
  const walk = (entries: ProductDeclaration['ingredients']) =>
    entries.forEach((e) => (e.kind === 'ingredient' ? ids.add(e.id) : walk(e.children)));
  walk(declaration.ingredients);
  return ids.size;
}

/**
 * A claim's reasons, one per ingredient (the one that says what it has, when there is one), with
 * the places it comes from: "Unsalted butter contains milk (in the Vanilla sponge)".
 */
function reasonsSaid(declaration: ProductDeclaration, reasons: ClaimReason[]): string {
  const keyOf = (r: ClaimReason) => r.leaf ?? stop(r.message);
  return unique(reasons.map(keyOf))
    .map((key) => {
      const own = reasons.filter((r) => keyOf(r) === key);
      const message = stop((own.find((r) => / contains /.test(r.message)) ?? own[0])?.message ?? '');
      const places = unique(own.filter((r) => r.path.length > 2).map((r) => placeOf(declaration, r.path)));
      return places.length > 0 ? `${message} (in ${listed(places)})` : message;
    })
    .join('; ');
}

function claimSentences(declaration: ProductDeclaration): string[] {
  const out: string[] = [];
  const count = leafCount(declaration);
  const ingredients = count === 1 ? 'its one ingredient' : `its ${count} ingredients`;
  for (const claim of ['vegan', 'vegetarian'] as const) {
    const result = declaration.claims[claim];
    const none = count === 1 ? `${ingredients} is not` : `none of ${ingredients} is`;
    if (result.status === 'ok') {
      out.push(
        claim === 'vegan' ? `It is vegan: ${none} of animal origin, as recorded.` : `It is vegetarian: ${none} meat or fish, as recorded.`,
      );
    } else if (result.status === 'fails') {
      out.push(`It is not ${claim}: ${reasonsSaid(declaration, result.reasons)}.`);
    } else {
      out.push(`Whether it is ${claim} is not known: ${reasonsSaid(declaration, result.reasons)}.`);
    }
  }
  if (declaration.warnings.some((w) => w.code === 'vegan-not-dairy-free')) out.push('Vegan is not milk-free: it may contain milk.');
  return out;
}

function notesOf(declaration: ProductDeclaration): string[] {
  return declaration.exempt.map(
    (e) => `${e.name} is made from ${SOURCE_LABELS[e.source]}, in a form the law does not require to be declared (${e.basis}).`,
  );
}

/** The declaration as sentences for the counter. */
export function readAloud(declaration: ProductDeclaration, rules: CounterRules): ReadAloud {
  const contains = containsSentence(declaration, rules);
  const mayContain = mayContainSentences(declaration);
  const notKnown = notKnownSentences(declaration);
  const claims = claimSentences(declaration);
  const notes = notesOf(declaration);
  return {
    contains,
    mayContain,
    notKnown,
    claims,
    notes,
    caution: COUNTER_CAUTION,
    sentences: [contains, ...mayContain, ...notKnown, ...claims, ...notes, COUNTER_CAUTION],
  };
}
