import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import Ajv2020 from 'ajv/dist/2020';
import { ALLERGEN_SOURCES, EXEMPT_FORMS, bookSchema } from '@crumbproof/shared';
import { bookJsonSchema, bookJsonSchemaText } from './book-schema';

const ROOT = join(__dirname, '..', '..', '..', '..');

/** The raw JSON of a book, loosely typed for editing in failure cases. */
interface RawBook {
  site: Record<string, unknown>;
  ingredients: Array<Record<string, unknown>>;
  recipes: Array<{ lines: Array<Record<string, unknown>> }>;
}

describe('reference-data/book.schema.json', () => {
  it('is exactly the JSON Schema generated from the zod bookSchema (regenerate: tsx --conditions=source api/src/cli/write-book-schema.ts)', () => {
    expect(readFileSync(join(ROOT, 'reference-data', 'book.schema.json'), 'utf8')).toBe(bookJsonSchemaText());
  });

  const validate = new Ajv2020({ strict: false, allErrors: true }).compile(bookJsonSchema());

  it.each(['tests/fixtures/shortbread.book.json', 'api/src/database/seeders/demo-book.json'])('accepts %s', (file) => {
    const ok = validate(JSON.parse(readFileSync(join(ROOT, file), 'utf8')));
    expect(validate.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
  });

  it.each([
    { title: 'an unknown allergen source', edit: (b: RawBook) => (b.ingredients[0].contains = ['quinoa']) },
    { title: 'a missing vegan status', edit: (b: RawBook) => delete b.ingredients[0].vegan },
    { title: 'an unknown unit', edit: (b: RawBook) => (b.recipes[0].lines[0].unit = 'pinch') },
    { title: 'an unknown field', edit: (b: RawBook) => (b.site.colour = 'blue') },
  ])('rejects $title', ({ edit }) => {
    const b = JSON.parse(readFileSync(join(ROOT, 'tests/fixtures/shortbread.book.json'), 'utf8')) as RawBook;
    edit(b);
    expect(validate(b)).toBe(false);
  });
});

describe('bookSchema: an unknown allergen source or form says which value and what is accepted', () => {
  const SOURCES = ALLERGEN_SOURCES.join(', ');
  const FORMS = EXEMPT_FORMS.join(', ');
  const withEntry = (entry: unknown, list: 'contains' | 'mayContain' = 'contains') => {
    const b = JSON.parse(readFileSync(join(ROOT, 'tests/fixtures/shortbread.book.json'), 'utf8')) as RawBook;
    b.ingredients[0][list] = ['milk', entry];
    return bookSchema.safeParse(b);
  };
  const issuesOf = (r: ReturnType<typeof withEntry>) =>
    r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));

  it.each([
    { title: 'an unknown source', entry: 'quinoa', message: `Unknown allergen source 'quinoa'. Use one of: ${SOURCES}.` },
    {
      title: 'an unknown source in an entry with a form',
      entry: { source: 'quinoa', form: 'refined-oil' },
      message: `Unknown allergen source 'quinoa'. Use one of: ${SOURCES}.`,
    },
    {
      title: 'an unknown form',
      entry: { source: 'wheat', form: 'syrup' },
      message: `Unknown allergen form 'syrup'. Use one of: ${FORMS}.`,
    },
    { title: 'an entry without its source', entry: { form: 'refined-oil' }, message: `Give the allergen source, one of: ${SOURCES}.` },
    {
      title: 'an entry with a field it does not have',
      entry: { source: 'fish', kind: 'cod' },
      message: 'An allergen entry has only source, form and species; remove kind.',
    },
    { title: 'a number', entry: 7, message: `Write each allergen as a source (one of: ${SOURCES}) or as {"source", "form", "species"}.` },
  ])('$title', ({ entry, message }) => {
    expect(issuesOf(withEntry(entry))).toEqual([{ path: 'ingredients.0.contains.1', message }]);
  });

  it('says the same for a may-contain entry, and the book is not accepted', () => {
    const r = withEntry('hazelnuts', 'mayContain');
    expect(r.success).toBe(false);
    expect(issuesOf(r)).toEqual([
      { path: 'ingredients.0.mayContain.1', message: `Unknown allergen source 'hazelnuts'. Use one of: ${SOURCES}.` },
    ]);
  });

  it('says the same for an allergen the kitchen handles', () => {
    const b = JSON.parse(readFileSync(join(ROOT, 'tests/fixtures/shortbread.book.json'), 'utf8')) as RawBook;
    b.site.handles = [{ allergen: 'nuts', controls: 'segregated' }];
    const r = bookSchema.safeParse(b);
    expect(issuesOf(r)).toEqual([{ path: 'site.handles.0.allergen', message: `Unknown allergen source 'nuts'. Use one of: ${SOURCES}.` }]);
  });

  it('still accepts every source and form, alone and with a species', () => {
    for (const source of ALLERGEN_SOURCES) expect(withEntry(source).success).toBe(true);
    for (const form of EXEMPT_FORMS) expect(withEntry({ source: 'wheat', form }).success).toBe(true);
    expect(withEntry({ source: 'fish', species: 'cod' }).success).toBe(true);
  });
});

describe('bookSchema: a line in the mix needs its quantity and unit; a contact line needs neither', () => {
  const lineIssues = (line: Record<string, unknown>) => {
    const b = JSON.parse(readFileSync(join(ROOT, 'tests/fixtures/shortbread.book.json'), 'utf8')) as RawBook;
    b.recipes[0].lines = [b.recipes[0].lines[0], line];
    const r = bookSchema.safeParse(b);
    return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.slice(2).join('.'), message: i.message }));
  };

  it.each([
    { title: 'a contact line with no quantity or unit', line: { use: 'butter', role: 'contact' }, issues: [] },
    { title: 'a contact line with a quantity', line: { use: 'butter', role: 'contact', qty: 5, unit: 'g' }, issues: [] },
    {
      title: 'a line in the mix with no quantity',
      line: { use: 'butter', unit: 'g' },
      issues: [{ path: 'lines.1.qty', message: 'Give a quantity above zero.' }],
    },
    {
      title: 'a line in the mix with no unit',
      line: { use: 'butter', qty: 5, role: 'ingredient' },
      issues: [{ path: 'lines.1.unit', message: 'Give a unit: one of g, kg, ml, l, tsp, tbsp, cup, each.' }],
    },
    {
      title: 'a contact line with a quantity of zero',
      line: { use: 'butter', role: 'contact', qty: 0, unit: 'g' },
      issues: [{ path: 'lines.1.qty', message: 'Give a quantity above zero.' }],
    },
  ])('$title', ({ line, issues }) => {
    expect(lineIssues(line)).toEqual(issues);
  });
});
