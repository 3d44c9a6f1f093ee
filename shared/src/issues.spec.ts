import { z } from 'zod';
import { bookIngredientSchema, bookRecipeSchema, bookSchema } from './book';
import { bodyPlace, bookPlace, cellPlace, formatIssue, issueField, type IssuePlace } from './issues';

const firstIssue = (schema: z.ZodType, input: unknown, options?: { reportInput: boolean }) => {
  const result = schema.safeParse(input, options);
  if (result.success) throw new Error('expected the parse to fail');
  return result.error.issues[0];
};
const fields = (schema: z.ZodType, input: unknown, place: IssuePlace) => {
  const result = schema.safeParse(input);
  return result.success ? [] : result.error.issues.map((issue) => issueField(issue, place));
};

const ingredient = (id: string, more: Record<string, unknown> = {}) => ({ id, name: id, vegan: true, vegetarian: true, ...more });
const book = (ingredients: unknown[], recipes: unknown[] = []) => ({
  crumbproofBook: 1,
  site: { name: 'Test kitchen', regime: 'EU' },
  ingredients,
  recipes,
});

describe('the place of a schema issue', () => {
  it('names a listed item of a book by its id: ingredients.3 (butter).contains', () => {
    const input = book([ingredient('flour'), ingredient('sugar'), ingredient('eggs'), ingredient('butter', { contains: 'milk' })]);
    expect(fields(bookSchema, input, bookPlace(input))).toEqual([
      { path: 'ingredients.3 (butter).contains', message: 'Write this as a list.' },
    ]);
  });

  it('names a recipe line below its recipe, and the recipe that has an unknown field', () => {
    const input = book(
      [ingredient('flour')],
      [
        {
          id: 'tart',
          name: 'Tart',
          lines: [
            { use: 'flour', qty: 100, unit: 'g' },
            { use: 'flour', qty: 0, unit: 'g' },
          ],
          colour: 'gold',
        },
      ],
    );
    expect(fields(bookSchema, input, bookPlace(input))).toEqual([
      { path: 'recipes.0 (tart).lines.1.qty', message: 'Give a quantity above zero.' },
      { path: 'recipes.0 (tart)', message: "There is no field 'colour' here; check its spelling or remove it." },
    ]);
  });

  it('keeps the plain path for an item with no usable id, and names the book as a whole', () => {
    const input = book([{ id: 7, name: 'Flour', vegan: true, vegetarian: true }]);
    expect(fields(bookSchema, input, bookPlace(input))).toEqual([{ path: 'ingredients.0.id', message: 'Write this as text.' }]);
    expect(fields(bookSchema, 'not a book', bookPlace('not a book'))).toEqual([
      { path: '(book)', message: 'Write this as a part with its fields.' },
    ]);
  });

  it('names a request body field by its dotted path, and the body as a whole', () => {
    expect(bodyPlace(['lines', 2, 'qty'])).toBe('lines.2.qty');
    expect(bodyPlace([])).toBe('(body)');
  });

  it('names a spreadsheet cell by row and column: row 4, column Contains', () => {
    const place = cellPlace(4, (path) => (path[0] === 'contains' ? 'Contains' : undefined));
    expect(place(['contains', 0])).toBe('row 4, column Contains');
    expect(place(['isWater'])).toBe('row 4');
  });
});

describe('the message of a schema issue', () => {
  it('is the schema’s own where it gives one', () => {
    expect(firstIssue(bookRecipeSchema, { id: 'tart', name: ' ', lines: [{ use: 'flour', qty: 1, unit: 'g' }] }).message).toBe(
      'Give the recipe a name.',
    );
    expect(firstIssue(bookIngredientSchema, ingredient('lemon', { vegetarian: 'maybe' })).message).toBe(
      'Say whether it is vegetarian: true, false, or null when it is not known.',
    );
  });

  it.each([
    { title: 'a word for a number', schema: z.number(), input: 'six', message: 'Write a number, such as 0.5.' },
    { title: 'a missing number', schema: z.strictObject({ fat: z.number() }), input: {}, message: 'Give a number.' },
    { title: 'a number below an inclusive minimum', schema: z.number().min(0), input: -1, message: 'Use a number of at least 0.' },
    { title: 'zero where it must be above zero', schema: z.number().positive(), input: 0, message: 'Use a number above zero.' },
    { title: 'a number above a maximum', schema: z.number().max(100), input: 120, message: 'Use a number no larger than 100.' },
    { title: 'a text too long', schema: z.string().max(5), input: 'praline', message: 'Keep this to 5 characters or fewer.' },
    { title: 'an empty text', schema: z.string().min(1), input: '', message: 'Fill this in.' },
    { title: 'a word not in a list', schema: z.enum(['g', 'kg']), input: 'oz', message: "Choose one of 'g', 'kg'." },
    { title: 'a wrong fixed value', schema: z.literal(1), input: 2, message: 'Use 1.' },
    { title: 'an empty list', schema: z.array(z.number()).min(1), input: [], message: 'Add at least one.' },
    {
      title: 'an unknown field',
      schema: z.strictObject({ fat: z.number() }),
      input: { fat: 1, fta: 2 },
      message: "There is no field 'fta' here; check its spelling or remove it.",
    },
    { title: 'a malformed email address', schema: z.email(), input: 'chef', message: 'Write an email address, such as name@example.com.' },
  ])('words $title from the issue’s code and limits', ({ schema, input, message }) => {
    expect(firstIssue(schema, input).message).toBe(message);
  });

  it('words a value that fits no option of a union by the option it came closest to', () => {
    const entry = z.union([
      z.enum(['wheat', 'milk']),
      z.strictObject({ source: z.enum(['wheat', 'milk']), form: z.enum(['glucose-syrup']) }),
    ]);
    expect(firstIssue(entry, 'mlk').message).toBe("Choose one of 'wheat', 'milk'.");
    expect(firstIssue(entry, { source: 'wheat', form: 'syrup' }).message).toBe("form: Use 'glucose-syrup'.");
  });
});

describe('one line for a schema issue', () => {
  it('joins the place and the message', () => {
    const input = book([ingredient('lemon', { vegetarian: undefined })]);
    expect(formatIssue(firstIssue(bookSchema, input), bookPlace(input))).toBe(
      'ingredients.0 (lemon).vegetarian: Say whether it is vegetarian: true, false, or null when it is not known.',
    );
  });

  it('shows the value when the parse reported it: row 2, column fat', () => {
    const issue = firstIssue(bookIngredientSchema, ingredient('butter', { nutrition: { fat: 120 } }), { reportInput: true });
    expect(
      formatIssue(
        issue,
        cellPlace(2, () => 'fat'),
      ),
    ).toBe("row 2, column fat ('120'): Use a number no larger than 100.");
  });
});
