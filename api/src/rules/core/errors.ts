import type { BookProblem } from '@crumbproof/shared';

/** Thrown when a book has problems: nothing is declared from it. */
export class BookProblemsError extends Error {
  readonly problems: BookProblem[];

  constructor(problems: BookProblem[]) {
    super(
      `The recipe book has ${problems.length} problem${problems.length === 1 ? '' : 's'}:\n${problems.map((p) => p.message).join('\n')}`,
    );
    this.name = 'BookProblemsError';
    this.problems = problems;
  }
}

/** Thrown when the product asked for is not a recipe of the book. */
export class UnknownProductError extends Error {
  constructor(readonly productId: string) {
    super(`There is no recipe '${productId}' in this book.`);
    this.name = 'UnknownProductError';
  }
}
