import { ALLERGEN_SOURCES, CONTROL_LABELS, SOURCE_LABELS, type AllergenSource, type Control } from '../allergens';
import type { Declaration, DeclarationNotice, DeclaredIngredient, IdPath } from '../declaration';

/**
 * Reading the rules engine's precautionary sentences back into what they say. The declaration
 * keeps a may-contain per allergen group with its reasons as sentences ("Supplier of Dark
 * chocolate: may contain hazelnut", "Sesame: shared equipment in this kitchen"), and the claims
 * keep theirs ("Supplier of Dark chocolate: may contain hazelnut."); a customer avoiding one
 * source of a group (one tree nut) needs to know which source each names. A sentence that cannot
 * be read names no source: it is taken to mean any source of its group, never none.
 */

export type PrecautionReason = 'supplier' | 'composition' | 'kitchen';

export interface Precaution {
  /** The source the sentence names; null when it names none (any source of its group may be meant). */
  source: AllergenSource | null;
  reason: PrecautionReason | 'unread';
  /** The ingredient's name as recorded (supplier or composition statements). */
  ingredientName: string | null;
  /** The kitchen's handling (kitchen reasons). */
  controls: Control | null;
  /** The sentence as the engine wrote it. */
  statement: string;
}

const SOURCES = Object.keys(SOURCE_LABELS) as AllergenSource[];
const sourceNamed = (label: string): AllergenSource | null =>
  SOURCES.find((s) => SOURCE_LABELS[s].toLowerCase() === label.trim().toLowerCase()) ?? null;
const controlNamed = (label: string): Control | null =>
  (Object.keys(CONTROL_LABELS) as Control[]).find((c) => CONTROL_LABELS[c] === label.trim()) ?? null;

const STATED = /^(Supplier|Composition) of (.+): may contain (.+?)\.?$/;
const HANDLED_WHY = /^(.+): (.+)$/;
const HANDLED_CLAIM = /^(.+) is handled in this kitchen \((.+)\)\.$/;

/** One reason of a may-contain entry, or of a claim, read back; null when the sentence is no precaution. */
export function readPrecaution(statement: string): Precaution | null {
  const stated = STATED.exec(statement);
  if (stated) {
    const [, who = '', name = '', what = ''] = stated;
    return {
      source: sourceNamed(what),
      reason: who === 'Supplier' ? 'supplier' : 'composition',
      ingredientName: name,
      controls: null,
      statement,
    };
  }
  for (const pattern of [HANDLED_CLAIM, HANDLED_WHY]) {
    const [, what = '', how = ''] = pattern.exec(statement) ?? [];
    const controls = controlNamed(how);
    if (controls) {
      return { source: sourceNamed(what), reason: 'kitchen', ingredientName: null, controls, statement };
    }
  }
  return null;
}

/** A may-contain reason read back; a sentence the engine did not write this way names no source. */
export function readMayContainWhy(why: string): Precaution {
  return readPrecaution(why) ?? { source: null, reason: 'unread', ingredientName: null, controls: null, statement: why };
}

/** Every path from the product to the entry with this id, as the declared ingredient tree holds it. */
export function pathsTo(declaration: Declaration, id: string): IdPath[] {
  const out: IdPath[] = [];
  const walk = (entries: DeclaredIngredient[], above: IdPath) => {
    for (const entry of entries) {
      const path = [...above, entry.id];
      if (entry.id === id) out.push(path);
      walk(entry.children, path);
    }
  };
  walk(declaration.ingredients, [declaration.product]);
  return out;
}

/** The entries along a path (the product itself left out); shorter when the tree does not hold it all. */
export function entriesAlong(declaration: Declaration, path: IdPath): DeclaredIngredient[] {
  const out: DeclaredIngredient[] = [];
  let level = declaration.ingredients;
  for (const id of path.slice(1)) {
    const entry = level.find((e) => e.id === id);
    if (!entry) break;
    out.push(entry);
    level = entry.children;
  }
  return out;
}

/** True when the path passes through a contact line (a floured tin, an oiled tray). */
export function throughContact(declaration: Declaration, path: IdPath): boolean {
  return entriesAlong(declaration, path).some((e) => e.role === 'contact');
}

/** The recorded name of an item of the product, by id; the id itself when the tree does not hold it. */
export function nameOf(declaration: Declaration, id: string): string {
  if (id === declaration.product) return declaration.name;
  const find = (entries: DeclaredIngredient[]): string | undefined => {
    for (const e of entries) {
      if (e.id === id) return e.name;
      const below = find(e.children);
      if (below) return below;
    }
    return undefined;
  };
  return find(declaration.ingredients) ?? id;
}

const TREE_NUTS: AllergenSource[] = ['almond', 'hazelnut', 'walnut', 'cashew', 'pecan', 'brazil-nut', 'pistachio', 'macadamia', 'pine-nut'];

/**
 * The sources a composition term that names no source may stand for. "Nuts" is read as any tree
 * nut and peanut as well, "shellfish" as crustaceans and molluscs, "gluten" as any gluten cereal
 * (common practice: the words are used that loosely). A term not listed may stand for anything.
 */
const VAGUE_TERMS: Record<string, readonly AllergenSource[]> = {
  nut: [...TREE_NUTS, 'peanut'],
  shellfish: ['crustacean', 'mollusc'],
  gluten: ['wheat', 'rye', 'barley', 'oats', 'spelt', 'khorasan', 'triticale'],
};

/** A composition that names e.g. nuts without saying which (a 'composition-vague' notice). */
export interface VagueMention {
  /** The words as written, e.g. 'nuts'; null when the notice cannot be read. */
  term: string | null;
  /** In a precautionary clause ("may contain nuts"), not in the composition itself. */
  precautionary: boolean;
  sources: readonly AllergenSource[];
}

/**
 * A 'composition-vague' notice read back: whether it was a may-contain ("says it may contain
 * 'nuts' and so …") or in the composition itself ("names nuts without saying which ('nuts')"), and
 * the sources its term may stand for. A notice that cannot be read may stand for anything.
 */
export function readVague(notice: DeclarationNotice): VagueMention {
  const stated = /says it may contain '([^']*)' and so /.exec(notice.message);
  const named = /\('([^']*)'\)\. Ask the supplier which\.$/.exec(notice.message);
  const term = (stated?.[1] ?? named?.[1] ?? '').toLowerCase().trim();
  const key = Object.keys(VAGUE_TERMS).find((k) => term === k || term === `${k}s` || term === `${k}es`);
  return { term: term || null, precautionary: stated !== null, sources: (key ? VAGUE_TERMS[key] : undefined) ?? ALLERGEN_SOURCES };
}
