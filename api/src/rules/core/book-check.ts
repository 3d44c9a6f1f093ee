import {
  isWeighed,
  type Book,
  type BookIngredient,
  type BookProblem,
  type BookRecipe,
  type MeasureSystem,
  type WeighedLine,
} from '@crumbproof/shared';
import type { UsersIndex } from './book-graph';
import { defaultMeasures, toGrams } from './quantities';

/** Lines of these units can be weighed for a sub-recipe (recipes have no density or unit weight). */
const RECIPE_UNITS: ReadonlySet<WeighedLine['unit']> = new Set(['g', 'kg']);

/**
 * Refusals that name what is wrong. A book with any problem declares nothing.
 * Checked: duplicate ids, unknown references (lines and sale.quid), unweighable lines,
 * and recipes that contain themselves at any depth.
 */
export function checkBook(book: Book): BookProblem[] {
  return [...duplicateIds(book), ...lineProblems(book), ...quidProblems(book), ...cycles(book)];
}

function duplicateIds(book: Book): BookProblem[] {
  const problems: BookProblem[] = [];
  const seen = new Map<string, string>();
  const note = (id: string, what: string) => {
    const before = seen.get(id);
    if (before !== undefined) {
      problems.push({
        code: 'duplicate-id',
        id,
        message: `The id '${id}' is used by ${before} and by ${what}. Give each ingredient and recipe its own id.`,
      });
    } else seen.set(id, what);
  };
  for (const i of book.ingredients) note(i.id, `the ingredient ${i.name}`);
  for (const r of book.recipes) note(r.id, `the recipe ${r.name}`);
  return problems;
}

function lineProblems(book: Book): BookProblem[] {
  const ingredients = new Map(book.ingredients.map((i) => [i.id, i]));
  const recipes = new Map(book.recipes.map((r) => [r.id, r]));
  const measures = book.site.measures ?? defaultMeasures(book.site.regime);
  return book.recipes.flatMap((recipe) => recipeLineProblems(recipe, ingredients, recipes, measures));
}

function recipeLineProblems(
  recipe: BookRecipe,
  ingredients: ReadonlyMap<string, BookIngredient>,
  recipes: ReadonlyMap<string, BookRecipe>,
  measures: MeasureSystem,
): BookProblem[] {
  const problems: BookProblem[] = [];
  recipe.lines.forEach((line, index) => {
    const n = index + 1;
    const ingredient = ingredients.get(line.use);
    const sub = recipes.get(line.use);
    if (!ingredient && !sub) {
      problems.push({
        code: 'unknown-reference',
        recipe: recipe.id,
        field: 'use',
        line: n,
        use: line.use,
        message: `Line ${n} of ${recipe.name} uses '${line.use}', which is neither an ingredient nor a recipe in this book.`,
      });
      return;
    }
    if (!isWeighed(line)) return; // contact lines carry no weight
    if (ingredient) {
      const weighed = toGrams(line.qty, line.unit, ingredient, measures);
      if (!weighed.ok) problems.push(unweighable(recipe, n, line, weighed.needs, missingFigure(ingredient, weighed.needs)));
    } else if (sub && !RECIPE_UNITS.has(line.unit)) {
      problems.push(unweighable(recipe, n, line, 'grams', `${sub.name} is a recipe and can only be weighed. Write the line in grams.`));
    }
  });
  return problems;
}

function missingFigure(item: BookIngredient, needs: 'gPerMl' | 'gEach'): string {
  const lower = item.name.toLowerCase();
  return needs === 'gEach'
    ? `${item.name} has no weight per unit. Add the weight of one ${lower}, or write the line in grams.`
    : `${item.name} has no weight per millilitre. Add its density in grams per millilitre, or write the line in grams.`;
}

function unweighable(recipe: BookRecipe, n: number, line: WeighedLine, needs: 'gPerMl' | 'gEach' | 'grams', missing: string): BookProblem {
  return {
    code: 'unweighable-line',
    recipe: recipe.id,
    field: 'unit',
    line: n,
    use: line.use,
    unit: line.unit,
    needs,
    message: `Line ${n} of ${recipe.name} uses '${line.use}' in '${line.unit}', but ${missing}`,
  };
}

function quidProblems(book: Book): BookProblem[] {
  const known = new Set([...book.ingredients.map((i) => i.id), ...book.recipes.map((r) => r.id)]);
  return book.recipes.flatMap((recipe) =>
    (recipe.sale?.quid ?? [])
      .filter((id) => !known.has(id))
      .map((id) => ({
        code: 'unknown-reference' as const,
        recipe: recipe.id,
        field: 'sale.quid' as const,
        use: id,
        message: `The sale details of ${recipe.name} ask for the quantity of '${id}', which is neither an ingredient nor a recipe in this book.`,
      })),
  );
}

/** Depth-first search; each cycle is reported once, named by recipe names from its first recipe. */
function cycles(book: Book): BookProblem[] {
  const recipes = new Map(book.recipes.map((r) => [r.id, r]));
  const state = new Map<string, 'open' | 'done'>();
  const problems: BookProblem[] = [];
  const reported = new Set<string>();

  const visit = (id: string, stack: string[]) => {
    state.set(id, 'open');
    stack.push(id);
    for (const line of recipes.get(id)?.lines ?? []) {
      if (!recipes.has(line.use)) continue;
      const s = state.get(line.use);
      if (s === 'open') {
        const cycle = [...stack.slice(stack.indexOf(line.use)), line.use];
        const key = [...new Set(cycle)].sort().join('\u0000');
        if (!reported.has(key)) {
          reported.add(key);
          const names = cycle.map((r) => recipes.get(r)?.name ?? r);
          problems.push({
            code: 'recipe-cycle',
            recipes: cycle.slice(0, -1),
            message: `${names[0]} contains itself: ${names.join(' → ')}. Remove one of these lines.`,
          });
        }
      } else if (s === undefined) visit(line.use, stack);
    }
    stack.pop();
    state.set(id, 'done');
  };
  for (const r of book.recipes) if (!state.has(r.id)) visit(r.id, []);
  return problems;
}

/** The book looked up by id, as the change check reads it. */
export interface BookLookup {
  ingredients: ReadonlyMap<string, BookIngredient>;
  recipes: ReadonlyMap<string, BookRecipe>;
}

/**
 * Whether `book` certainly has no problem, knowing that `before` had none (checkBook) and that
 * `book` holds the same objects in the same places but for the one item `changedId`: then only
 * what that item touches can be wrong (the lines that use it, a recipe's own lines and QUID, a
 * cycle through it), and only that is checked. False when that cannot be shown, also when the
 * books differ in any other way: the caller then runs checkBook, which says what is wrong.
 * `users` is `book`'s index of who uses what (book-graph.ts usersOf).
 */
export function changeIsClean(before: Book, book: Book, changedId: string, lookup: BookLookup, users: UsersIndex): boolean {
  if (before.site !== book.site) return false;
  const changedIn = <T extends { id: string }>(was: readonly T[], now: readonly T[]): T | null | false => {
    if (was.length !== now.length) return false;
    let changed: T | null = null;
    for (let n = 0; n < now.length; n++) {
      if (was[n] === now[n]) continue;
      if (changed || was[n].id !== changedId || now[n].id !== changedId) return false;
      changed = now[n];
    }
    return changed;
  };
  const ingredient = changedIn(before.ingredients, book.ingredients);
  const recipe = changedIn(before.recipes, book.recipes);
  if (ingredient === false || recipe === false) return false;
  const measures = book.site.measures ?? defaultMeasures(book.site.regime);
  const linesClean = (r: BookRecipe) => recipeLineProblems(r, lookup.ingredients, lookup.recipes, measures).length === 0;
  if (ingredient) {
    for (const id of users.get(ingredient.id) ?? []) {
      const user = lookup.recipes.get(id);
      if (!user || !linesClean(user)) return false;
    }
  }
  if (recipe) {
    if (!linesClean(recipe)) return false;
    if ((recipe.sale?.quid ?? []).some((id) => !lookup.ingredients.has(id) && !lookup.recipes.has(id))) return false;
    // A cycle the change made passes through the changed recipe: does it reach itself?
    const seen = new Set<string>();
    const todo = [recipe.id];
    while (todo.length > 0) {
      for (const line of lookup.recipes.get(todo.pop()!)?.lines ?? []) {
        if (line.use === recipe.id) return false;
        if (!lookup.recipes.has(line.use) || seen.has(line.use)) continue;
        seen.add(line.use);
        todo.push(line.use);
      }
    }
  }
  return true;
}
