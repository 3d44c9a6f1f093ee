import { CLAIM_LABELS, EXEMPT_FORM_LABELS, SOURCE_LABELS } from './allergens';
import type { BookIngredient, BookRecipe, RecipeLine, Sale, SourceEntry } from './book';
import { FIGURE_KEYS, FIGURE_NAMES } from './nutrition';

/**
 * What one save changed in an ingredient or a recipe, field by field, in the words a chef reads
 * ("Allergens: added egg"): the editors show it when someone else saved the item first.
 */
export interface ItemChange {
  /** The field of the body, as the book names it: "contains", "nutrition.fat", "sale.portionG". */
  field: string;
  /** The field as the editor labels it: "Allergens", "Fat per 100 g", "Portion". */
  label: string;
  /** The value before and after, in words; null where it was not given. */
  before: string | null;
  after: string | null;
  /** The whole change in one sentence: "Allergens: added egg; removed milk." */
  text: string;
}

type IngredientBody = Omit<BookIngredient, 'id'>;
type RecipeBody = Omit<BookRecipe, 'id'>;

const number = (n: number) => n.toLocaleString('en-GB', { maximumFractionDigits: 5 });

/** "egg", "wheat (glucose syrup)", "fish (cod)". */
function entryWords(entry: SourceEntry): string {
  if (typeof entry === 'string') return SOURCE_LABELS[entry];
  const extra = [entry.form ? EXEMPT_FORM_LABELS[entry.form] : null, entry.species ?? null].filter(Boolean);
  return `${SOURCE_LABELS[entry.source]}${extra.length > 0 ? ` (${extra.join(', ')})` : ''}`;
}

const listWords = (list: string[]) => (list.length > 0 ? list.join(', ') : 'none');

/** Added and removed, by their words: "added egg; removed milk". */
function addedRemoved(before: string[], after: string[]): string {
  const added = after.filter((x) => !before.includes(x));
  const removed = before.filter((x) => !after.includes(x));
  return [added.length > 0 ? `added ${added.join(', ')}` : '', removed.length > 0 ? `removed ${removed.join(', ')}` : '']
    .filter(Boolean)
    .join('; ');
}

function change(field: string, label: string, before: string | null, after: string | null, how?: string): ItemChange | null {
  if (before === after) return null;
  const text =
    how ??
    (before === null ? `set to ${after}` : after === null ? `${before} taken out (not given)` : `changed from ${before} to ${after}`);
  return { field, label, before, after, text: `${label}: ${text}.` };
}

const text = (value: string | undefined) => (value === undefined || value === '' ? null : `“${value}”`);
const amount = (value: number | undefined, unit: string) => (value === undefined ? null : `${number(value)} ${unit}`);
const flag = (value: boolean | undefined) => (value === undefined ? null : value ? 'yes' : 'no');
const known = (value: boolean | null) => (value === null ? 'not known' : value ? 'yes' : 'no');

/** A contains or may-contain list: left out, contains is not known; empty, verified none. */
function allergens(field: string, label: string, before: SourceEntry[] | undefined, after: SourceEntry[] | undefined) {
  const b = before?.map(entryWords);
  const a = after?.map(entryWords);
  const words = (list: string[] | undefined) => (list === undefined ? 'not known (no statement from the supplier)' : listWords(list));
  if (b && a) {
    const how = addedRemoved(b, a);
    return how ? change(field, label, words(b), words(a), how) : null;
  }
  return change(field, label, words(b), words(a));
}

/** Every change between two revisions of an ingredient, in the editor's order. */
export function diffIngredient(before: IngredientBody, after: IngredientBody): ItemChange[] {
  const nutrition = FIGURE_KEYS.map((key) => {
    const { name, unit } = FIGURE_NAMES[key];
    return change(`nutrition.${key}`, `${name} per 100 g`, amount(before.nutrition?.[key], unit), amount(after.nutrition?.[key], unit));
  });
  return [
    change('name', 'Name', text(before.name), text(after.name)),
    change('supplier', 'Supplier', text(before.supplier), text(after.supplier)),
    change('supplierCode', 'Supplier code', text(before.supplierCode), text(after.supplierCode)),
    allergens('contains', 'Allergens', before.contains, after.contains),
    allergens('mayContain', 'May contain', before.mayContain, after.mayContain),
    change('composition', 'Composition', text(before.composition), text(after.composition)),
    change('vegan', 'Vegan', known(before.vegan), known(after.vegan)),
    change('vegetarian', 'Vegetarian', known(before.vegetarian), known(after.vegetarian)),
    change('sulphiteMgPerKg', 'Sulphites', amount(before.sulphiteMgPerKg, 'mg/kg'), amount(after.sulphiteMgPerKg, 'mg/kg')),
    change('glutenMgPerKg', 'Gluten', amount(before.glutenMgPerKg, 'mg/kg'), amount(after.glutenMgPerKg, 'mg/kg')),
    change('gPerMl', 'Weight per ml', amount(before.gPerMl, 'g'), amount(after.gPerMl, 'g')),
    change('gEach', 'Weight of one', amount(before.gEach, 'g'), amount(after.gEach, 'g')),
    change('isWater', 'Added water', flag(before.isWater), flag(after.isWater)),
    change('addsSugars', 'Counts as added sugars', flag(before.addsSugars), flag(after.addsSugars)),
    ...nutrition,
    change('nutrition.source', 'Source of the nutrition figures', text(before.nutrition?.source), text(after.nutrition?.source)),
  ].filter((c): c is ItemChange => c !== null);
}

/** The name of an ingredient or recipe a line uses; undefined when it is not known (the id is said instead). */
export type NameOf = (id: string) => string | undefined;

/** The lines of a recipe, by what they use: "added Butter 50 g; Butter 50 g → 60 g; removed Eggs 1 each". */
function lines(before: RecipeLine[], after: RecipeLine[], nameOf: NameOf): ItemChange | null {
  // A contact line brings its allergens and no weight: a quantity given to one never counts.
  const lineWords = (line: RecipeLine) =>
    `${nameOf(line.use) ?? line.use}${
      line.role === 'contact'
        ? ' (contact only)'
        : line.qty !== undefined && line.unit !== undefined
          ? ` ${number(line.qty)} ${line.unit}`
          : ''
    }`;
  const b = before.map(lineWords);
  const a = after.map(lineWords);
  if (b.join('\n') === a.join('\n')) return null;
  const byUse = (list: RecipeLine[]) => new Map(list.map((l) => [l.use, lineWords(l)]));
  const was = byUse(before);
  const now = byUse(after);
  const parts = [
    ...[...now].filter(([use]) => !was.has(use)).map(([, words]) => `added ${words}`),
    ...[...now].filter(([use, words]) => was.has(use) && was.get(use) !== words).map(([use, words]) => `${was.get(use)} → ${words}`),
    ...[...was].filter(([use]) => !now.has(use)).map(([, words]) => `removed ${words}`),
  ];
  return change('lines', 'Lines', b.join(', '), a.join(', '), parts.length > 0 ? parts.join('; ') : 'put in another order');
}

function sale(before: Sale | undefined, after: Sale | undefined): (ItemChange | null)[] {
  if (!before && !after) return [];
  if (!before || !after)
    return [change('sale', 'For sale', before ? 'yes' : 'no', after ? 'yes' : 'no', after ? 'now for sale' : 'no longer for sale')];
  const claims = (s: Sale) => (s.claims ?? []).map((c) => CLAIM_LABELS[c]);
  const quid = (s: Sale) => s.quid ?? [];
  const claimsHow = addedRemoved(claims(before), claims(after));
  const quidHow = addedRemoved(quid(before), quid(after));
  return [
    change('sale.portionG', 'Portion', amount(before.portionG, 'g'), amount(after.portionG, 'g')),
    claimsHow ? change('sale.claims', 'Claims', listWords(claims(before)), listWords(claims(after)), claimsHow) : null,
    quidHow ? change('sale.quid', 'Percentages shown for', listWords(quid(before)), listWords(quid(after)), quidHow) : null,
    change('sale.shelfLifeDays', 'Shelf life', amount(before.shelfLifeDays, 'days'), amount(after.shelfLifeDays, 'days')),
    change('sale.dateMark', 'Date mark', before.dateMark ?? null, after.dateMark ?? null),
    change('sale.gtin', 'GTIN', before.gtin ?? null, after.gtin ?? null),
    change('sale.caseGtin', 'Case GTIN', before.caseGtin ?? null, after.caseGtin ?? null),
    change('sale.unitsPerCase', 'Units per case', amount(before.unitsPerCase, 'units'), amount(after.unitsPerCase, 'units')),
    change('sale.netWeightG', 'Net weight', amount(before.netWeightG, 'g'), amount(after.netWeightG, 'g')),
    change('sale.storage', 'Storage', text(before.storage), text(after.storage)),
    change('sale.published', 'On the public page', flag(before.published), flag(after.published)),
  ];
}

/** Every change between two revisions of a recipe, in the editor's order; its lines name what they use by `nameOf`. */
export function diffRecipe(before: RecipeBody, after: RecipeBody, nameOf: NameOf = () => undefined): ItemChange[] {
  return [
    change('name', 'Name', text(before.name), text(after.name)),
    lines(before.lines, after.lines, nameOf),
    change('finishedWeightG', 'Finished weight', amount(before.finishedWeightG, 'g'), amount(after.finishedWeightG, 'g')),
    ...sale(before.sale, after.sale),
  ].filter((c): c is ItemChange => c !== null);
}
