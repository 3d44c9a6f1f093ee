import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** The command line as a user runs it: npm run declare -- BOOK.json [--site ID] [--regime R] [--product ID]. */
const ROOT = join(__dirname, '..', '..', '..');
// npm sets INIT_CWD to where the user ran it; paths in the arguments are read from there.
const run = (...args: string[]) =>
  spawnSync('node', [join(ROOT, 'api', 'scripts', 'declare.mjs'), ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, INIT_CWD: ROOT },
  });
const SHORTBREAD = 'tests/fixtures/shortbread.book.json';
/** Two sites: the bench (EU, sesame on shared equipment) and the corner shop (US, sesame kept apart, its own flour, sells shortbread). */
const TWO_KITCHENS = 'tests/fixtures/two-kitchens.book.json';

interface SiteOut {
  declarations: Array<{
    product: string;
    regime: string;
    site: { id: string; name: string };
    mayContainText: string | null;
    ingredientsText: string;
    standIns: Array<{ recipe: string; line: number; replaces: string; with: string }>;
  }>;
}

function tempBook(book: unknown): string {
  const file = join(mkdtempSync(join(tmpdir(), 'book-')), 'book.json');
  writeFileSync(file, JSON.stringify(book));
  return file;
}

describe('npm run declare', () => {
  it('prints {"declarations": [...]} for every recipe with sale details', () => {
    const r = run(SHORTBREAD);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { declarations: Array<{ product: string; regime: string }> };
    expect(out.declarations.map((d) => [d.product, d.regime])).toEqual([['shortbread', 'EU']]);
  });

  it('declares under another regime and for one product when asked', () => {
    const r = run(SHORTBREAD, '--regime', 'US', '--product', 'shortbread');
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).declarations[0].ingredientsText).toBe('Ingredients: Plain wheat flour, Butter. Contains: milk, wheat.');
  });

  it.each([
    {
      title: 'a book that fails the schema',
      book: {
        crumbproofBook: 1,
        site: { name: 'x', regime: 'EU' },
        ingredients: [{ id: 'lemon', name: 'Lemon', vegan: true }],
        recipes: [],
      },
      // The same line as the API's refusal of this book (api/test/kitchen-data.spec.ts).
      stderr: 'book-invalid: ingredients.0 (lemon).vegetarian: Say whether it is vegetarian: true, false, or null when it is not known.',
    },
    {
      title: 'a book with an unweighable line',
      book: {
        crumbproofBook: 1,
        site: { name: 'x', regime: 'EU' },
        ingredients: [{ id: 'lemon', name: 'Lemon', contains: [], vegan: true, vegetarian: true }],
        recipes: [{ id: 'curd', name: 'Lemon curd', lines: [{ use: 'lemon', qty: 2, unit: 'each' }] }],
      },
      stderr: "unweighable-line: Line 1 of Lemon curd uses 'lemon' in 'each', but Lemon has no weight per unit.",
    },
    {
      title: 'a book whose recipes contain each other',
      book: {
        crumbproofBook: 1,
        site: { name: 'x', regime: 'EU' },
        ingredients: [{ id: 'flour', name: 'Flour', contains: ['wheat'], vegan: true, vegetarian: true }],
        recipes: [
          { id: 'sponge', name: 'Sponge', lines: [{ use: 'cake', qty: 10, unit: 'g' }] },
          {
            id: 'cake',
            name: 'Cake',
            lines: [
              { use: 'flour', qty: 100, unit: 'g' },
              { use: 'sponge', qty: 50, unit: 'g' },
            ],
          },
        ],
      },
      stderr: 'recipe-cycle: Sponge contains itself: Sponge → Cake → Sponge. Remove one of these lines.',
    },
  ])('exits non-zero on $title, one reason a line on stderr', ({ book, stderr }) => {
    const r = run(tempBook(book));
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr.split('\n')[0]).toContain(stderr);
  });

  it('names every schema problem on its own line, each item by its id', () => {
    const r = run(
      tempBook({
        crumbproofBook: 1,
        site: { name: 'x', regime: 'EU' },
        ingredients: [{ id: 'butter', name: 'Butter', contains: 'milk', vegan: false, vegetarian: true }],
        recipes: [{ id: 'shortbread', name: 'Shortbread', lines: [{ use: 'butter', qty: 0, unit: 'g' }] }],
      }),
    );
    expect(r.status).toBe(1);
    expect(r.stderr.trim().split('\n')).toEqual([
      'book-invalid: ingredients.0 (butter).contains: Write this as a list.',
      'book-invalid: recipes.0 (shortbread).lines.0.qty: Give a quantity above zero.',
    ]);
  });

  it('declares a book of several sites for its first site by default, each declaration naming the site and what stood in', () => {
    const r = run(TWO_KITCHENS);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as SiteOut;
    expect(out.declarations.map((d) => [d.product, d.regime, d.site.id])).toEqual([
      ['shortbread', 'EU', 'bench'],
      ['sesame-snap', 'EU', 'bench'],
    ]);
    // The bench handles sesame on shared equipment (Regulation (EU) No 1169/2011 Article 36(3)(a)).
    expect(out.declarations[0].mayContainText).toBe('May contain: sesame seeds.');
    expect(out.declarations[0].standIns).toEqual([]);
    expect(out.declarations[0].ingredientsText).toContain('Plain wheat flour');
  });

  it('declares at the site given: its regime, its handling, its substitution and only what it sells', () => {
    const r = run(TWO_KITCHENS, '--site', 'corner');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as SiteOut;
    expect(out.declarations.map((d) => [d.product, d.regime, d.site.name])).toEqual([['shortbread', 'US', 'Corner Shop']]);
    const [shortbread] = out.declarations;
    // FD&C Act 403(w): the list, then "Contains:"; sesame kept apart gives no may-contain, the shop's own flour's supplier one does.
    expect(shortbread.ingredientsText).toBe('Ingredients: Stone-ground wheat flour, Butter. Contains: milk, wheat.');
    expect(shortbread.mayContainText).toBe('May contain: soybeans.');
    expect(shortbread.standIns).toMatchObject([{ recipe: 'shortbread', line: 1, replaces: 'flour', with: 'corner-flour' }]);
  });

  it.each([
    [TWO_KITCHENS, "--site: There is no site 'harbour' in this book; its sites are bench (Test bench), corner (Corner Shop)."],
    [SHORTBREAD, "--site: This book holds one kitchen, given as site without an id, so it has no site 'harbour'."],
  ])('refuses a site %s does not have, naming the ones it has', (book, message) => {
    const r = run(book, '--site', 'harbour');
    expect(r.status).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim()).toBe(message);
  });

  it("says at which site a book's problem is found", () => {
    const book = JSON.parse(readFileSync(join(ROOT, TWO_KITCHENS), 'utf8')) as {
      recipes: Array<{ lines: Array<Record<string, unknown>> }>;
    };
    book.recipes[0].lines[0] = { use: 'flour', qty: 2, unit: 'cup' };
    const r = run(tempBook(book), '--site', 'corner');
    expect(r.status).toBe(1);
    expect(r.stderr.trim()).toBe(
      "unweighable-line: At Corner Shop (corner): Line 1 of Shortbread uses 'corner-flour' in 'cup', but Stone-ground wheat flour has no weight per millilitre. Add its density in grams per millilitre, or write the line in grams.",
    );
  });

  it.each([['--regime', 'XX'], ['--colour'], ['--site'], []])('exits 2 on wrong arguments %p', (...args) => {
    const r = run(...(args.length ? [SHORTBREAD, ...args] : []));
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('Usage: npm run declare');
  });
});
