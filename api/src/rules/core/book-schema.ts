import { z } from 'zod';
import { bookFileSchema } from '@crumbproof/shared';

/**
 * The JSON Schema of the recipe book file, generated from the zod schema in shared/ (the input
 * side: fields with defaults are optional; exactly one of site and sites). Published as reference-data/book.schema.json.
 */
export function bookJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(bookFileSchema, { io: 'input', target: 'draft-2020-12' }),
    $id: 'https://crumbproof.example/reference-data/book.schema.json',
    title: 'Crumbproof recipe book',
  };
}

/** The published file's exact text. */
export function bookJsonSchemaText(): string {
  return `${JSON.stringify(bookJsonSchema(), null, 2)}\n`;
}
