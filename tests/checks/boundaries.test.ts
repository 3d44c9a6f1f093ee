import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

// The import directions of DEVELOPERS.md: shared imports nothing of ours; web and api import
// shared, never each other; no web feature imports another; the rules core has no framework.
const ROOT = join(new URL('.', import.meta.url).pathname, '..', '..');

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    if (name === 'node_modules' || name === 'dist') return [];
    return statSync(p).isDirectory() ? files(p) : /\.(ts|tsx)$/.test(name) ? [p] : [];
  });
}

function imports(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  return [...text.matchAll(/(?:import|export)[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)].map((m) => m[1] ?? m[2]);
}

const offenders = (dir: string, bad: (spec: string, file: string) => boolean) =>
  files(join(ROOT, dir)).flatMap((f) =>
    imports(f)
      .filter((s) => bad(s, f))
      .map((s) => `${relative(ROOT, f)} imports ${s}`),
  );

describe('import boundaries', () => {
  it('shared imports only zod and its own files', () => {
    expect(offenders('shared/src', (s) => !s.startsWith('./') && s !== 'zod')).toEqual([]);
  });

  it('web never imports the api, and api never imports the web', () => {
    expect(offenders('web/src', (s) => /(^|\/)api\/src|@crumbproof\/api/.test(s))).toEqual([]);
    expect(offenders('api/src', (s) => /(^|\/)web\/src|@crumbproof\/web/.test(s))).toEqual([]);
  });

  it('no web feature imports another feature', () => {
    expect(
      offenders('web/src/features', (s, f) => {
        const own = relative(join(ROOT, 'web/src/features'), f).split('/')[0];
        const m = /features\/([^/]+)/.exec(s);
        return Boolean(m && m[1] !== own);
      }),
    ).toEqual([]);
  });

  it('the rules core uses no framework, database or I/O', () => {
    // Specs may read their fixtures; the engine itself may not.
    const forbidden = /^@nestjs|^sequelize|^node:|^fs$|^path$|^mariadb|^fastify/;
    expect(offenders('api/src/rules/core', (s, f) => !f.endsWith('.spec.ts') && forbidden.test(s))).toEqual([]);
  });
});
