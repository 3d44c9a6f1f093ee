import {
  CLAIMS,
  CONTROL_LABELS,
  SOURCE_LABELS,
  type AllergenSource,
  type Claim,
  type ClaimReason,
  type ClaimResult,
  type ClaimStatus,
  type DeclaredClaims,
  type Site,
} from '@crumbproof/shared';
import { capitalise, exemptionOf, precautionWho, type LeafFacts } from './allergens';
import { compare, round } from './compare';
import { pathKey } from './tree';
import type { DietClaim } from './composition-scan';
import type { FreeFromClaim, RegimeRules } from './reference-schema';

/** Sources that are animal products by definition (common practice). */
const NOT_VEGAN: readonly AllergenSource[] = ['milk', 'egg', 'fish', 'crustacean', 'mollusc'];
const NOT_VEGETARIAN: readonly AllergenSource[] = ['fish', 'crustacean', 'mollusc'];

/** `key`: the reason's path as a key (tree.ts pathKey), when already known. */
type Found = { status: Exclude<ClaimStatus, 'ok'>; reason: ClaimReason; key?: string };
/** A reason as an ingredient gives it, wherever it is used (the leaf adds its path). */
type Said = { status: Exclude<ClaimStatus, 'ok'>; message: string };

/** Everything an ingredient says for the claims under one regime, apart from gluten (which weighs the leaf). */
interface IngredientSaid {
  /** Vegan and vegetarian: recorded status, animal sources and terms. */
  diet: Record<DietClaim, Said[]>;
  /** A free-from claim: contains and may-contains of its sources. */
  freeFrom: Record<FreeFromClaim, Said[]>;
  /** A composition that names an allergen without saying which. */
  vague: Record<Claim, Said[]>;
  /** No allergen statement. */
  unknown: Said[];
}

/**
 * What each ingredient says for each claim under a regime, worked out once and shared by every
 * leaf that uses the ingredient in any product (the same book and regime): by regime, then id.
 */
export type ClaimMemo = WeakMap<RegimeRules, Map<string, IngredientSaid>>;

function saidBy(f: LeafFacts, rules: RegimeRules): IngredientSaid {
  const name = f.ingredient.name;
  const freeFrom = {} as Record<FreeFromClaim, Said[]>;
  for (const claim of FREE_FROM) {
    const sources = rules.freeFrom[claim];
    freeFrom[claim] = [
      ...f.contains
        .filter((u) => sources.includes(u.source))
        .map((use) => ({ status: 'fails' as const, message: `${name} contains ${SOURCE_LABELS[use.source]}.` })),
      ...f.mayContain
        .filter((u) => sources.includes(u.source))
        .map((use) => ({ status: 'fails' as const, message: `${precautionWho(f, use)}: may contain ${SOURCE_LABELS[use.source]}.` })),
    ];
  }
  const vague = {} as Record<Claim, Said[]>;
  for (const claim of CLAIMS) {
    vague[claim] = f.scan.vague
      .filter((h) => h.unverifies.includes(claim))
      .map((h) =>
        h.precautionary
          ? { status: 'fails' as const, message: `The composition of ${name} says it may contain '${h.matched}'.` }
          : { status: 'unverified' as const, message: `The composition of ${name} ${h.message} ('${h.matched}').` },
      );
  }
  return {
    diet: { vegan: dietarySaid('vegan', f), vegetarian: dietarySaid('vegetarian', f) },
    freeFrom,
    vague,
    unknown: f.known ? [] : [{ status: 'unverified', message: `${name} has no allergen statement.` }],
  };
}

const FREE_FROM: readonly FreeFromClaim[] = ['egg-free', 'dairy-free', 'nut-free', 'peanut-free', 'sesame-free'];

/** Each leaf's reasons of one kind, from what its ingredient says (`said[n]` for leaf n) and the leaf's path, in leaf order. */
function perLeaf(all: LeafFacts[], said: IngredientSaid[], pick: (s: IngredientSaid) => Said[]): Found[] {
  const found: Found[] = [];
  for (let n = 0; n < all.length; n++) {
    const own = pick(said[n]);
    if (own.length === 0) continue;
    const f = all[n];
    for (const x of own) found.push({ status: x.status, reason: reason(f, x.message), key: f.node.key });
  }
  return found;
}

/** fails wins over unverified, which wins over ok. */
function settle(found: Found[]): ClaimResult {
  const status: ClaimStatus = found.some((f) => f.status === 'fails') ? 'fails' : found.length > 0 ? 'unverified' : 'ok';
  // The same message by the same path is said once: by path, its one message or the set of them.
  const seen = new Map<string, string | Set<string>>();
  const reasons: ClaimReason[] = [];
  const keep = (f: Found) => {
    const key = f.key ?? pathKey(f.reason.path);
    const message = f.reason.message;
    const said = seen.get(key);
    if (said === undefined) seen.set(key, message);
    else if (typeof said === 'string') {
      if (said === message) return;
      seen.set(key, new Set([said, message]));
    } else {
      if (said.has(message)) return;
      said.add(message);
    }
    reasons.push(f.reason);
  };
  for (const f of found) if (f.status === 'fails') keep(f);
  for (const f of found) if (f.status === 'unverified') keep(f);
  return { status, reasons };
}

/** Said of a leaf that reaches the food through a contact line (a greased griddle, a floured tin), so the reason says how. */
const THROUGH_CONTACT = ' (through a contact line: greasing or dusting)';

/** A leaf's reason at its path; one under a contact line says so, as the contains list does. */
function reason(facts: LeafFacts, message: string): ClaimReason {
  const said =
    facts.node.role === 'contact' && !message.includes('through a contact line') ? message.replace(/\.$/, `${THROUGH_CONTACT}.`) : message;
  return { leaf: facts.ingredient.id, path: facts.node.path, message: said };
}

/** Vegan and vegetarian are about ingredients: recorded status, animal sources and animal-derived terms. */
function dietarySaid(claim: DietClaim, f: LeafFacts): Said[] {
  const found: Said[] = [];
  const animal = claim === 'vegan' ? NOT_VEGAN : NOT_VEGETARIAN;
  const name = f.ingredient.name;
  const recorded = f.ingredient[claim];
  if (recorded === false) found.push({ status: 'fails', message: `${name} is recorded as not ${claim}.` });
  if (recorded === null) found.push({ status: 'unverified', message: `${name} has no recorded ${claim} status.` });
  for (const use of f.contains.filter((u) => animal.includes(u.source))) {
    found.push({
      status: 'fails',
      message: `${name} contains ${SOURCE_LABELS[use.source]}${use.term ? ` ('${use.term}' in its composition)` : ''}.`,
    });
  }
  for (const hit of f.scan.animal) {
    if (hit.fails.includes(claim))
      found.push({ status: 'fails', message: `The composition of ${name} names '${hit.matched}', which is not ${claim}.` });
    else if (hit.unverified.includes(claim)) {
      found.push({ status: 'unverified', message: `The composition of ${name} names '${hit.matched}', which may be animal-derived.` });
    }
  }
  return found;
}

function sharedHandling(site: Site, sources: readonly AllergenSource[]): Found[] {
  return site.handles
    .filter((h) => sources.includes(h.allergen) && h.controls !== 'segregated')
    .map((h) => ({
      status: 'fails' as const,
      reason: {
        leaf: null,
        path: [],
        message: `${capitalise(SOURCE_LABELS[h.allergen])} is handled in this kitchen (${CONTROL_LABELS[h.controls]}).`,
      },
    }));
}

/** Fails on any contains or may-contain of the claim's sources; unverified when a leaf has no allergen statement. */
function freeFrom(claim: FreeFromClaim, all: LeafFacts[], site: Site, rules: RegimeRules, said: IngredientSaid[]): ClaimResult {
  return settle([
    ...perLeaf(all, said, (x) => x.freeFrom[claim]),
    ...perLeaf(all, said, (x) => x.vague[claim]),
    ...sharedHandling(site, rules.freeFrom[claim]),
    ...perLeaf(all, said, (x) => x.unknown),
  ]);
}

/**
 * Gluten-free under the regime's published rule: EU "no more than 20 mg/kg" (Commission
 * Implementing Regulation (EU) No 828/2014 Article 3 and its Annex), UK the same assimilated
 * text (from memory), Canada at most 20 ppm (Food and Drug Regulations B.24.018 with Health
 * Canada's 2012 position), US "less than 20 ppm" (21 CFR 101.91), ANZ no detectable gluten
 * (Food Standards Code Standard 1.2.7 and Schedule 4, from memory). Gluten is computed from the
 * leaves' glutenMgPerKg on the finished weight and compared at the threshold precision
 * (compare.ts); a gluten cereal without a measured figure fails (an exempt form without a
 * figure is unverified); oats follow the regime.
 */
function glutenFree(all: LeafFacts[], site: Site, rules: RegimeRules, finishedG: number, said: IngredientSaid[]): ClaimResult {
  const gf = rules.glutenFree;
  const cereals = gf.cereals;
  const isGlutenUse = (s: AllergenSource) => cereals.includes(s) || (s === 'oats' && gf.oats !== 'measured');
  const found: Found[] = [];
  let mg = 0;
  let measured = false;
  for (const f of all) {
    const name = f.ingredient.name;
    const figure = f.ingredient.glutenMgPerKg;
    const uses = f.contains.filter((u) => cereals.includes(u.source) || u.source === 'oats');
    for (const use of uses) {
      const label = SOURCE_LABELS[use.source];
      if (use.source === 'oats' && gf.oats === 'not-permitted') {
        found.push({ status: 'fails', reason: reason(f, `${name} contains oats, which this regime's gluten-free rule does not permit.`) });
      } else if (figure === undefined) {
        const noFigure = use.source === 'oats' && gf.oats === 'measured';
        const exempt = exemptionOf(use, rules) !== undefined;
        found.push({
          status: noFigure || exempt ? 'unverified' : 'fails',
          reason: reason(f, `${name} contains ${label} with no measured gluten figure.`),
        });
      } else if (f.node.role === 'contact' && figure > 0) {
        found.push({
          status: 'fails',
          reason: reason(f, `${name} brings ${label} through a contact line, which has no weight; its gluten cannot be quantified.`),
        });
      }
    }
    if (figure !== undefined && f.node.role !== 'contact') {
      mg += (f.node.massG / 1000) * figure;
      measured = true;
    }
    for (const use of f.mayContain.filter((u) => isGlutenUse(u.source))) {
      found.push({ status: 'fails', reason: reason(f, `${precautionWho(f, use)}: may contain ${SOURCE_LABELS[use.source]}.`) });
    }
  }
  found.push(
    ...perLeaf(all, said, (x) => x.vague['gluten-free']),
    ...sharedHandling(site, cereals.filter(isGlutenUse)),
    ...perLeaf(all, said, (x) => x.unknown),
  );
  if (measured && finishedG > 0) {
    const perKg = mg / (finishedG / 1000);
    if (!compare(perKg, gf.comparison, gf.limitMgPerKg)) {
      const limit = `${gf.comparison === 'lt' ? 'below' : 'at most'} ${gf.limitMgPerKg} mg/kg`;
      found.push({
        status: 'fails',
        reason: { leaf: null, path: [], message: `Gluten in the product is about ${round(perKg, 1)} mg/kg; gluten-free needs ${limit}.` },
      });
    }
  }
  return settle(found);
}

export function claimsFor(
  all: LeafFacts[],
  site: Site,
  rules: RegimeRules,
  finishedG: number,
  memo: ClaimMemo = new WeakMap(),
): DeclaredClaims {
  let byIngredient = memo.get(rules);
  if (!byIngredient) {
    byIngredient = new Map();
    memo.set(rules, byIngredient);
  }
  const known = byIngredient;
  const said = all.map((f) => {
    let own = known.get(f.ingredient.id);
    if (!own) {
      own = saidBy(f, rules);
      known.set(f.ingredient.id, own);
    }
    return own;
  });
  const result = (claim: Claim): ClaimResult => {
    switch (claim) {
      case 'vegan':
      case 'vegetarian':
        return settle(perLeaf(all, said, (x) => x.diet[claim]));
      case 'gluten-free':
        return glutenFree(all, site, rules, finishedG, said);
      case 'egg-free':
      case 'dairy-free':
      case 'nut-free':
      case 'peanut-free':
      case 'sesame-free':
        return freeFrom(claim, all, site, rules, said);
      default: {
        const never: never = claim;
        throw new Error(`Unknown claim ${String(never)}`);
      }
    }
  };
  return Object.fromEntries(CLAIMS.map((c) => [c, result(c)])) as DeclaredClaims;
}
