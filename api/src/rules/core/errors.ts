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

/** Thrown when the site asked for is not one of the book's: the message names the ones it has. */
export class UnknownSiteError extends Error {
  constructor(
    readonly siteId: string,
    readonly known: ReadonlyArray<{ id: string; name: string }>,
  ) {
    super(
      known.length === 0
        ? `This book holds one kitchen, given as site without an id, so it has no site '${siteId}'.`
        : `There is no site '${siteId}' in this book; its sites are ${known.map((s) => `${s.id} (${s.name})`).join(', ')}.`,
    );
    this.name = 'UnknownSiteError';
  }
}
