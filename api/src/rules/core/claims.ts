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
import { capitalise, exemptionOf, precautionWho, type IngredientFacts, type Leaf } from './allergens';
import { compare, round } from './compare';
import type { DietClaim } from './composition-scan';
import type { FreeFromClaim, RegimeRules } from './reference-schema';

/** Sources that are animal products by definition (common practice). */
const NOT_VEGAN: readonly AllergenSource[] = ['milk', 'egg', 'fish', 'crustacean', 'mollusc'];
const NOT_VEGETARIAN: readonly AllergenSource[] = ['fish', 'crustacean', 'mollusc'];

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

function saidBy(f: IngredientFacts, rules: RegimeRules): IngredientSaid {
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

/** Said of a leaf that reaches the food through a contact line (a greased griddle, a floured tin), so the reason says how. */
const THROUGH_CONTACT = ' (through a contact line: greasing or dusting)';

/** A leaf's message; one under a contact line says so, as the contains list does. */
function atLeaf(contact: boolean, message: string): string {
  return contact && !message.includes('through a contact line') ? message.replace(/\.$/, `${THROUGH_CONTACT}.`) : message;
}

/** Vegan and vegetarian are about ingredients: recorded status, animal sources and animal-derived terms. */
function dietarySaid(claim: DietClaim, f: IngredientFacts): Said[] {
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

function sharedHandling(site: Site, sources: readonly AllergenSource[]): ClaimReason[] {
  return site.handles
    .filter((h) => sources.includes(h.allergen) && h.controls !== 'segregated')
    .map((h) => ({
      leaf: null,
      path: [],
      message: `${capitalise(SOURCE_LABELS[h.allergen])} is handled in this kitchen (${CONTROL_LABELS[h.controls]}).`,
    }));
}

/**
 * Where a reason stands in its claim, before the fails-then-unverified order: a leaf's own reasons
 * (dietary, a free-from source, gluten), vague compositions, the kitchen's shared handling, no
 * allergen statement, the product's gluten figure.
 */
const OWN = 0;
const VAGUE = 1;
const HANDLING = 2;
const UNKNOWN = 3;
const GLUTEN_TOTAL = 4;
const SLOTS = 5;

/** One reason an ingredient gives a claim at a leaf: its slot, whether it fails, and its message (an index into `messages`). */
interface LeafReason {
  slot: number;
  fails: boolean;
  message: number;
}

/**
 * What an ingredient gives every claim at a leaf (in the mix, or through a contact line), worked
 * out once per ingredient and regime: each message once, and by claim (CLAIMS order) its reasons,
 * fails first, each message once as the claim keeps it.
 */
interface LeafClaims {
  messages: string[];
  byClaim: LeafReason[][];
}

/** The reasons an ingredient gave at one place of a product, and (when the product repeats a path) the paths met there. */
interface ReasonsAtPlace {
  reasons: ClaimReason[];
  seen: Set<string[]> | undefined;
}

interface IngredientClaims {
  inMix: LeafClaims;
  byContact: LeafClaims;
}

/**
 * What each ingredient gives each claim under a regime, worked out once and shared by every leaf
 * that uses the ingredient in any product: by regime, then the ingredient's facts (never changed
 * after, so a memo outlives a change to another ingredient).
 */
export type ClaimMemo = Map<RegimeRules, WeakMap<IngredientFacts, IngredientClaims>>;

/**
 * Gluten-free reasons of one leaf under the regime's published rule: EU "no more than 20 mg/kg"
 * (Commission Implementing Regulation (EU) No 828/2014 Article 3 and its Annex), UK the same
 * assimilated text (from memory), Canada at most 20 ppm (Food and Drug Regulations B.24.018 with
 * Health Canada's 2012 position), US "less than 20 ppm" (21 CFR 101.91), ANZ no detectable gluten
 * (Food Standards Code Standard 1.2.7 and Schedule 4, from memory). A gluten cereal without a
 * measured figure fails (an exempt form without a figure is unverified); oats follow the regime.
 */
function glutenSaid(f: IngredientFacts, rules: RegimeRules, contact: boolean): Said[] {
  const gf = rules.glutenFree;
  const cereals = gf.cereals;
  const isGlutenUse = (s: AllergenSource) => cereals.includes(s) || (s === 'oats' && gf.oats !== 'measured');
  const name = f.ingredient.name;
  const figure = f.ingredient.glutenMgPerKg;
  const found: Said[] = [];
  for (const use of f.contains.filter((u) => cereals.includes(u.source) || u.source === 'oats')) {
    const label = SOURCE_LABELS[use.source];
    if (use.source === 'oats' && gf.oats === 'not-permitted') {
      found.push({ status: 'fails', message: `${name} contains oats, which this regime's gluten-free rule does not permit.` });
    } else if (figure === undefined) {
      const noFigure = use.source === 'oats' && gf.oats === 'measured';
      const exempt = exemptionOf(use, rules) !== undefined;
      found.push({
        status: noFigure || exempt ? 'unverified' : 'fails',
        message: `${name} contains ${label} with no measured gluten figure.`,
      });
    } else if (contact && figure > 0) {
      found.push({
        status: 'fails',
        message: `${name} brings ${label} through a contact line, which has no weight; its gluten cannot be quantified.`,
      });
    }
  }
  for (const use of f.mayContain.filter((u) => isGlutenUse(u.source))) {
    found.push({ status: 'fails', message: `${precautionWho(f, use)}: may contain ${SOURCE_LABELS[use.source]}.` });
  }
  return found;
}

function leafClaims(f: IngredientFacts, said: IngredientSaid, rules: RegimeRules, contact: boolean): LeafClaims {
  const messages: string[] = [];
  const numbers = new Map<string, number>();
  const numberOf = (message: string) => {
    let n = numbers.get(message);
    if (n === undefined) {
      n = messages.length;
      messages.push(message);
      numbers.set(message, n);
    }
    return n;
  };
  const byClaim = CLAIMS.map((claim) => {
    const found: Array<{ slot: number; status: Said['status']; message: string }> = [];
    const add = (slot: number, xs: Said[]) => {
      for (const x of xs) found.push({ slot, status: x.status, message: atLeaf(contact, x.message) });
    };
    switch (claim) {
      case 'vegan':
      case 'vegetarian':
        add(OWN, said.diet[claim]);
        break;
      case 'gluten-free':
        add(OWN, glutenSaid(f, rules, contact));
        add(VAGUE, said.vague[claim]);
        add(UNKNOWN, said.unknown);
        break;
      case 'egg-free':
      case 'dairy-free':
      case 'nut-free':
      case 'peanut-free':
      case 'sesame-free':
        add(OWN, said.freeFrom[claim]);
        add(VAGUE, said.vague[claim]);
        add(UNKNOWN, said.unknown);
        break;
      default: {
        const never: never = claim;
        throw new Error(`Unknown claim ${String(never)}`);
      }
    }
    // fails before unverified, and the same message by the same path once (the first kept).
    const kept = new Set<string>();
    const reasons: LeafReason[] = [];
    for (const fails of [true, false]) {
      for (const x of found) {
        if ((x.status === 'fails') !== fails || kept.has(x.message)) continue;
        kept.add(x.message);
        reasons.push({ slot: x.slot, fails, message: numberOf(x.message) });
      }
    }
    return reasons;
  });
  return { messages, byClaim };
}

/**
 * The eight claims of a product from its leaves (tree.ts rollDown), each `fails` > `unverified` >
 * `ok` with its reasons, fails first, in the order the leaves give them: a leaf's reason once at
 * each place of the product (a line of its own recipe), its other paths through the place counted
 * (`morePaths`), and the same message by the same path once. Vegan and vegetarian are about ingredients: recorded status, animal sources and
 * animal-derived terms. A free-from claim fails on any contains or may-contain of its sources and
 * the kitchen's shared handling of them, and is unverified when a leaf has no allergen statement.
 * Gluten-free (glutenSaid) also weighs the leaves' glutenMgPerKg on the finished weight, compared
 * at the threshold precision (compare.ts).
 */
export function claimsFor(
  leaves: readonly Leaf[],
  repeated: boolean,
  site: Site,
  rules: RegimeRules,
  finishedG: number,
  memo: ClaimMemo = new Map(),
): DeclaredClaims {
  let byIngredient = memo.get(rules);
  if (!byIngredient) {
    byIngredient = new WeakMap();
    memo.set(rules, byIngredient);
  }
  // By claim, then fails (0) or unverified (1), then slot: the reasons in leaf order.
  const buckets: ClaimReason[][][][] = CLAIMS.map(() => [0, 1].map(() => Array.from({ length: SLOTS }, () => [])));
  let mg = 0;
  let measured = false;
  const byPlace = new Map<LeafClaims, Map<string, ReasonsAtPlace>>();
  for (const leaf of leaves) {
    const f = leaf.facts;
    const id = f.ingredient.id;
    const figure = f.ingredient.glutenMgPerKg;
    if (figure !== undefined && !leaf.contact) {
      mg += (leaf.massG / 1000) * figure;
      measured = true;
    }
    let own = byIngredient.get(f);
    if (!own) {
      const said = saidBy(f, rules);
      own = { inMix: leafClaims(f, said, rules, false), byContact: leafClaims(f, said, rules, true) };
      byIngredient.set(f, own);
    }
    const at = leaf.contact ? own.byContact : own.inMix;
    if (at.messages.length === 0) continue;
    // The ingredient's reasons are given once at each place of the product (a line of its own
    // recipe, as PathList counts places): a later path through the same place counts into them.
    let places = byPlace.get(at);
    if (!places) byPlace.set(at, (places = new Map<string, ReasonsAtPlace>()));
    const place = leaf.path[1] ?? '';
    const same = places.get(place);
    if (same) {
      if (same.seen) {
        if (same.seen.has(leaf.path)) continue;
        same.seen.add(leaf.path);
      }
      for (const r of same.reasons) r.morePaths = (r.morePaths ?? 0) + 1;
      continue;
    }
    // One reason object per message at this leaf, shared by the claims that give it.
    const reasons: ClaimReason[] = new Array<ClaimReason>(at.messages.length);
    places.set(place, { reasons, seen: repeated ? new Set([leaf.path]) : undefined });
    for (let c = 0; c < CLAIMS.length; c++) {
      const list = at.byClaim[c];
      for (let n = 0; n < list.length; n++) {
        const r = list[n];
        const reason = (reasons[r.message] ??= { leaf: id, path: leaf.path, message: at.messages[r.message] });
        buckets[c][r.fails ? 0 : 1][r.slot].push(reason);
      }
    }
  }
  const gf = rules.glutenFree;
  const isGlutenUse = (s: AllergenSource) => gf.cereals.includes(s) || (s === 'oats' && gf.oats !== 'measured');
  const result = (claim: Claim, c: number): ClaimResult => {
    const [fails, unverified] = buckets[c];
    if (claim === 'gluten-free') {
      fails[HANDLING].push(...sharedHandling(site, gf.cereals.filter(isGlutenUse)));
      if (measured && finishedG > 0) {
        const perKg = mg / (finishedG / 1000);
        if (!compare(perKg, gf.comparison, gf.limitMgPerKg)) {
          const limit = `${gf.comparison === 'lt' ? 'below' : 'at most'} ${gf.limitMgPerKg} mg/kg`;
          fails[GLUTEN_TOTAL].push({
            leaf: null,
            path: [],
            message: `Gluten in the product is about ${round(perKg, 1)} mg/kg; gluten-free needs ${limit}.`,
          });
        }
      }
    } else if (claim !== 'vegan' && claim !== 'vegetarian') fails[HANDLING].push(...sharedHandling(site, rules.freeFrom[claim]));
    const failing = fails.some((s) => s.length > 0);
    const status: ClaimStatus = failing ? 'fails' : unverified.some((s) => s.length > 0) ? 'unverified' : 'ok';
    // The same message by the same path once: a leaf's own are kept once already (leafClaims), so
    // only the kitchen's and the product's (no path) and, when two leaves share a path, theirs.
    const productSaid = new Set<string>();
    const bySharedPath = repeated ? new Map<string[], Set<string>>() : null;
    const reasons: ClaimReason[] = [];
    for (const side of [fails, unverified]) {
      for (const slot of side) {
        for (const r of slot) {
          if (r.leaf === null) {
            if (productSaid.has(r.message)) continue;
            productSaid.add(r.message);
          } else if (bySharedPath) {
            let said = bySharedPath.get(r.path);
            if (!said) bySharedPath.set(r.path, (said = new Set()));
            if (said.has(r.message)) continue;
            said.add(r.message);
          }
          reasons.push(r);
        }
      }
    }
    return { status, reasons };
  };
  return Object.fromEntries(CLAIMS.map((c, n) => [c, result(c, n)])) as DeclaredClaims;
}
