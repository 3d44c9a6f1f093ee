import { readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import {
  checkTemplate,
  leafBlocks,
  parseTemplate,
  type LabelFonts,
  type LabelTemplate,
  type TemplateProblem,
} from '@crumbproof/shared/labels';

/** label-templates/ at the repository root (the same from src/labels and dist/labels). */
export const LABEL_TEMPLATES_DIR = resolve(__dirname, '..', '..', '..', 'label-templates');

/** The JSON Schema beside the templates is not a template. */
const NOT_TEMPLATES = new Set(['template.schema.json']);

/** A template as the API offers it: what it is for and whether its labels carry a batch code. */
export interface LoadedTemplate {
  template: LabelTemplate;
  /** The template prints a batch code (a batch block, or a GS1-128 barcode with its (10)). */
  printsBatch: boolean;
}

/**
 * Reads and checks every template in the folder against the template schema and, with `fonts`,
 * against the legibility rule (Regulation (EU) No 1169/2011 Article 13(2) and (3), Annex IV);
 * refuses them all, naming each file and field that is wrong, when any one is (so a bad
 * template stops the API at start, never a print run).
 */
export function loadLabelTemplates(dir: string = LABEL_TEMPLATES_DIR, fonts?: LabelFonts): Map<string, LoadedTemplate> {
  const files = readdirSync(dir)
    .filter((f) => f.endsWith('.json') && !NOT_TEMPLATES.has(f))
    .sort();
  const problems: TemplateProblem[] = [];
  const out = new Map<string, LoadedTemplate>();
  for (const name of files) {
    const file = `label-templates/${name}`;
    let raw: unknown;
    try {
      raw = JSON.parse(readFileSync(join(dir, name), 'utf8'));
    } catch (e) {
      problems.push({ file, field: '(the file)', message: `It is not valid JSON: ${(e as Error).message}` });
      continue;
    }
    const parsed = fonts ? checkTemplate(raw, file, fonts) : parseTemplate(raw, file);
    if (!parsed.ok) {
      problems.push(...parsed.problems);
      continue;
    }
    const blocks = leafBlocks(parsed.template).map((b) => b.block);
    out.set(parsed.template.id, {
      template: parsed.template,
      printsBatch: blocks.some((b) => b.type === 'batch' || (b.type === 'barcode' && b.kind === 'gs1-128')),
    });
  }
  if (problems.length > 0)
    throw new Error(`The label templates cannot be used: ${problems.map((p) => `${p.file}, ${p.field}: ${p.message}`).join('; ')}`);
  return out;
}
