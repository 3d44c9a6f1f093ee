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

function renderEntries(
  entries: DeclaredIngredient[],
  marksOf: (ingredientId: string) => Mark[],
  names: Map<string, TextSegment[]>,
  out: TextSegment[] = [],
): TextSegment[] {
  entries.forEach((e, i) => {
    if (i > 0) out.push({ text: ', ', emphasis: false });
    if (e.kind === 'recipe') {
      out.push({ text: e.name, emphasis: false });
      if (e.children.length > 0) {
        out.push({ text: ' (', emphasis: false });
        renderEntries(e.children, marksOf, names, out);
        out.push({ text: ')', emphasis: false });
      }
      return;
    }
    let name = names.get(e.id);
    if (!name) {
      name = renderName(e.name, marksOf(e.id));
      names.set(e.id, name);
    }
    out.push(...name);
  });
  return out;
}

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
 * "Contains" summary. `names` keeps each ingredient's name as rendered, by id, for lists of
 * one book under the same marks (regime, sulphites declared or not); it is never changed after.
 */
export function renderList(
  entries: DeclaredIngredient[],
  contains: ContainedAllergen[],
  rules: RegimeRules,
  marksOf: (ingredientId: string) => Mark[],
  rendered = new Map<string, TextSegment[]>(),
): RenderedList {
  const segments: TextSegment[] = [{ text: rules.statement.heading, emphasis: false }];
  renderEntries(entries, marksOf, rendered, segments);
  segments.push({ text: '.', emphasis: false });
  const style = rules.statement.contains;
  const names = containsNames(contains, rules);
  if (style && names.length > 0) {
    segments.push({ text: ' ', emphasis: false }, { text: `${style.prefix}${names.join(', ')}.`, emphasis: style.bold });
  }
  const merged = merge(segments);
  return {
    segments: merged,
    text: merged.map((s) => s.text).join(''),
    markdown: merged.map((s) => (s.emphasis ? `**${s.text}**` : s.text)).join(''),
  };
}

export function mayContainText(mayContain: MayContainAllergen[]): string | null {
  return mayContain.length === 0 ? null : `May contain: ${mayContain.map((m) => m.label).join(', ')}.`;
}
