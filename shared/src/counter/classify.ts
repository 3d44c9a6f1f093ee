import type { AllergenSource, Control } from '../allergens';
import type { ClaimReason, ExemptUse, IdPath } from '../declaration';
import type { ProductDeclaration } from '../product-declaration';
import { resolveAsk, type AvoidItem, type CounterRules, type CounterWant, type CustomerAsk } from './ask';
import { pathsTo, throughContact, type PrecautionReason } from './precautions';

/**
 * The counter's answer for one product and one customer:
 * - 'contains': the record lists an allergen they avoid, or a claim they want fails;
 * - 'not-known': nothing found of theirs is certain, but data is missing (an ingredient with no
 *   allergen statement, a composition that names nuts without saying which, a wanted claim that
 *   cannot be verified);
 * - 'may-contain': a precautionary statement of a supplier, or the kitchen's own shared handling;
 * - 'suitable-as-recorded': none of the above, as recorded.
 *
 * The worst wins, in that order. Contains comes first because it is certain: a product that has
 * egg is not for someone avoiding egg, whatever else is unknown (the card still names the unknown).
 * Not known comes before may contain: a may-contain is a bounded risk someone stated, while an
 * ingredient with no statement may hold the allergen as an ingredient, so nothing is proved and
 * the counter must ask the kitchen. Suitable is never given on unknown data.
 */
export const COUNTER_VERDICTS = ['suitable-as-recorded', 'may-contain', 'not-known', 'contains'] as const;
export type CounterVerdict = (typeof COUNTER_VERDICTS)[number];

/** An allergen of theirs the product contains, and where from. */
export interface CounterContains {
  /** The code the customer asked to avoid. */
  avoid: string;
  allergen: string;
  label: string;
  /** The sources of the group that are theirs (for one avoided tree nut: that nut). */
  sources: AllergenSource[];
  /** The distinct paths from the product to a leaf that brings it, as the declaration lists them (Provenance). */
  via: IdPath[];
  /** Distinct paths not listed in `via` (absent when none was left out). */
  viaMore?: number;
  /** The paths among them that pass through a contact line (a floured tin): contained all the same. */
  viaContact: IdPath[];
}

/** A may-contain of theirs, with its reason. */
export interface CounterMayContain {
  avoid: string;
  /** The group it was recorded under; null for a composition that names nuts without saying which. */
  allergen: string | null;
  /** The source the statement names; null for a composition that names e.g. nuts without saying which. */
  source: AllergenSource | null;
  /** 'supplier': the supplier's statement; 'composition': the supplier's ingredients text; 'kitchen': the kitchen's handling. */
  reason: PrecautionReason;
  ingredientName: string | null;
  controls: Control | null;
  statement: string;
}

/** Data missing for what they avoid, naming the ingredient. */
export interface CounterNotKnown {
  ingredient: string;
  name: string;
  via: IdPath[];
  /**
   * 'no-allergen-statement': the supplier gave none; 'composition-unspecified': its composition
   * names e.g. nuts without saying which; 'sulphite-content': its sulphite content is not known.
   */
  why: 'no-allergen-statement' | 'composition-unspecified' | 'sulphite-content';
  /** The avoided codes it leaves open. */
  avoid: string[];
  message: string;
}

/** A source of theirs present in a form the regime exempts from declaration: not counted, but said. */
export interface CounterExempt extends ExemptUse {
  avoid: string;
}

export interface CounterClaim {
  claim: CounterWant;
  status: 'holds' | 'fails' | 'not-known';
  /** Why it fails or is not known (empty when it holds: every ingredient is recorded as meeting it). */
  reasons: ClaimReason[];
}

export interface CustomerVerdict {
  verdict: CounterVerdict;
  contains: CounterContains[];
  mayContain: CounterMayContain[];
  notKnown: CounterNotKnown[];
  exempt: CounterExempt[];
  claims: CounterClaim[];
}

const rank = (v: CounterVerdict) => COUNTER_VERDICTS.indexOf(v);

function worst(verdicts: CounterVerdict[]): CounterVerdict {
  return verdicts.reduce<CounterVerdict>((w, v) => (rank(v) > rank(w) ? v : w), 'suitable-as-recorded');
}

/**
 * The precautionary statements that name a source of theirs. The engine keeps every statement
 * with its source, also for a group the product contains, so avoiding walnut in a pecan tart still
 * finds a supplier's "may contain walnut". A composition's "may contain nuts" names no source: it
 * counts for every source the word may stand for.
 */
function precautionsFor(declaration: ProductDeclaration, item: AvoidItem): CounterMayContain[] {
  const out: CounterMayContain[] = [];
  for (const p of declaration.precautions) {
    if (!item.sources.includes(p.source) || out.some((o) => o.statement === p.message)) continue;
    out.push({
      avoid: item.code,
      allergen: p.allergens.find((a) => item.groups.includes(a)) ?? p.allergens[0] ?? null,
      source: p.source,
      reason: p.origin,
      ingredientName: p.ingredientName,
      controls: p.controls,
      statement: p.message,
    });
  }
  for (const v of declaration.vague.filter((x) => x.precautionary && x.mayMean.some((s) => item.sources.includes(s)))) {
    if (out.some((o) => o.statement === v.message)) continue;
    out.push({
      avoid: item.code,
      allergen: null,
      source: null,
      reason: 'composition',
      ingredientName: v.name,
      controls: null,
      statement: v.message,
    });
  }
  return out;
}

function notKnownFor(declaration: ProductDeclaration, avoid: AvoidItem[]): CounterNotKnown[] {
  const out: CounterNotKnown[] = [];
  const add = (entry: Omit<CounterNotKnown, 'avoid'>, codes: string[]) => {
    if (codes.length === 0) return;
    const same = out.find((o) => o.ingredient === entry.ingredient && o.why === entry.why);
    if (!same) {
      out.push({ ...entry, avoid: [...codes] });
      return;
    }
    for (const code of codes) if (!same.avoid.includes(code)) same.avoid.push(code);
  };
  const all = avoid.map((a) => a.code);
  for (const u of declaration.unknown) {
    add(
      { ingredient: u.ingredient, name: u.name, via: u.via, why: 'no-allergen-statement', message: `${u.name} has no allergen statement.` },
      all,
    );
  }
  for (const v of declaration.vague.filter((x) => !x.precautionary)) {
    const codes = avoid.filter((a) => v.mayMean.some((s) => a.sources.includes(s))).map((a) => a.code);
    add({ ingredient: v.ingredient, name: v.name, via: v.via, why: 'composition-unspecified', message: v.message }, codes);
  }
  if (declaration.sulphites.status === 'not-known') {
    const codes = avoid.filter((a) => a.sources.includes('sulphites')).map((a) => a.code);
    for (const gap of declaration.sulphites.missing) {
      // An ingredient with no allergen statement is named once, for everything.
      if (gap.reason === 'no-allergen-statement') continue;
      add(
        {
          ingredient: gap.ingredient,
          name: gap.name,
          via: pathsTo(declaration, gap.ingredient),
          why: 'sulphite-content',
          message:
            gap.reason === 'contact-line'
              ? `${gap.name} brings sulphites through a contact line, so how much is not known.`
              : `${gap.name} has sulphites with no stated content.`,
        },
        codes,
      );
    }
  }
  return out;
}

function claimFor(declaration: ProductDeclaration, claim: CounterWant): CounterClaim {
  const result = declaration.claims[claim];
  const status = result.status === 'ok' ? 'holds' : result.status === 'fails' ? 'fails' : 'not-known';
  return { claim, status, reasons: result.reasons };
}

/**
 * What the counter tells a customer about one product: the verdict, and every finding behind it
 * (what of theirs it contains and where from, what it may contain and why, what is not known and
 * in which ingredient, each wanted claim with its reasons). Throws when the ask names a code the
 * regime does not know: check it first with `resolveAsk`.
 */
export function customerVerdict(declaration: ProductDeclaration, ask: CustomerAsk, rules: CounterRules): CustomerVerdict {
  const resolved = resolveAsk(ask, rules);
  if (!resolved.ok) throw new Error(resolved.problems.join(' '));
  const avoid = resolved.avoid;

  const contains: CounterContains[] = [];
  const mayContain: CounterMayContain[] = [];
  const exempt: CounterExempt[] = [];
  for (const item of avoid) {
    for (const entry of declaration.contains.filter((c) => item.groups.includes(c.allergen))) {
      const sources = entry.sources.filter((s) => item.sources.includes(s));
      if (sources.length === 0) continue;
      // For one avoided source, only the paths of the leaves that bring it would be exact; the
      // engine keeps the group's paths together, so every path of the group is named.
      contains.push({
        avoid: item.code,
        allergen: entry.allergen,
        label: entry.label,
        sources,
        via: entry.via,
        ...(entry.viaMore ? { viaMore: entry.viaMore } : {}),
        viaContact: entry.via.filter((p) => throughContact(declaration, p)),
      });
    }
    if (!contains.some((c) => c.avoid === item.code)) mayContain.push(...precautionsFor(declaration, item));
    for (const use of declaration.exempt.filter((e) => item.sources.includes(e.source))) {
      exempt.push({ avoid: item.code, ...use });
    }
  }
  const notKnown = notKnownFor(declaration, avoid);
  const claims = ask.want.filter((w, i) => ask.want.indexOf(w) === i).map((w) => claimFor(declaration, w));

  const verdict = worst([
    ...(contains.length > 0 || claims.some((c) => c.status === 'fails') ? (['contains'] as const) : []),
    ...(notKnown.length > 0 || claims.some((c) => c.status === 'not-known') ? (['not-known'] as const) : []),
    ...(mayContain.length > 0 ? (['may-contain'] as const) : []),
  ]);
  return { verdict, contains, mayContain, notKnown, exempt, claims };
}
