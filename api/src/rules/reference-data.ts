import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { z } from 'zod';
import { lexiconFileSchema, regimesFileSchema, type ReferenceData } from './core/reference-schema';

/** reference-data/ at the repository root (the same from src/rules and dist/rules). */
export const REFERENCE_DATA_DIR = resolve(__dirname, '..', '..', '..', 'reference-data');

export class ReferenceDataError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ReferenceDataError';
  }
}

function readValidated<S extends z.ZodType>(dir: string, file: string, schema: S): z.output<S> {
  const path = join(dir, file);
  let json: unknown;
  try {
    json = JSON.parse(readFileSync(path, 'utf8'));
  } catch (e) {
    throw new ReferenceDataError(`Cannot read reference data ${path}: ${e instanceof Error ? e.message : String(e)}`);
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => `  ${i.path.join('.') || '(file)'}: ${i.message}`).join('\n');
    throw new ReferenceDataError(`Reference data ${path} is invalid:\n${issues}`);
  }
  return parsed.data;
}

/**
 * Reads and validates reference-data/regimes.json and lexicon.json. The only place the rules
 * read files; anything wrong stops the caller with every problem named.
 */
export function loadReferenceData(dir: string = REFERENCE_DATA_DIR): ReferenceData {
  const regimes = readValidated(dir, 'regimes.json', regimesFileSchema);
  const lexicon = readValidated(dir, 'lexicon.json', lexiconFileSchema);
  return { regimes: regimes.regimes, lexicon };
}
