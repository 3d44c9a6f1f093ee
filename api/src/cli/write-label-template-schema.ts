import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { templateJsonSchemaText } from '@crumbproof/shared/labels';

/** Writes label-templates/template.schema.json from the zod template schema (run after changing shared/src/labels/template.ts). */
const target = resolve(__dirname, '..', '..', '..', 'label-templates', 'template.schema.json');
writeFileSync(target, templateJsonSchemaText());
process.stdout.write(`Wrote ${target}\n`);
