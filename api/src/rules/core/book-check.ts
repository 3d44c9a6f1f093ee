import { isWeighed, type Book, type BookIngredient, type BookProblem, type BookRecipe, type WeighedLine } from '@crumbproof/shared';
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
  const problems: BookProblem[] = [];
  for (const recipe of book.recipes) {
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
        if (!weighed.ok) problems.push(unweighable(recipe, n, line, ingredient, weighed.needs));
      } else if (sub && !RECIPE_UNITS.has(line.unit)) {
        problems.push({
          code: 'unweighable-line',
          recipe: recipe.id,
          field: 'unit',
          line: n,
          use: line.use,
          unit: line.unit,
          needs: 'grams',
          message: `Line ${n} of ${recipe.name} uses '${line.use}' in '${line.unit}', but ${sub.name} is a recipe and can only be weighed. Write the line in grams.`,
        });
      }
    });
  }
  return problems;
}

function unweighable(recipe: BookRecipe, n: number, line: WeighedLine, item: BookIngredient, needs: 'gPerMl' | 'gEach'): BookProblem {
  const lower = item.name.toLowerCase();
  const missing =
    needs === 'gEach'
      ? `${item.name} has no weight per unit. Add the weight of one ${lower}, or write the line in grams.`
      : `${item.name} has no weight per millilitre. Add its density in grams per millilitre, or write the line in grams.`;
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
