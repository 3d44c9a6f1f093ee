import {
  COUNTER_VERDICTS,
  SOURCE_LABELS,
  customerVerdict,
  resolveAsk,
  type CounterProduct,
  type CounterRules,
  type CounterVerdict,
  type CounterWant,
  type CustomerVerdict,
  type DeclaredIngredient,
  type IdPath,
  type ProductDeclaration,
} from '@crumbproof/shared';

/** What the person at the counter has picked for the customer in front of them. */
export interface CounterAsk {
  /** Group codes of the regime ('eggs') or finer sources ('walnut'). */
  avoid: string[];
  want: CounterWant[];
}

export const EMPTY_ASK: CounterAsk = { avoid: [], want: [] };

export const isEmptyAsk = (ask: CounterAsk) => ask.avoid.length === 0 && ask.want.length === 0;

/** One product as the results list shows it: the verdict for the ask (none when nothing is picked) and one sentence why. */
export interface LookupRow {
  product: CounterProduct;
  verdict: CustomerVerdict | null;
  /** "Has egg in the Vanilla sponge", or with nothing picked the declaration's summary: "Contains wheat, egg and milk". */
  reason: string;
}

export interface LookupResult {
  /** Marked on sale today. */
  onSale: LookupRow[];
  /** For sale but not marked on sale today. */
  rest: LookupRow[];
  /** The ask names a code the regime does not declare (it came from an old link, say): nothing is classified. */
  problems: string[];
}

/** Words as a person compares them: no case, no accents, single spaces. */
function folded(text: string): string {
  return text.normalize('NFD').replace(/\p{M}/gu, '').toLowerCase().replace(/\s+/g, ' ').trim();
}

/** True when every word typed is the start of a word of the name, or inside it: "choc brown" finds "Dark chocolate brownie". */
export function matchesSearch(name: string, search: string): boolean {
  const words = folded(search).split(' ').filter(Boolean);
  if (words.length === 0) return true;
  const haystack = folded(name);
  return words.every((word) => haystack.includes(word));
}

/** "a", "a and b", "a, b and c". */
export function listed(items: readonly string[], word = 'and'): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} ${word} ${items[items.length - 1]}`;
}

const unique = <T>(items: readonly T[]): T[] => items.filter((x, i) => items.indexOf(x) === i);
const stop = (sentence: string) => sentence.trim().replace(/\.$/, '');

function findEntry(entries: readonly DeclaredIngredient[], id: string): DeclaredIngredient | undefined {
  for (const entry of entries) {
    if (entry.id === id) return entry;
    const below = findEntry(entry.children, id);
    if (below) return below;
  }
  return undefined;
}

/** Where a path brings something: the first item under the product, "the Vanilla sponge". */
function placeOf(declaration: ProductDeclaration, path: IdPath): string {
  const top = path[1];
  if (top === undefined) return declaration.name;
  return `the ${findEntry(declaration.ingredients, top)?.name ?? top}`;
}

/** The one sentence that says why the verdict is what it is, from the verdict's own findings (never from the engine's sentences). */
export function reasonFor(declaration: ProductDeclaration, verdict: CustomerVerdict, avoided: readonly string[]): string {
  switch (verdict.verdict) {
    case 'contains': {
      // Allergens found in the same places are said together: "egg and milk in the Vanilla sponge".
      const byPlace: Array<{ places: string; sources: string[] }> = [];
      for (const c of verdict.contains) {
        const places = listed(unique(c.via.map((p) => placeOf(declaration, p))));
        const sources = c.sources.map((s) => SOURCE_LABELS[s]);
        const same = byPlace.find((b) => b.places === places);
        if (same) same.sources = unique([...same.sources, ...sources]);
        else byPlace.push({ places, sources });
      }
      const parts = byPlace.map((b) => `${listed(b.sources)} in ${b.places}`);
      const failed = verdict.claims.filter((c) => c.status === 'fails');
      const claims = failed.map((c) => `not ${c.claim}${c.reasons[0] ? `: ${stop(c.reasons[0].message)}` : ''}`);
      const has = parts.length > 0 ? [`Has ${unique(parts).join('; ')}`] : [];
      const sentence = [...has, ...claims].join('; ');
      return sentence.charAt(0).toUpperCase() + sentence.slice(1);
    }
    case 'not-known': {
      const gaps = unique(verdict.notKnown.map((n) => stop(n.message)));
      const claims = verdict.claims
        .filter((c) => c.status === 'not-known')
        .map((c) => `whether it is ${c.claim}${c.reasons[0] ? ` (${stop(c.reasons[0].message)})` : ''}`);
      return `Not known: ${[...gaps, ...claims].join('; ')}`;
    }
    case 'may-contain': {
      const first = verdict.mayContain[0];
      if (!first) return 'May contain';
      const what = unique(verdict.mayContain.map((m) => mayContainWhat(m.source, m.allergen, m.avoid)));
      return `May contain ${listed(what)}: ${mayContainWhy(verdict.mayContain, first)}`;
    }
    case 'suitable-as-recorded':
      return suitableSentence(verdict, avoided);
  }
}

function mayContainWhat(source: keyof typeof SOURCE_LABELS | null, allergen: string | null, avoid: string): string {
  if (source) return SOURCE_LABELS[source];
  return allergen ?? avoid;
}

/** Why it may contain: the first reason found, with every ingredient that gives the same kind of reason. */
function mayContainWhy(all: CustomerVerdict['mayContain'], m: CustomerVerdict['mayContain'][number]): string {
  const what = mayContainWhat(m.source, m.allergen, m.avoid);
  const names = unique(all.filter((o) => o.reason === m.reason && o.ingredientName).map((o) => o.ingredientName as string));
  const many = names.length > 1;
  const of = names.length > 0 ? listed(names) : 'an ingredient';
  switch (m.reason) {
    case 'kitchen':
      return m.controls === 'shared-area' ? `made in an area where ${what} is handled` : `made on equipment shared with ${what}`;
    case 'supplier':
      return `the supplier${many ? 's' : ''} of ${of} say${many ? '' : 's'} so`;
    case 'composition':
      return `the ingredients text${many ? 's' : ''} of ${of} say${many ? '' : 's'} so`;
  }
}

/** "No listed eggs, no may-contain of eggs, as recorded; vegan as recorded." Never "safe". */
function suitableSentence(verdict: CustomerVerdict, avoided: readonly string[]): string {
  const parts: string[] = [];
  if (avoided.length > 0) {
    const what = listed(avoided, 'or');
    parts.push(`no listed ${what}, no may-contain of ${what}, as recorded`);
  }
  const holding = verdict.claims.filter((c) => c.status === 'holds').map((c) => c.claim);
  if (holding.length > 0) parts.push(`${listed(holding)} as recorded`);
  const sentence = parts.join('; ');
  return sentence.charAt(0).toUpperCase() + sentence.slice(1);
}

/** The avoided things in words, as the ask names them: "egg", "sesame", "walnut". */
export function avoidLabels(ask: CounterAsk, rules: CounterRules): string[] {
  const resolved = resolveAsk({ avoid: ask.avoid, want: [] }, rules);
  return resolved.ok ? resolved.avoid.map((a) => a.label) : ask.avoid;
}

/** With nothing picked: what the declaration lists, "Contains wheat, egg and milk", and whether anything is not known. */
export function summaryOf(declaration: ProductDeclaration): string {
  const sources = unique(declaration.contains.flatMap((c) => c.sources.map((s) => SOURCE_LABELS[s])));
  const has = sources.length > 0 ? `Contains ${listed(sources)}` : 'None of the listed allergens recorded';
  const unknown = declaration.unknown.map((u) => u.name);
  return unknown.length > 0 ? `${has}; not known: ${listed(unknown)} ${unknown.length > 1 ? 'have' : 'has'} no allergen statement` : has;
}

const rank = (v: CounterVerdict) => COUNTER_VERDICTS.indexOf(v);
/** One collator for every comparison: localeCompare with options builds a new one each call, the lookup's largest cost. */
const NAME_ORDER = new Intl.Collator('en-GB', { sensitivity: 'base' });
const byName = (a: LookupRow, b: LookupRow) => NAME_ORDER.compare(a.product.name, b.product.name);

/**
 * The counter's lookup, worked out in the browser from the one read: the products whose name
 * matches the search, on sale today first, each classified for the ask. With something picked the
 * best verdict comes first (suitable as recorded, may contain, not known, contains), then by name;
 * with nothing picked, by name with the declaration's summary.
 */
export function lookUp(products: readonly CounterProduct[], rules: CounterRules, ask: CounterAsk, search = ''): LookupResult {
  const matching = products.filter((p) => matchesSearch(p.name, search));
  const empty = isEmptyAsk(ask);
  const resolved = resolveAsk(ask, rules);
  if (!resolved.ok) return { onSale: [], rest: [], problems: resolved.problems };

  const avoided = resolved.avoid.map((a) => a.label);
  const rows: LookupRow[] = matching.map((product) => {
    if (empty) return { product, verdict: null, reason: summaryOf(product.declaration) };
    const verdict = customerVerdict(product.declaration, ask, rules);
    return { product, verdict, reason: reasonFor(product.declaration, verdict, avoided) };
  });
  const order = (a: LookupRow, b: LookupRow) =>
    (a.verdict && b.verdict ? rank(a.verdict.verdict) - rank(b.verdict.verdict) : 0) || byName(a, b);
  rows.sort(order);
  return { onSale: rows.filter((r) => r.product.onSale), rest: rows.filter((r) => !r.product.onSale), problems: [] };
}

/** The name of the browser's user-timing entry of the last lookup: a profiler and the end-to-end test read it. */
export const LOOKUP_MEASURE = 'counter-lookup';

/** As lookUp, recording how long it took as a performance measure (the last lookup's only). */
export function timedLookUp(products: readonly CounterProduct[], rules: CounterRules, ask: CounterAsk, search = ''): LookupResult {
  const started = performance.now();
  const result = lookUp(products, rules, ask, search);
  performance.clearMeasures(LOOKUP_MEASURE);
  performance.measure(LOOKUP_MEASURE, { start: started, end: performance.now() });
  return result;
}
