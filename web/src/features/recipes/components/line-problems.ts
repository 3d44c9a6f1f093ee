import type { BookProblem } from '@crumbproof/shared';
import type { ApiError } from '@/lib/api-client';

/** A line's fields as the API names them in the request body it refuses: `lines.2.qty`. */
const LINE_FIELDS = ['use', 'qty', 'unit', 'role'] as const;

/**
 * What an API error says about each line of the recipe being edited, by 0-based index. Read from
 * the ids the API sends (the recipe and its line, a cycle's recipes in order) and from the request
 * fields it names, never from the words of a message.
 */
export function lineProblems(error: ApiError | null, recipeId: string, uses: readonly string[]): Map<number, string[]> {
  const byLine = new Map<number, string[]>();
  if (!error) return byLine;
  const add = (index: number, message: string) => {
    if (index < 0 || index >= uses.length) return;
    const messages = byLine.get(index) ?? [];
    if (!messages.includes(message)) byLine.set(index, [...messages, message]);
  };
  for (const problem of error.problems) for (const index of linesOf(problem, recipeId, uses)) add(index, problem.message);
  uses.forEach((_, index) => {
    const paths = new Set([`lines.${index}`, ...LINE_FIELDS.map((field) => `lines.${index}.${field}`)]);
    for (const field of error.fields) if (paths.has(field.path)) add(index, field.message);
  });
  return byLine;
}

function linesOf(problem: BookProblem, recipeId: string, uses: readonly string[]): number[] {
  switch (problem.code) {
    case 'unweighable-line':
      return problem.recipe === recipeId ? [problem.line - 1] : [];
    case 'unknown-reference':
      return problem.recipe === recipeId && problem.field === 'use' ? [problem.line - 1] : [];
    case 'recipe-cycle': {
      // Each recipe of the cycle uses the next: this recipe's lines using the next one close it.
      const at = problem.recipes.indexOf(recipeId);
      if (at < 0) return [];
      const next = problem.recipes[(at + 1) % problem.recipes.length];
      return uses.flatMap((use, index) => (use === next ? [index] : []));
    }
    case 'duplicate-id':
      return [];
  }
}
