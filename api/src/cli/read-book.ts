import { readFileSync } from 'node:fs';
import { bookFileSchema, bookPlace, formatIssue, type BookProblem } from '@crumbproof/shared';
import { UnknownSiteError, checkBook, siteView, type SiteView } from '../rules/core';

/** Writes each line to stderr and exits with the code. */
export function fail(lines: string[], code: number): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

/** The book's problems, one a line; at a site of a book of several, each says which site it was found at. */
export function problemLines(problems: readonly BookProblem[], view: Pick<SiteView, 'site'>): string[] {
  const at = view.site ? `At ${view.site.name} (${view.site.id}): ` : '';
  return problems.map((p) => `${p.code}: ${at}${p.message}`);
}

/**
 * Reads a recipe book file for a command and gives the view of the site asked for (`--site`,
 * else the book's first; a book of one kitchen given as site, as it is). A file that is not JSON,
 * fails the schema or the book check, or names no such site exits 1 with one reason a line,
 * worded as the API words it.
 */
export function readSiteView(file: string, siteId: string | undefined): SiteView {
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    fail([`book-invalid: cannot read ${file} as JSON: ${e instanceof Error ? e.message : String(e)}`], 1);
  }
  const parsed = bookFileSchema.safeParse(raw);
  if (!parsed.success)
    fail(
      parsed.error.issues.map((issue) => `book-invalid: ${formatIssue(issue, bookPlace(raw))}`),
      1,
    );
  let view: SiteView;
  try {
    view = siteView(parsed.data, siteId);
  } catch (e) {
    if (e instanceof UnknownSiteError) fail([`--site: ${e.message}`], 1);
    throw e;
  }
  const problems = checkBook(view.book);
  if (problems.length > 0) fail(problemLines(problems, view), 1);
  return view;
}
