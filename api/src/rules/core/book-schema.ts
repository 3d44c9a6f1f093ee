import { z } from 'zod';
import { bookSchema } from '@crumbproof/shared';

/**
 * The JSON Schema of the recipe book, generated from the zod schema in shared/ (the input
 * side: fields with defaults are optional). Published as reference-data/book.schema.json.
 */
export function bookJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(bookSchema, { io: 'input', target: 'draft-2020-12' }),
    $id: 'https://crumbproof.example/reference-data/book.schema.json',
    title: 'Crumbproof recipe book',
  };
}

/** The published file's exact text. */
export function bookJsonSchemaText(): string {
  return `${JSON.stringify(bookJsonSchema(), null, 2)}\n`;
}
