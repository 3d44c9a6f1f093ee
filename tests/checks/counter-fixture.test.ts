import { spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = new URL('../..', import.meta.url).pathname;
const FIXTURE = join(ROOT, 'web/src/features/counter/testing/demo-kitchen.json');
const BOOK = 'api/src/database/seeders/demo-book.json';

interface RegimeFile {
  regimes: Record<string, { groups: { code: string; label: string; members: string[] }[] }>;
}

/**
 * The counter's web tests classify the demo kitchen's declarations as the rules engine writes
 * them. This keeps that copy true: it is the declaration command's output for the demo book, with
 * the UK's allergen groups from reference-data/regimes.json. After a change to the engine, write
 * it again on purpose: `UPDATE_FIXTURES=1 npx vitest run --config tests/vitest.config.ts checks/counter-fixture`,
 * then `npx prettier --write` the file.
 */
describe('the counter’s demo-kitchen fixture', () => {
  it('is what the rules engine declares for the demo book, with the UK groups', () => {
    const run = spawnSync('npm', ['run', '-s', 'declare', '--', BOOK], { cwd: ROOT, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
    expect(run.status, run.stderr).toBe(0);
    const { declarations } = JSON.parse(run.stdout) as { declarations: { regime: string }[] };
    const regimes = JSON.parse(readFileSync(join(ROOT, 'reference-data/regimes.json'), 'utf8')) as RegimeFile;
    const regime = declarations[0]?.regime ?? 'UK';
    const expected = {
      regime,
      rules: { groups: (regimes.regimes[regime]?.groups ?? []).map((g) => ({ code: g.code, label: g.label, sources: g.members })) },
      declarations,
    };
    if (process.env.UPDATE_FIXTURES === '1') writeFileSync(FIXTURE, `${JSON.stringify(expected)}\n`);
    expect(JSON.parse(readFileSync(FIXTURE, 'utf8'))).toEqual(expected);
    expect(regime).toBe('UK');
  });
});
