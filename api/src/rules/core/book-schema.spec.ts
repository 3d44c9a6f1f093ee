import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import Ajv2020 from 'ajv/dist/2020';
import { ALLERGEN_SOURCES, EXEMPT_FORMS, bookFileSchema, bookPlace, bookSchema, formatIssue } from '@crumbproof/shared';
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

  it.each([
    'tests/fixtures/shortbread.book.json',
    'api/src/database/seeders/demo-book.json',
    'tests/fixtures/two-kitchens.book.json',
    'tests/fixtures/chain-kitchens.book.json',
  ])('accepts %s', (file) => {
    const ok = validate(JSON.parse(readFileSync(join(ROOT, file), 'utf8')));
    expect(validate.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
  });

  it.each([
    { title: 'an unknown allergen source', edit: (b: RawBook) => (b.ingredients[0].contains = ['quinoa']) },
    { title: 'a missing vegan status', edit: (b: RawBook) => delete b.ingredients[0].vegan },
    { title: 'an unknown unit', edit: (b: RawBook) => (b.recipes[0].lines[0].unit = 'pinch') },
    { title: 'an unknown field', edit: (b: RawBook) => (b.site.colour = 'blue') },
    { title: 'a book with neither site nor sites', edit: (b: RawBook) => delete (b as Partial<RawBook>).site },
    {
      title: 'a book with both site and sites',
      edit: (b: RawBook) => ((b as RawBook & { sites: unknown[] }).sites = [{ id: 'a', ...b.site }]),
    },
    { title: 'an empty list of sites', edit: (b: RawBook) => Object.assign(b, { site: undefined, sites: [] }) },
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

describe('bookFileSchema: a book of several sites', () => {
  const twoKitchens = () =>
    JSON.parse(readFileSync(join(ROOT, 'tests/fixtures/two-kitchens.book.json'), 'utf8')) as {
      sites: Array<Record<string, unknown> & { substitutions?: Array<Record<string, unknown>>; sells?: string[] }>;
      ingredients: Array<Record<string, unknown>>;
      recipes: Array<{ id: string; name: string; lines: Array<Record<string, unknown>>; sale?: Record<string, unknown> }>;
      site?: unknown;
    };
  type TwoKitchens = ReturnType<typeof twoKitchens>;
  const messages = (edit: (b: TwoKitchens) => void) => {
    const b = twoKitchens();
    edit(b);
    const r = bookFileSchema.safeParse(b);
    return r.success ? [] : r.error.issues.map((i) => formatIssue(i, bookPlace(b)));
  };

  it('accepts the fixture, and reads a book of one kitchen given as site as the one-site book does', () => {
    expect(messages(() => undefined)).toEqual([]);
    const shortbread: unknown = JSON.parse(readFileSync(join(ROOT, 'tests/fixtures/shortbread.book.json'), 'utf8'));
    expect(bookFileSchema.parse(shortbread)).toEqual(bookSchema.parse(shortbread));
  });

  it.each([
    {
      title: 'both site and sites',
      edit: (b: TwoKitchens) => (b.site = { name: 'x', regime: 'EU' }),
      message: 'sites: Give the kitchen either as site (one kitchen) or as sites (several), not both.',
    },
    {
      title: 'neither site nor sites',
      edit: (b: TwoKitchens) => delete (b as Partial<TwoKitchens>).sites,
      message: 'site: Give the kitchen as site (one kitchen), or the kitchens as sites (several, each with its id).',
    },
    {
      title: 'no sites at all',
      edit: (b: TwoKitchens) => (b.sites = []),
      message: 'sites: Give at least one site, or give the one kitchen as site.',
    },
    {
      title: 'a site without an id',
      edit: (b: TwoKitchens) => delete b.sites[1].id,
      message: 'sites.1.id: Fill this in.',
    },
    {
      title: 'a site id written another way',
      edit: (b: TwoKitchens) => (b.sites[1].id = 'Corner Shop'),
      message: "sites.1 (Corner Shop).id: Use lower-case letters, digits and hyphens, e.g. 'corner-shop'.",
    },
    {
      title: 'a site id kept for the public page’s own files',
      edit: (b: TwoKitchens) => (b.sites[0].id = 'fonts'),
      message: "sites.0 (fonts).id: 'fonts' is kept for the public page's own files; give the site another id.",
    },
    {
      title: 'two sites with one id',
      edit: (b: TwoKitchens) => (b.sites[1].id = 'bench'),
      message: "sites.1 (bench).id: The site id 'bench' is used by two sites; give each site its own id.",
    },
    {
      title: 'an ingredient kept at a site the book does not have',
      edit: (b: TwoKitchens) => (b.ingredients[3].onlyAt = 'harbour'),
      message: "ingredients.3 (corner-flour).onlyAt: 'harbour' is not a site of this book; its sites are bench, corner.",
    },
    {
      title: "a recipe line naming a site's own ingredient",
      edit: (b: TwoKitchens) => (b.recipes[0].lines[0].use = 'corner-flour'),
      message:
        "recipes.0 (shortbread).lines.0.use: Line 1 of Shortbread: Stone-ground wheat flour is kept only at Corner Shop (onlyAt 'corner'), and the book's recipes are shared by every site: name the shared ingredient here, and record a substitution on Corner Shop replacing it with 'corner-flour'.",
    },
    {
      title: "QUID naming a site's own ingredient",
      edit: (b: TwoKitchens) => (b.recipes[0].sale!.quid = ['corner-flour']),
      message: expect.stringMatching(
        /^recipes\.0 \(shortbread\)\.sale\.quid\.0: The QUID of Shortbread: Stone-ground wheat flour is kept only at Corner Shop/,
      ),
    },
    {
      title: 'a substitution replacing an ingredient the book does not have',
      edit: (b: TwoKitchens) => (b.sites[1].substitutions![0].replaces = 'rye-flour'),
      message: "sites.1 (corner).substitutions.0.replaces: 'rye-flour' is not an ingredient of this book.",
    },
    {
      title: 'a substitution replacing a recipe',
      edit: (b: TwoKitchens) => (b.sites[1].substitutions![0].replaces = 'shortbread'),
      message:
        "sites.1 (corner).substitutions.0.replaces: 'shortbread' is a recipe; a substitution puts one ingredient in the place of another.",
    },
    {
      title: "a substitution replacing a site's own ingredient",
      edit: (b: TwoKitchens) => (b.sites[1].substitutions![0].replaces = 'corner-flour'),
      message:
        "sites.1 (corner).substitutions.0.replaces: Stone-ground wheat flour is kept only at Corner Shop (onlyAt 'corner'): a substitution replaces one of the book's shared ingredients.",
    },
    {
      title: 'one ingredient replaced twice at a site',
      edit: (b: TwoKitchens) => b.sites[1].substitutions!.push({ replaces: 'flour', with: 'corner-flour' }),
      message:
        'sites.1 (corner).substitutions.1.replaces: Plain wheat flour is already replaced by substitution 1 of this site; replace each ingredient once.',
    },
    {
      title: 'a substitution with an ingredient the book does not have',
      edit: (b: TwoKitchens) => (b.sites[1].substitutions![0].with = 'spelt-flour'),
      message: "sites.1 (corner).substitutions.0.with: 'spelt-flour' is not an ingredient of this book.",
    },
    {
      title: 'a substitution with a shared ingredient',
      edit: (b: TwoKitchens) => (b.sites[1].substitutions![0].with = 'butter'),
      message:
        "sites.1 (corner).substitutions.0.with: Butter is a shared ingredient: what stands in at a site is that site's own ingredient (give it onlyAt 'corner' if only this site keeps it).",
    },
    {
      title: "a substitution with another site's own ingredient",
      edit: (b: TwoKitchens) => (b.sites[0].substitutions = [{ replaces: 'flour', with: 'corner-flour' }]),
      message:
        "sites.0 (bench).substitutions.0.with: Stone-ground wheat flour is kept only at Corner Shop (onlyAt 'corner'), not at Test bench: a site stands in only its own ingredients.",
    },
    {
      title: 'a site selling a recipe the book does not have',
      edit: (b: TwoKitchens) => b.sites[1].sells!.push('eclair'),
      message: "sites.1 (corner).sells.1: 'eclair' is not a recipe of this book.",
    },
    {
      title: 'a site selling an ingredient',
      edit: (b: TwoKitchens) => b.sites[1].sells!.push('butter'),
      message: "sites.1 (corner).sells.1: 'butter' is an ingredient; a site sells recipes.",
    },
    {
      title: 'a site selling a recipe not for sale',
      edit: (b: TwoKitchens) => {
        b.recipes.push({ id: 'dough', name: 'Dough', lines: [{ use: 'flour', qty: 100, unit: 'g' }] });
        b.sites[1].sells!.push('dough');
      },
      message:
        'sites.1 (corner).sells.1: Dough is not for sale in this book (it has no sale details): give it sale details, or leave it out of sells.',
    },
    {
      title: 'a site selling one recipe twice',
      edit: (b: TwoKitchens) => b.sites[1].sells!.push('shortbread'),
      message: 'sites.1 (corner).sells.1: Shortbread is listed twice; list each recipe once.',
    },
  ])('refuses $title, saying where and what to do', ({ edit, message }) => {
    expect(messages(edit)).toEqual([message]);
  });

  it('refuses onlyAt in a book of one kitchen given as site, which has no site ids', () => {
    const b = JSON.parse(readFileSync(join(ROOT, 'tests/fixtures/shortbread.book.json'), 'utf8')) as RawBook;
    b.ingredients[0].onlyAt = 'bench';
    const r = bookFileSchema.safeParse(b);
    expect(r.success ? [] : r.error.issues.map((i) => formatIssue(i, bookPlace(b)))).toEqual([
      "ingredients.0 (flour).onlyAt: onlyAt names a site, and this book's one kitchen (site) has no id: give the book its kitchens as sites, each with its id, or leave onlyAt out.",
    ]);
  });
});
