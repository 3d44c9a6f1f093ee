import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';

// The API's layers as DEVELOPERS.md describes them: repositories are the only files that touch
// the database, each folder that owns routes has its module and registers only its own models,
// and common/ builds on no feature.
const SRC = __dirname;

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? files(p) : /\.ts$/.test(name) && !/\.spec\.ts$/.test(name) ? [p] : [];
  });
}
const sources = files(SRC).map((path) => ({ path, rel: relative(SRC, path), text: readFileSync(path, 'utf8') }));

/** Import specifiers of a file, without `import type` ones (they bring no code). */
function valueImports(text: string): string[] {
  return [...text.matchAll(/^import\s+(?!type\s)[^'"]*?from\s+['"]([^'"]+)['"]/gm)].map((m) => m[1]);
}

/**
 * The database's own files: schema changes, the connection, the models and the repositories that
 * use them, the transactions, and what tells a database that cannot be reached from other errors.
 */
const DATABASE_SIDE = (rel: string) =>
  /\.repository\.ts$|\.model\.ts$/.test(rel) ||
  rel.startsWith('database/') ||
  ['common/transaction.ts', 'common/database-unavailable.ts', 'cli/db.ts'].includes(rel);

describe('the API’s layers', () => {
  it('has @InjectModel only in repositories', () => {
    expect(sources.filter((s) => /@InjectModel\(/.test(s.text) && !s.rel.endsWith('.repository.ts')).map((s) => s.rel)).toEqual([]);
  });

  it('runs SQL and uses Sequelize itself only on the database side', () => {
    const offenders = sources
      .filter((s) => !DATABASE_SIDE(s.rel))
      .filter(
        (s) =>
          valueImports(s.text).some((spec) => spec === 'sequelize' || spec === 'sequelize-typescript') || /\.query\(\s*['"`]/.test(s.text),
      )
      .map((s) => s.rel);
    expect(offenders).toEqual([]);
  });

  it('gives every folder that owns routes a module of its own', () => {
    const withRoutes = new Set(sources.filter((s) => s.rel.endsWith('.controller.ts')).map((s) => dirname(s.rel)));
    const withModule = new Set(sources.filter((s) => s.rel.endsWith('.module.ts')).map((s) => dirname(s.rel)));
    expect([...withRoutes].filter((dir) => !withModule.has(dir))).toEqual([]);
  });

  it('registers in each module only the models of its own folder', () => {
    const offenders: string[] = [];
    for (const s of sources.filter((x) => x.rel.endsWith('.module.ts'))) {
      const registered = [...s.text.matchAll(/SequelizeModule\.forFeature\(\[([^\]]*)\]\)/g)].flatMap((m) =>
        m[1]
          .split(',')
          .map((x) => x.trim())
          .filter(Boolean),
      );
      for (const model of registered) {
        const from = new RegExp(`import\\s*{[^}]*\\b${model}\\b[^}]*}\\s*from\\s*['"]([^'"]+)['"]`).exec(s.text)?.[1];
        if (!from || dirname(resolve(dirname(s.path), from)) !== dirname(s.path))
          offenders.push(`${s.rel} registers ${model} from ${from}`);
      }
    }
    expect(offenders).toEqual([]);
  });

  it('builds common/ on no feature folder', () => {
    const offenders = sources
      .filter((s) => s.rel.startsWith('common/'))
      .flatMap((s) =>
        [...s.text.matchAll(/^(?:import|export)[^'"]*?from\s+['"](\.\.\/[^'"]+)['"]/gm)].map((m) => `${s.rel} imports ${m[1]}`),
      );
    expect(offenders).toEqual([]);
  });

  it('reads the environment in the configuration alone', () => {
    expect(
      sources
        .filter((s) => /process\.env/.test(s.text.replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '')) && s.rel !== 'config/config.ts')
        .map((s) => s.rel),
    ).toEqual([]);
  });
});
