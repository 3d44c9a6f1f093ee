import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** The command line as a user runs it: npm run declare -- BOOK.json [--regime R] [--product ID]. */
const ROOT = join(__dirname, '..', '..', '..');
// npm sets INIT_CWD to where the user ran it; paths in the arguments are read from there.
const run = (...args: string[]) =>
  spawnSync('node', [join(ROOT, 'api', 'scripts', 'declare.mjs'), ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, INIT_CWD: ROOT },
  });
const SHORTBREAD = 'tests/fixtures/shortbread.book.json';

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

  it.each([['--regime', 'XX'], ['--colour'], []])('exits 2 on wrong arguments %p', (...args) => {
    const r = run(...(args.length ? [SHORTBREAD, ...args] : []));
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('Usage: npm run declare');
  });
});
