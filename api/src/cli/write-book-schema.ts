import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { bookJsonSchemaText } from '../rules/core';

/** Writes reference-data/book.schema.json from the zod bookFileSchema (run after changing shared/src/book.ts). */
const target = resolve(__dirname, '..', '..', '..', 'reference-data', 'book.schema.json');
writeFileSync(target, bookJsonSchemaText());
process.stdout.write(`Wrote ${target}\n`);
