import type { ContainedAllergen, DeclaredIngredient, MayContainAllergen, TextSegment } from '@crumbproof/shared';
import type { RegimeRules } from './reference-schema';

/** A name the list must show for one ingredient (e.g. 'milk' after 'Butter'). */
export interface Mark {
  name: string;
  match: string[];
  emphasis: boolean;
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

function merge(segments: TextSegment[]): TextSegment[] {
  const out: TextSegment[] = [];
  for (const s of segments) {
    if (!s.text) continue;
    const last = out[out.length - 1];
    if (last && last.emphasis === s.emphasis) last.text += s.text;
    else out.push({ ...s });
  }
  return out;
}

/** The whole-word, any-case pattern of each mark's word, compiled once (no g flag: exec keeps no state). */
const WORD_PATTERNS = new Map<string, RegExp>();
function wordPattern(word: string): RegExp {
  let re = WORD_PATTERNS.get(word);
  if (!re) {
    re = new RegExp(`(?<![\\p{L}\\p{N}])${escape(word)}(?![\\p{L}\\p{N}])`, 'iu');
    WORD_PATTERNS.set(word, re);
  }
  return re;
}

/**
 * An ingredient's name with its allergen names: where the name already names the allergen
 * ("Plain wheat flour") that word is emphasised; otherwise the name follows in brackets
 * ("Butter (milk)"), as Art. 21(1)(a) and FSANZ PEAL require.
 */
export function renderName(name: string, marks: Mark[]): TextSegment[] {
  const ranges: Array<{ start: number; end: number; emphasis: boolean }> = [];
  const appended: Mark[] = [];
  for (const mark of marks) {
    let hit: { start: number; end: number } | undefined;
    for (const word of mark.match) {
      const m = wordPattern(word).exec(name);
      if (m && !ranges.some((r) => r.start < m.index + m[0].length && m.index < r.end)) {
        hit = { start: m.index, end: m.index + m[0].length };
        break;
      }
    }
    if (hit) ranges.push({ ...hit, emphasis: mark.emphasis });
    else if (!appended.some((a) => a.name === mark.name)) appended.push(mark);
  }
  ranges.sort((a, b) => a.start - b.start);
  const segments: TextSegment[] = [];
  let at = 0;
  for (const r of ranges) {
    segments.push({ text: name.slice(at, r.start), emphasis: false }, { text: name.slice(r.start, r.end), emphasis: r.emphasis });
    at = r.end;
  }
  segments.push({ text: name.slice(at), emphasis: false });
  if (appended.length > 0) {
    segments.push({ text: ' (', emphasis: false });
    appended.forEach((m, i) => {
      if (i > 0) segments.push({ text: ', ', emphasis: false });
      segments.push({ text: m.name, emphasis: m.emphasis });
    });
    segments.push({ text: ')', emphasis: false });
  }
  return merge(segments);
}

/**
 * Adds a segment to merged segments: an empty one is dropped, one of the same emphasis as the last
 * joins it. Segments in `out` may be shared (a name or a sub-recipe as rendered before), so a join
 * makes a new segment and never changes one.
 */
function append(out: TextSegment[], s: TextSegment): void {
  if (!s.text) return;
  const last = out[out.length - 1];
  if (last && last.emphasis === s.emphasis) out[out.length - 1] = { text: last.text + s.text, emphasis: last.emphasis };
  else out.push(s);
}

/**
 * How a list is rendered for one book under the same marks: each ingredient's name by id, and
 * each sub-recipe as rendered, under its key. `keyOf` gives a sub-recipe entry's key when its
 * rendering is the same wherever it is used (the order of everything below it does not depend
 * on the product), else null. What is kept is never changed after.
 */
export interface RenderMemo {
  names: Map<string, TextSegment[]>;
  pieces: Map<string, TextSegment[]>;
  keyOf: (entry: DeclaredIngredient) => string | null;
}

function renderEntries(
  entries: DeclaredIngredient[],
  marksOf: (ingredientId: string) => Mark[],
  memo: RenderMemo,
  out: TextSegment[],
): void {
  entries.forEach((e, i) => {
    if (i > 0) append(out, COMMA);
    if (e.kind === 'recipe') {
      const key = memo.keyOf(e);
      let piece = key === null ? undefined : memo.pieces.get(key);
      if (!piece) {
        piece = [];
        append(piece, { text: e.name, emphasis: false });
        if (e.children.length > 0) {
          append(piece, OPEN);
          renderEntries(e.children, marksOf, memo, piece);
          append(piece, CLOSE);
        }
        if (key !== null)
          memo.pieces.set(
            key,
            piece.map((x) => Object.freeze(x)),
          );
      }
      for (const x of piece) append(out, x);
      return;
    }
    let name = memo.names.get(e.id);
    if (!name) {
      name = renderName(e.name, marksOf(e.id)).map((x) => Object.freeze(x));
      memo.names.set(e.id, name);
    }
    for (const x of name) append(out, x);
  });
}

const COMMA: TextSegment = Object.freeze({ text: ', ', emphasis: false });
const OPEN: TextSegment = Object.freeze({ text: ' (', emphasis: false });
const CLOSE: TextSegment = Object.freeze({ text: ')', emphasis: false });

/** Names for a "Contains" statement: each source (species where recorded) once, or the group labels. */
export function containsNames(contains: ContainedAllergen[], rules: RegimeRules): string[] {
  const style = rules.statement.contains;
  if (!style) return [];
  const names: string[] = [];
  const add = (n: string) => {
    if (!names.includes(n)) names.push(n);
  };
  for (const c of contains) {
    if (style.names === 'groups') {
      add(c.label);
      continue;
    }
    if (c.allergen === rules.sulphites.group) {
      add(rules.sulphites.name);
      continue;
    }
    const group = rules.groups.find((g) => g.code === c.allergen);
    if (group?.nameSpecies && c.species && c.species.length > 0) c.species.forEach(add);
    else c.sources.forEach((s) => add(rules.sourceNames[s]?.name ?? s));
  }
  return names;
}

export interface RenderedList {
  text: string;
  segments: TextSegment[];
  markdown: string;
}

/**
 * The list in the regime's own form. EU/UK: allergens emphasised within the list and no
 * "Contains" statement (Commission Notice 2017/C 428/01 §3.5). US and Canada: the list,
 * then a "Contains:" statement right after it. ANZ: names in bold in the list and a bold
 * "Contains" summary. `memo` keeps names and sub-recipes as rendered (RenderMemo) for lists of
 * one book under the same marks (regime, sulphites declared or not).
 */
export function renderList(
  entries: DeclaredIngredient[],
  contains: ContainedAllergen[],
  rules: RegimeRules,
  marksOf: (ingredientId: string) => Mark[],
  memo: RenderMemo = { names: new Map(), pieces: new Map(), keyOf: () => null },
): RenderedList {
  const segments: TextSegment[] = [];
  append(segments, { text: rules.statement.heading, emphasis: false });
  renderEntries(entries, marksOf, memo, segments);
  append(segments, { text: '.', emphasis: false });
  const style = rules.statement.contains;
  const names = containsNames(contains, rules);
  if (style && names.length > 0) {
    append(segments, { text: ' ', emphasis: false });
    append(segments, { text: `${style.prefix}${names.join(', ')}.`, emphasis: style.bold });
  }
  return {
    segments,
    text: segments.map((s) => s.text).join(''),
    markdown: segments.map((s) => (s.emphasis ? `**${s.text}**` : s.text)).join(''),
  };
}

export function mayContainText(mayContain: MayContainAllergen[]): string | null {
  return mayContain.length === 0 ? null : `May contain: ${mayContain.map((m) => m.label).join(', ')}.`;
}
