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
import type { DietClaim } from './composition-scan';
import type { FreeFromClaim, RegimeRules } from './reference-schema';

/** Sources that are animal products by definition (common practice). */
const NOT_VEGAN: readonly AllergenSource[] = ['milk', 'egg', 'fish', 'crustacean', 'mollusc'];
const NOT_VEGETARIAN: readonly AllergenSource[] = ['fish', 'crustacean', 'mollusc'];

type Found = { status: Exclude<ClaimStatus, 'ok'>; reason: ClaimReason };

/** fails wins over unverified, which wins over ok. */
function settle(found: Found[]): ClaimResult {
  const status: ClaimStatus = found.some((f) => f.status === 'fails') ? 'fails' : found.length > 0 ? 'unverified' : 'ok';
  const seen = new Set<string>();
  const reasons = [...found.filter((f) => f.status === 'fails'), ...found.filter((f) => f.status === 'unverified')]
    .map((f) => f.reason)
    .filter((r) => {
      const key = `${r.path.join('/')}|${r.message}`;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    });
  return { status, reasons };
}

const reason = (facts: LeafFacts, message: string): ClaimReason => ({ leaf: facts.ingredient.id, path: facts.node.path, message });

/** Vegan and vegetarian are about ingredients: recorded status, animal sources and animal-derived terms. */
function dietary(claim: DietClaim, all: LeafFacts[]): ClaimResult {
  const found: Found[] = [];
  const animal = claim === 'vegan' ? NOT_VEGAN : NOT_VEGETARIAN;
  for (const f of all) {
    const name = f.ingredient.name;
    const recorded = f.ingredient[claim];
    if (recorded === false) found.push({ status: 'fails', reason: reason(f, `${name} is recorded as not ${claim}.`) });
    if (recorded === null) found.push({ status: 'unverified', reason: reason(f, `${name} has no recorded ${claim} status.`) });
    for (const use of f.contains.filter((u) => animal.includes(u.source))) {
      found.push({
        status: 'fails',
        reason: reason(f, `${name} contains ${SOURCE_LABELS[use.source]}${use.term ? ` ('${use.term}' in its composition)` : ''}.`),
      });
    }
    for (const hit of f.scan.animal) {
      if (hit.fails.includes(claim))
        found.push({ status: 'fails', reason: reason(f, `The composition of ${name} names '${hit.matched}', which is not ${claim}.`) });
      else if (hit.unverified.includes(claim)) {
        found.push({
          status: 'unverified',
          reason: reason(f, `The composition of ${name} names '${hit.matched}', which may be animal-derived.`),
        });
      }
    }
  }
  return settle(found);
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

/** A composition that names e.g. "nuts" without saying which: a may-contain fails the claim, an ingredient leaves it unproved. */
function vagueMentions(claim: Claim, all: LeafFacts[]): Found[] {
  return all.flatMap((f) =>
    f.scan.vague
      .filter((h) => h.unverifies.includes(claim))
      .map((h) =>
        h.precautionary
          ? { status: 'fails' as const, reason: reason(f, `The composition of ${f.ingredient.name} says it may contain '${h.matched}'.`) }
          : { status: 'unverified' as const, reason: reason(f, `The composition of ${f.ingredient.name} ${h.message} ('${h.matched}').`) },
      ),
  );
}

function unknownLeaves(all: LeafFacts[]): Found[] {
  return all
    .filter((f) => !f.known)
    .map((f) => ({ status: 'unverified' as const, reason: reason(f, `${f.ingredient.name} has no allergen statement.`) }));
}

/** Fails on any contains or may-contain of the claim's sources; unverified when a leaf has no allergen statement. */
function freeFrom(claim: FreeFromClaim, all: LeafFacts[], site: Site, rules: RegimeRules): ClaimResult {
  const sources = rules.freeFrom[claim];
  const found: Found[] = [];
  for (const f of all) {
    for (const use of f.contains.filter((u) => sources.includes(u.source))) {
      found.push({ status: 'fails', reason: reason(f, `${f.ingredient.name} contains ${SOURCE_LABELS[use.source]}.`) });
    }
    for (const use of f.mayContain.filter((u) => sources.includes(u.source))) {
      found.push({ status: 'fails', reason: reason(f, `${precautionWho(f, use)}: may contain ${SOURCE_LABELS[use.source]}.`) });
    }
  }
  return settle([...found, ...vagueMentions(claim, all), ...sharedHandling(site, sources), ...unknownLeaves(all)]);
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
function glutenFree(all: LeafFacts[], site: Site, rules: RegimeRules, finishedG: number): ClaimResult {
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
  found.push(...vagueMentions('gluten-free', all), ...sharedHandling(site, cereals.filter(isGlutenUse)), ...unknownLeaves(all));
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

export function claimsFor(all: LeafFacts[], site: Site, rules: RegimeRules, finishedG: number): DeclaredClaims {
  const result = (claim: Claim): ClaimResult => {
    switch (claim) {
      case 'vegan':
      case 'vegetarian':
        return dietary(claim, all);
      case 'gluten-free':
        return glutenFree(all, site, rules, finishedG);
      case 'egg-free':
      case 'dairy-free':
      case 'nut-free':
      case 'peanut-free':
      case 'sesame-free':
        return freeFrom(claim, all, site, rules);
      default: {
        const never: never = claim;
        throw new Error(`Unknown claim ${String(never)}`);
      }
    }
  };
  return Object.fromEntries(CLAIMS.map((c) => [c, result(c)])) as DeclaredClaims;
}
