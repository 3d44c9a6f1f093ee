import {
  isWeighed,
  SOURCE_LABELS,
  type Book,
  type BookIngredient,
  type Declaration,
  type DeclarationNotice,
  type DeclarationSet,
  type Regime,
  type TextSegment,
} from '@crumbproof/shared';
import {
  allergenDigest,
  allergenLists,
  declaredUses,
  groupsOf,
  ingredientFacts,
  mayContainFor,
  vagueMessage,
  type AllergenDigest,
  type IngredientFacts,
} from './allergens';
import { changeIsClean, checkBook } from './book-check';
import { recipesAboveAny, usersOf, type UsersIndex } from './book-graph';
import { claimsFor, type ClaimMemo } from './claims';
import { BookProblemsError, UnknownProductError } from './errors';
import { ingredientList, isWater } from './ingredient-list';
import { quidFor } from './quid';
import type { ReferenceData, RegimeRules } from './reference-schema';
import { mayContainText, renderList, type Mark } from './statement';
import { lineWeightWarnings, portionWarnings, type WeighedLineFact } from './sanity';
import { sulphitesFor } from './sulphites';
import { indexBook, lineGrams, rollDown, weighedLinesOf, type BookIndex, type LineNode, type LineTree } from './tree';

export interface DeclareOptions {
  /** Defaults to the book's site regime. */
  regime?: Regime;
}

/** Declares one product. Throws BookProblemsError when checkBook finds problems. */
export function declare(book: Book, productId: string, refs: ReferenceData, opts: DeclareOptions = {}): Declaration {
  const problems = checkBook(book);
  if (problems.length > 0) throw new BookProblemsError(problems);
  if (!book.recipes.some((r) => r.id === productId)) throw new UnknownProductError(productId);
  return declareChecked(book, productId, refs, opts.regime ?? book.site.regime, startRun(book));
}

/**
 * Declares products of one book one at a time, each exactly as `declare` gives it, sharing one run
 * (what declareAll shares) for a caller that declares many products of a book but not all at
 * once. The book must have no problems (checkBook), which the caller has found.
 */
export function declarerOfChecked(book: Book, refs: ReferenceData, regime: Regime): (productId: string) => Declaration {
  const run = startRun(book);
  return (productId) => declareChecked(book, productId, refs, regime, run);
}

/** What each declared set was worked out with, so that declaring again after a change reuses it. */
const RUNS = new WeakMap<DeclarationSet, Run>();

/** One declaration for each recipe with sale details. */
export function declareAll(book: Book, refs: ReferenceData, opts: DeclareOptions = {}): DeclarationSet {
  const problems = checkBook(book);
  if (problems.length > 0) throw new BookProblemsError(problems);
  const regime = opts.regime ?? book.site.regime;
  const run = startRun(book);
  const set = { declarations: book.recipes.filter((r) => r.sale).map((r) => declareChecked(book, r.id, refs, regime, run)) };
  RUNS.set(set, run);
  return set;
}

/**
 * After one item (an ingredient or a sub-recipe) changed in `book`, the declarations of `previous`
 * (declared from the book before the change, under the same regime) with only the products that
 * use the item, at any depth, declared again; the others are kept as they were. The result equals
 * declareAll on the changed book, for a change that adds or removes no product. When `previous`
 * came from declareAll or redeclareAfterChange, what it was worked out with is reused: only the
 * changed item and the recipes above it are worked out again.
 */
export function redeclareAfterChange(
  book: Book,
  previous: DeclarationSet,
  changedId: string,
  refs: ReferenceData,
  opts: DeclareOptions = {},
): DeclarationSet {
  const regime = opts.regime ?? book.site.regime;
  const before = RUNS.get(previous);
  let run: Run;
  let above: Set<string>;
  if (before) {
    // Who uses what changes only with a recipe's lines.
    const users =
      book.recipes.some((r, n) => r !== before.book.recipes[n]) || book.recipes.length !== before.book.recipes.length
        ? usersOf(book)
        : before.users();
    above = recipesAboveAny(book, [changedId], users);
    run = runAfterChange(book, before, new Set([...above, changedId]), users);
    if (!changeIsClean(before.book, book, changedId, run.index, users)) assertClean(book);
  } else {
    assertClean(book);
    run = startRun(book);
    above = recipesAboveAny(book, [changedId], run.users());
  }
  const kept = new Map(previous.declarations.map((d) => [d.product, d]));
  const set = {
    declarations: book.recipes
      .filter((r) => r.sale)
      .map((r) => {
        const old = kept.get(r.id);
        return old && old.regime === regime && !above.has(r.id) && r.id !== changedId ? old : declareChecked(book, r.id, refs, regime, run);
      }),
  };
  RUNS.set(set, run);
  return set;
}

function assertClean(book: Book): void {
  const problems = checkBook(book);
  if (problems.length > 0) throw new BookProblemsError(problems);
}

/** The warnings an ingredient gives wherever it is used under a regime (worked out once per ingredient and regime). */
function ingredientWarnings(f: IngredientFacts, rules: RegimeRules): DeclarationNotice[] {
  const warnings: DeclarationNotice[] = [];
  const i = f.ingredient;
  for (const use of f.contains.filter((u) => u.origin === 'composition')) {
    const source = SOURCE_LABELS[use.source];
    warnings.push({
      code: 'composition-discrepancy',
      ingredient: i.id,
      message: f.known
        ? `The composition of ${i.name} names '${use.term}' (${source}), but its allergen list leaves ${source} out; ${source} is taken as contained. Check with the supplier.`
        : `The composition of ${i.name} names '${use.term}' (${source}); ${i.name} has no allergen statement, so ${source} is taken as contained.`,
    });
  }
  for (const hit of f.scan.vague) {
    warnings.push({ code: 'composition-vague', ingredient: i.id, message: vagueMessage(i, hit) });
  }
  const animalVegan = f.contains.some((u) => NOT_VEGAN.has(u.source)) || f.scan.animal.some((h) => h.fails.includes('vegan'));
  const animalVegetarian =
    f.contains.some((u) => NOT_VEGETARIAN.has(u.source)) || f.scan.animal.some((h) => h.fails.includes('vegetarian'));
  if (i.vegan === true && animalVegan) {
    warnings.push({
      code: 'dietary-discrepancy',
      ingredient: i.id,
      message: `${i.name} is recorded as vegan but its allergens or composition name an animal product; vegan is not taken as met.`,
    });
  }
  if (i.vegetarian === true && animalVegetarian) {
    warnings.push({
      code: 'dietary-discrepancy',
      ingredient: i.id,
      message: `${i.name} is recorded as vegetarian but its allergens or composition name meat or fish; vegetarian is not taken as met.`,
    });
  }
  if (!f.known) {
    warnings.push({
      code: 'allergens-unknown',
      ingredient: i.id,
      message: `Not known: ${i.name} has no allergen statement. Nothing about its allergens is proved.`,
    });
  }
  for (const use of f.contains) {
    const group = groupsOf(use.source, rules).find((g) => g.nameSpecies);
    if (group && !use.species && rules.statement.contains?.names === 'sources') {
      warnings.push({
        code: 'species-missing',
        ingredient: i.id,
        message: `${i.name} contains ${SOURCE_LABELS[use.source]} with no species recorded; the statement must name the species.`,
      });
    }
  }
  return warnings;
}

/** The product's own weighed lines, one by one as listed (not merged), contact lines left out. */
function weighedLines(index: BookIndex, tree: LineTree): WeighedLineFact[] {
  return tree.recipe.lines.flatMap((line, n) => {
    if (!isWeighed(line)) return [];
    const ingredient = index.ingredients.get(line.use);
    const name = ingredient?.name ?? index.recipes.get(line.use)?.name ?? line.use;
    const w = lineGrams(line, ingredient, index.measures);
    return w.ok ? [{ line: n + 1, name, grams: w.grams }] : [];
  });
}

/** Quantities out of proportion: a line heavier than the finished product, a portion heavier than it. */
function quantityWarnings(index: BookIndex, tree: LineTree): DeclarationNotice[] {
  return [
    ...lineWeightWarnings(tree.recipe.name, tree.recipe.finishedWeightG, weighedLines(index, tree)),
    ...portionWarnings(tree.recipe.name, tree.recipe.sale?.portionG, tree.finishedG),
  ];
}

/**
 * What declaring several products of one book shares: the book's index (weighed lines), each
 * ingredient's facts, and what they give each list under a regime, worked out once. Declaring
 * one product alone starts a run of its own.
 */
interface Run {
  /** The book declared (checked by checkBook). */
  book: Book;
  index: BookIndex;
  /** Who uses each item in the book (worked out when first asked for). */
  users: () => UsersIndex;
  /** By id; facts are never changed after, and one found for another object of the same id is worked out again. */
  facts: Map<string, IngredientFacts>;
  /** By regime, then facts (so shared with a run after a change, whose changed ingredient has new facts). */
  digests: Map<RegimeRules, WeakMap<IngredientFacts, AllergenDigest>>;
  warnings: Map<RegimeRules, WeakMap<IngredientFacts, DeclarationNotice[]>>;
  claims: ClaimMemo;
  /**
   * By regime and whether the product declares sulphites (`UK|true`), then id: the groups an
   * ingredient or sub-recipe declares (a set, and in the regime's order), and an ingredient's
   * name as the list prints it.
   */
  marked: Map<string, Marked>;
}

interface Marked {
  codes: Map<string, Set<string>>;
  groups: Map<string, string[]>;
  names: Map<string, TextSegment[]>;
  /** Sub-recipes as rendered, by id and role (RenderMemo). */
  pieces: Map<string, TextSegment[]>;
}

function startRun(book: Book): Run {
  return {
    book,
    index: indexBook(book),
    users: once(() => usersOf(book)),
    facts: new Map(),
    digests: new Map(),
    warnings: new Map(),
    claims: new Map(),
    marked: new Map(),
  };
}

function once<T>(make: () => T): () => T {
  let made: { value: T } | undefined;
  return () => (made ??= { value: make() }).value;
}

/**
 * A run for the book after a change, from the run before it: what depends only on an
 * ingredient's facts is shared (kept by facts, and the changed ingredient's are new), and what
 * depends on an item and everything below it is kept for every item but `stale` (the changed
 * item and the recipes above it). The run before is left as it was.
 */
function runAfterChange(book: Book, before: Run, stale: ReadonlySet<string>, users: UsersIndex): Run {
  const keep = <V>(m: Map<string, V>): Map<string, V> => {
    const out = new Map(m);
    for (const id of stale) out.delete(id);
    return out;
  };
  const index = indexBook(book);
  index.weighed = keep(before.index.weighed);
  index.mixes = keep(before.index.mixes);
  index.repeats = keep(before.index.repeats);
  index.bakeDependent = keep(before.index.bakeDependent);
  const marked = new Map<string, Marked>();
  for (const [key, m] of before.marked) {
    // A piece is kept by id and role: those of the stale items go.
    const pieces = new Map([...m.pieces].filter(([k]) => !stale.has(k.slice(0, k.lastIndexOf('|')))));
    marked.set(key, { codes: keep(m.codes), groups: keep(m.groups), names: keep(m.names), pieces });
  }
  return {
    book,
    index,
    users: () => users,
    facts: before.facts,
    digests: before.digests,
    warnings: before.warnings,
    claims: before.claims,
    marked,
  };
}

/**
 * Whether a sub-recipe's list depends on a bake loss from above it: it has no finished weight of
 * its own, and added water is in its lines or in a sub-recipe below that depends on it too (where
 * Annex VII A.1 places water by the level's finished weight, ingredient-list.ts).
 */
function bakeDependent(run: Run, recipeId: string): boolean {
  let depends = run.index.bakeDependent.get(recipeId);
  if (depends === undefined) {
    const recipe = run.index.recipes.get(recipeId);
    depends =
      recipe !== undefined &&
      recipe.finishedWeightG === undefined &&
      weighedLinesOf(run.index, recipe).some((l) =>
        l.ingredient ? isWater(l) : l.recipe !== undefined && bakeDependent(run, l.recipe.id),
      );
    run.index.bakeDependent.set(recipeId, depends);
  }
  return depends;
}

const NOT_VEGAN = new Set(['milk', 'egg', 'fish', 'crustacean', 'mollusc']);
const NOT_VEGETARIAN = new Set(['fish', 'crustacean', 'mollusc']);

/** The memo of one regime in a map of them. */
function ofRules<V>(memo: Map<RegimeRules, WeakMap<IngredientFacts, V>>, rules: RegimeRules): WeakMap<IngredientFacts, V> {
  let byFacts = memo.get(rules);
  if (!byFacts) {
    byFacts = new WeakMap();
    memo.set(rules, byFacts);
  }
  return byFacts;
}

function declareChecked(book: Book, productId: string, refs: ReferenceData, regime: Regime, run: Run): Declaration {
  const rules = refs.regimes[regime];
  const product = run.index.recipes.get(productId);
  if (!product) throw new UnknownProductError(productId);
  const factsOf = (ingredient: BookIngredient): IngredientFacts => {
    let facts = run.facts.get(ingredient.id);
    if (!facts || facts.ingredient !== ingredient) {
      facts = ingredientFacts(ingredient, refs.lexicon);
      run.facts.set(ingredient.id, facts);
    }
    return facts;
  };
  const { tree, leaves, repeated } = rollDown(run.index, product, factsOf);

  const sulphites = sulphitesFor(leaves, tree.finishedG, rules);
  const digests = ofRules(run.digests, rules);
  const digestOf = (facts: IngredientFacts): AllergenDigest => {
    let digest = digests.get(facts);
    if (!digest) {
      digest = allergenDigest(facts, rules);
      digests.set(facts, digest);
    }
    return digest;
  };
  const { contains, precautions, vague, unknown, exempt } = allergenLists(leaves, repeated, digestOf, book.site, rules, sulphites.declared);
  const mayContain = mayContainFor(precautions, rules, contains);
  const claims = claimsFor(leaves, repeated, book.site, rules, tree.finishedG, run.claims);

  // Each ingredient once, in the order its first leaf comes.
  const used = new Map<string, IngredientFacts>();
  for (const leaf of leaves) if (!used.has(leaf.facts.ingredient.id)) used.set(leaf.facts.ingredient.id, leaf.facts);

  const markedKey = `${regime}|${String(sulphites.declared)}`;
  let marked = run.marked.get(markedKey);
  if (!marked) {
    marked = { codes: new Map(), groups: new Map(), names: new Map(), pieces: new Map() };
    run.marked.set(markedKey, marked);
  }
  // The groups each item declares: an ingredient's own, a sub-recipe's the union of its lines'. They
  // are the same wherever the item is used, so each is worked out once for the run (ids are unique).
  const { codes: codesById, groups: groupsById } = marked;
  const codesOf = (node: LineNode): Set<string> => {
    let codes = codesById.get(node.id);
    if (codes) return codes;
    codes = new Set<string>();
    if (node.kind === 'ingredient') {
      const f = used.get(node.id);
      if (f) for (const use of declaredUses(f, rules, sulphites.declared)) groupsOf(use.source, rules).forEach((g) => codes.add(g.code));
    } else for (const child of node.children) codesOf(child).forEach((c) => codes.add(c));
    codesById.set(node.id, codes);
    return codes;
  };
  const groupsAt = (node: LineNode): string[] => {
    let groups = groupsById.get(node.id);
    if (!groups) {
      const codes = codesOf(node);
      // One array for every entry of the item, in every declaration: never changed (ingredientList copies before adding).
      groups = Object.freeze(rules.groups.map((g) => g.code).filter((c) => codes.has(c))) as string[];
      groupsById.set(node.id, groups);
    }
    return groups;
  };
  const list = ingredientList(tree, rules, groupsAt);

  const marksOf = (ingredientId: string): Mark[] => {
    const f = used.get(ingredientId);
    if (!f) return [];
    const emphasis = rules.statement.marksInList;
    const marks: Mark[] = [];
    const add = (m: Mark) => {
      if (!marks.some((x) => x.name === m.name)) marks.push(m);
    };
    for (const use of declaredUses(f, rules, sulphites.declared)) {
      if (use.source === 'sulphites') {
        if (rules.sulphites.markInList)
          add({ name: rules.sulphites.name, match: rules.sourceNames.sulphites?.match ?? [rules.sulphites.name], emphasis });
        continue;
      }
      const name = rules.sourceNames[use.source];
      if (!emphasis || !name || groupsOf(use.source, rules).length === 0) continue;
      add({ name: name.name, match: name.match ?? [name.name], emphasis });
      if (name.also) add({ name: name.also, match: [name.also], emphasis });
    }
    return marks;
  };
  // A sub-recipe is rendered the same wherever it is used when the order below it does not depend
  // on the product: under a contact line, without added water placed by the finished weight, or
  // with no added water weighed by a bake loss from above it (ingredient-list.ts).
  const omitsWater = rules.addedWater.omitUpToPercent !== null;
  const keyOf = (e: { id: string; role: string }): string | null =>
    e.role === 'contact' || !omitsWater || !bakeDependent(run, e.id) ? `${e.id}|${e.role}` : null;
  const rendered = renderList(list.entries, contains, rules, marksOf, { names: marked.names, pieces: marked.pieces, keyOf });
  const quid = quidFor(tree, tree.recipe.sale?.quid ?? []);

  const warningsBy = ofRules(run.warnings, rules);
  const warnings: DeclarationNotice[] = [];
  for (const f of used.values()) {
    let own = warningsBy.get(f);
    if (!own) {
      own = ingredientWarnings(f, rules);
      warningsBy.set(f, own);
    }
    for (const w of own) warnings.push({ ...w });
  }
  warnings.push(...sulphites.warnings, ...list.warnings);
  warnings.push(...quantityWarnings(run.index, tree));
  for (const e of exempt) {
    warnings.push({
      code: 'exempt-form',
      ingredient: e.ingredient,
      message: `${e.name}: ${SOURCE_LABELS[e.source]} in this form is not declared (${e.basis}).`,
    });
  }
  if (claims.vegan.status === 'ok' && mayContain.some((m) => groupsOf('milk', rules).some((g) => g.code === m.allergen))) {
    warnings.push({
      code: 'vegan-not-dairy-free',
      message: `${tree.recipe.name} is vegan as recorded but may contain milk: vegan is not dairy-free.`,
    });
  }

  const errors: DeclarationNotice[] = [...quid.errors];
  for (const claim of tree.recipe.sale?.claims ?? []) {
    const result = claims[claim];
    if (result.status !== 'ok') {
      // Each reason's words once, however many places of the product give it.
      const why = [...new Set(result.reasons.map((r) => r.message))].join(' ');
      errors.push({
        code: 'claim-not-met',
        message: `${tree.recipe.name} is sold as ${claim}, but the claim ${result.status === 'fails' ? 'fails' : 'cannot be verified'}: ${why}`,
      });
    }
  }

  return {
    product: tree.recipe.id,
    name: tree.recipe.name,
    regime,
    finishedWeightG: tree.finishedG,
    mixWeightG: tree.mixG,
    portionG: tree.recipe.sale?.portionG ?? null,
    contains,
    mayContain,
    precautions,
    vague,
    unknown,
    exempt,
    claims,
    ingredients: list.entries,
    ingredientsText: rendered.text,
    ingredientsSegments: rendered.segments,
    ingredientsMarkdown: rendered.markdown,
    mayContainText: mayContainText(mayContain),
    quid: quid.quid,
    sulphites: {
      status: sulphites.status,
      mgPerKg: sulphites.mgPerKg,
      statedMgPerKg: sulphites.statedMgPerKg,
      declared: sulphites.declared,
      missing: sulphites.missing,
    },
    warnings,
    errors,
  };
}
