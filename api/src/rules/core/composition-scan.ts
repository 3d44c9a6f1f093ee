import type { AllergenHit, AnimalHit, CompositionTerms, TermHit, VagueHit } from '@crumbproof/shared';
import type { Lexicon } from './reference-schema';

export type { DietClaim } from '@crumbproof/shared';

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const LETTER = '[\\p{L}\\p{N}]';

/** Whole-word occurrences of a phrase (an optional plural s/es allowed). */
function occurrences(text: string, phrase: string, plural: boolean): Array<{ start: number; end: number }> {
  const key = `${plural ? 's' : '-'}${phrase}`;
  let re = WORD_PATTERNS.get(key);
  if (!re) {
    re = new RegExp(`(?<!${LETTER})${escape(phrase)}${plural ? '(?:e?s)?' : ''}(?!${LETTER})`, 'gu');
    WORD_PATTERNS.set(key, re);
  }
  // A phrase that is not in the text at all cannot match: skip the pattern (most terms, most texts).
  if (!text.includes(phrase)) return [];
  return [...text.matchAll(re)].map((m) => ({ start: m.index, end: m.index + m[0].length }));
}

/** The compiled whole-word pattern of each phrase (matchAll works on a copy, so sharing one is sound). */
const WORD_PATTERNS = new Map<string, RegExp>();

/**
 * Each lexicon's scans by composition text: a scan depends on nothing else, so every product of a
 * book shares its ingredients' scans. Bounded (emptied when full) so a long-running server that
 * scans many texts does not keep them all.
 */
const SCANS = new WeakMap<Lexicon, Map<string, CompositionTerms>>();
const MAX_SCANS = 20_000;

/**
 * Precautionary and "made in a factory" clauses, up to the next full stop or semicolon, are not
 * composition: they are blanked out of `text` and returned separately.
 */
function splitClauses(text: string, clauses: string[]): { text: string; clauses: string } {
  let out = text;
  let taken = ' '.repeat(text.length);
  for (const clause of clauses) {
    for (const { start } of occurrences(out, clause, false)) {
      const stop = out.slice(start).search(/[.;]/);
      const end = stop < 0 ? out.length : start + stop;
      taken = taken.slice(0, start) + out.slice(start, end) + taken.slice(end);
      out = out.slice(0, start) + ' '.repeat(end - start) + out.slice(end);
    }
  }
  return { text: out, clauses: taken };
}

function negated(text: string, start: number, end: number, lexicon: Lexicon): boolean {
  const before = text.slice(0, start).replace(/[\s-]+$/u, '');
  const after = text.slice(end);
  const endsWithWord = (s: string, w: string) => new RegExp(`(?<!${LETTER})${escape(w)}$`, 'u').test(s);
  if (lexicon.negations.before.some((w) => endsWithWord(before, w))) return true;
  return lexicon.negations.after.some((w) => new RegExp(`^\\s*${escape(w)}(?!${LETTER})`, 'u').test(after));
}

function find(text: string, term: string, except: string[] | undefined, lexicon: Lexicon): TermHit[] {
  const excepted = (except ?? []).flatMap((e) => occurrences(text, e, true));
  return occurrences(text, term, true)
    .filter(({ start, end }) => !excepted.some((x) => x.start <= start && end <= x.end))
    .filter(({ start, end }) => !negated(text, start, end, lexicon))
    .map(({ start, end }) => ({ term, matched: text.slice(start, end), start, end }));
}

/** scanComposition, remembered per lexicon and text. The result is shared: read it, never change it. */
export function scanCompositionShared(composition: string, lexicon: Lexicon): CompositionTerms {
  let scans = SCANS.get(lexicon);
  if (!scans) {
    scans = new Map();
    SCANS.set(lexicon, scans);
  }
  let scan = scans.get(composition);
  if (!scan) {
    scan = scanComposition(composition, lexicon);
    if (scans.size >= MAX_SCANS) scans.clear();
    scans.set(composition, scan);
  }
  return scan;
}

/**
 * Reads a supplier's composition text for terms that name an allergen source or an
 * animal-derived ingredient (reference-data/lexicon.json). Whole words only: "nutmeg",
 * "buckwheat" and "butternut" are not hits; look-alikes such as "cocoa butter" and
 * "coconut milk" are listed as exceptions; negated ("peanut-free") and precautionary
 * ("may contain nuts") mentions are skipped.
 */
export function scanComposition(composition: string, lexicon: Lexicon): CompositionTerms {
  const { text, clauses } = splitClauses(composition.toLowerCase(), lexicon.negations.clauses);
  const allergenHits = (within: string): AllergenHit[] =>
    lexicon.allergenTerms.flatMap((t) =>
      find(within, t.term, t.except, lexicon).map((h) => ({
        ...h,
        matched: composition.slice(h.start, h.end),
        source: t.source,
        ...(t.species ? { species: t.species } : {}),
      })),
    );
  const allergens = allergenHits(text);
  const animal: AnimalHit[] = lexicon.animalTerms.flatMap((t) =>
    find(text, t.term, t.except, lexicon).map((h) => ({
      ...h,
      matched: composition.slice(h.start, h.end),
      fails: t.fails ?? [],
      unverified: t.unverified ?? [],
    })),
  );
  const precautionary = allergenHits(clauses);
  const vagueHits = (within: string, named: AllergenHit[], inClause: boolean): VagueHit[] =>
    lexicon.vagueTerms.flatMap((t) =>
      find(within, t.term, t.except, lexicon)
        .filter((h) => !named.some((a) => a.start <= h.start && h.end <= a.end))
        .map((h) => ({
          ...h,
          matched: composition.slice(h.start, h.end),
          message: t.message,
          mayMean: [...t.mayMean],
          unverifies: t.unverifies ?? [],
          precautionary: inClause,
        })),
    );
  const vague = [...vagueHits(text, allergens, false), ...vagueHits(clauses, precautionary, true)];
  return { allergens, precautionary, animal, vague };
}
