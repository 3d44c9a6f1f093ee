import { QueryTypes } from 'sequelize';
import { ID_MAX_LENGTH, ID_PATTERN, canonicalId } from '@crumbproof/shared';
import type { MigrationContext } from '../migrator';

/**
 * Codes compare byte for byte in the database, as they do everywhere else. Under the tables'
 * utf8mb4_unicode_ci, 'SP-CASE' and 'sp-cäse' were the same row as 'sp-case' to the database
 * while the write path told them apart, so a write could reach an item other than the one it
 * named. Every column that holds an item's code, or a key written by the API (a regime, a hash),
 * becomes utf8mb4_bin; names and notes keep the collation that sorts them for people.
 *
 * Nothing is merged or renamed here: when an existing code is not written the one canonical way
 * (lower-case letters, digits and hyphens, starting with a letter or digit), or an ingredient and
 * a recipe of one kitchen share a code, the migration changes nothing and says which they are.
 */
const COLUMNS: { table: string; column: string; type: string }[] = [
  { table: 'ingredients', column: 'code', type: `VARCHAR(${ID_MAX_LENGTH})` },
  { table: 'recipes', column: 'code', type: `VARCHAR(${ID_MAX_LENGTH})` },
  { table: 'declarations', column: 'regime', type: 'VARCHAR(8)' },
  { table: 'declarations', column: 'input_hash', type: 'CHAR(64)' },
  { table: 'specifications', column: 'sha256', type: 'CHAR(64)' },
];

interface CodeRow {
  kind: 'ingredient' | 'recipe';
  site_id: number;
  code: string;
}

export async function up({ sequelize }: MigrationContext) {
  const rows = await sequelize.query<CodeRow>(
    "SELECT 'ingredient' AS kind, site_id, code FROM ingredients UNION ALL SELECT 'recipe' AS kind, site_id, code FROM recipes ORDER BY site_id, code",
    { type: QueryTypes.SELECT },
  );
  const problems: string[] = [];
  for (const r of rows) {
    if (r.code.length > ID_MAX_LENGTH || !ID_PATTERN.test(r.code)) {
      const suggestion = canonicalId(r.code);
      problems.push(
        `the ${r.kind} '${r.code}' of kitchen ${r.site_id} is not an id written with lower-case letters, digits and hyphens${suggestion ? ` (it could be '${suggestion}')` : ''}`,
      );
    }
  }
  const seen = new Map<string, CodeRow>();
  for (const r of rows) {
    const key = `${r.site_id}\u0000${r.code}`;
    const before = seen.get(key);
    if (before && before.kind !== r.kind) problems.push(`the ingredient and the recipe '${r.code}' of kitchen ${r.site_id} share one id`);
    else seen.set(key, r);
  }
  if (problems.length > 0) {
    throw new Error(
      `Ids are about to be compared exactly (lower-case and accented letters no longer match), and some existing ids would not name one item: ${problems.join('; ')}. Nothing was changed. Give each its own id written the canonical way (in the ingredients and recipes tables and in the recipe lines that use them), then migrate again.`,
    );
  }
  for (const c of COLUMNS) await modify(sequelize, c, 'utf8mb4_bin');
}

export async function down({ sequelize }: MigrationContext) {
  for (const c of COLUMNS) await modify(sequelize, c, 'utf8mb4_unicode_ci');
}

async function modify(sequelize: MigrationContext['sequelize'], c: (typeof COLUMNS)[number], collation: string) {
  await sequelize.query(`ALTER TABLE \`${c.table}\` MODIFY \`${c.column}\` ${c.type} CHARACTER SET utf8mb4 COLLATE ${collation} NOT NULL`);
}
