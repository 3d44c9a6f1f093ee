import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import Ajv2020 from 'ajv/dist/2020';
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
