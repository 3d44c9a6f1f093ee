// The gates that run before any test: lint (ESLint with eslint.config.mjs), format (Prettier
// --check) and a full type-check (tsc's diagnostics for every tsconfig below). Each passes only
// with no finding at all.
//
// Type-aware lint and the type-check need the same TypeScript programs, and building them is most
// of what both cost, so each part below builds its programs once and hands them to both: the web
// app (the heaviest program) in one process and everything else in another, one per core, beside
// Prettier. The rules themselves all live in eslint.config.mjs; `npm run lint` runs the same rules
// through ESLint's project service.
//
//   node api/scripts/lib/checks.mjs [lint|format|typecheck ...]   (all three when none is named)
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ROOT } from './workspace.mjs';

/**
 * Every tsconfig that is type-checked, in two parts. Within a part a file that several programs
 * hold is linted with the first (shared's own options before api's; the scripts' before tests').
 * @type {Record<string, { projects: string[]; lint: string[]; ignore: string[] }>}
 */
export const PARTS = {
  web: { projects: ['web/tsconfig.json'], lint: ['web'], ignore: [] },
  rest: {
    projects: ['tsconfig.json', 'shared/tsconfig.json', 'api/tsconfig.json', 'api/scripts/tsconfig.json', 'tests/tsconfig.json'],
    lint: ['.'],
    ignore: ['web/'],
  },
};

export const GATES = /** @type {const} */ (['lint', 'format', 'typecheck']);
/** @typedef {(typeof GATES)[number]} Gate */
/**
 * What a gate found in one part: `items` names each finding once (a file that two programs hold is
 * checked twice, its diagnostics counted once), `text` is what to print besides.
 * @typedef {{ gate: Gate; items: string[]; text: string }} GateResult
 */

/** @type {Record<Gate, string>} */
const LABELS = { lint: 'lint (eslint)', format: 'format (prettier --check)', typecheck: 'type-check (tsc)' };

/**
 * One part's programs, built once, then its type-check and its lint.
 * @param {string} name
 * @param {Gate[]} gates
 * @returns {Promise<GateResult[]>}
 */
async function runPart(name, gates) {
  const part = PARTS[name];
  if (!part) throw new Error(`No part called ${name}.`);
  const ts = (await import('typescript')).default;
  /** @type {import('typescript').FormatDiagnosticsHost} */
  const host = { getCanonicalFileName: (f) => f, getCurrentDirectory: () => ROOT, getNewLine: () => '\n' };
  /** @type {import('typescript').Diagnostic[]} */
  const configErrors = [];
  const programs = part.projects.map((project) => {
    const parsed = ts.getParsedCommandLineOfConfigFile(join(ROOT, project), undefined, {
      ...ts.sys,
      onUnRecoverableConfigFileDiagnostic: (d) => configErrors.push(d),
    });
    if (!parsed) throw new Error(`${project} could not be read:\n${ts.formatDiagnostics(configErrors, host)}`);
    return ts.createProgram({
      rootNames: parsed.fileNames,
      options: parsed.options,
      projectReferences: parsed.projectReferences,
      configFileParsingDiagnostics: parsed.errors,
    });
  });

  /** @type {GateResult[]} */
  const results = [];
  if (gates.includes('typecheck')) {
    const diagnostics = [...configErrors, ...programs.flatMap((p) => ts.getPreEmitDiagnostics(p))];
    const items = [...new Set(diagnostics.map((d) => ts.formatDiagnostics([d], host).trimEnd()))];
    results.push({ gate: 'typecheck', items, text: '' });
  }
  if (gates.includes('lint')) {
    const { ESLint } = await import('eslint');
    const eslint = new ESLint({
      cwd: ROOT,
      ignorePatterns: part.ignore,
      overrideConfig: { languageOptions: { parserOptions: { projectService: false, programs } } },
    });
    const linted = await eslint.lintFiles(part.lint);
    const items = linted.flatMap((r) => r.messages.map((m) => `${r.filePath}:${m.line}:${m.column} ${m.ruleId ?? m.message}`));
    const text = items.length > 0 ? await (await eslint.loadFormatter('stylish')).format(linted) : '';
    results.push({ gate: 'lint', items, text: String(text) });
  }
  return results;
}

/**
 * Runs a child and collects what it prints.
 * @param {string[]} args
 * @returns {Promise<{ code: number; output: string }>}
 */
function collect(args) {
  return new Promise((resolve) => {
    // Plain text: the output is counted and printed later. (FORCE_COLOR=0 would turn colour on in picocolors.)
    /** @type {NodeJS.ProcessEnv} */
    const env = { ...process.env, NO_COLOR: '1' };
    delete env.FORCE_COLOR;
    const child = spawn(process.execPath, args, { cwd: ROOT, env });
    let output = '';
    child.stdout.on('data', (b) => (output += String(b)));
    child.stderr.on('data', (b) => (output += String(b)));
    child.on('close', (code) => resolve({ code: code ?? 1, output }));
  });
}

/**
 * Prettier's check over the whole repository (.prettierignore says what is left out).
 * @returns {Promise<GateResult>}
 */
async function formatCheck() {
  const { code, output } = await collect([join(ROOT, 'node_modules/prettier/bin/prettier.cjs'), '--check', '.']);
  const unformatted = output.split('\n').filter((l) => /^\[(warn|error)\] /.test(l) && !l.includes('Code style issues'));
  // A failed check with no file named (Prettier could not run) is still a finding.
  const items = code === 0 ? [] : unformatted.length > 0 ? unformatted : [output.trim() || `prettier exited with ${code}`];
  return { gate: 'format', items, text: code === 0 ? '' : output };
}

/**
 * Runs the gates named (the parts in parallel, one process each) and prints each gate's findings.
 * @param {Gate[]} gates
 * @returns {Promise<{ gate: Gate; label: string; passed: boolean; findings: number }[]>}
 */
export async function runChecks(gates = [...GATES]) {
  const started = Date.now();
  const scratch = mkdtempSync(join(tmpdir(), 'crumbproof-checks-'));
  const self = fileURLToPath(import.meta.url);
  const typed = gates.filter((g) => g === 'lint' || g === 'typecheck');
  try {
    const parts = typed.length
      ? Object.keys(PARTS).map(async (name) => {
          const out = join(scratch, `${name}.json`);
          const { code, output } = await collect([self, '--part', name, '--out', out, ...typed]);
          if (code !== 0) {
            // A part that could not finish counts as a finding of each gate it was to run.
            const stopped = `The ${name} part of the checks stopped (exit ${code}):\n${output.trimEnd()}`;
            return typed.map((gate) => ({ gate, items: [stopped], text: gate === typed[0] ? stopped : '' }));
          }
          /** @type {unknown} */
          const results = JSON.parse(readFileSync(out, 'utf8'));
          return /** @type {GateResult[]} */ (results);
        })
      : [];
    const all = (await Promise.all([...parts, gates.includes('format') ? formatCheck().then((r) => [r]) : Promise.resolve([])])).flat();
    const results = gates.map((gate) => {
      const mine = all.filter((r) => r.gate === gate);
      const items = [...new Set(mine.flatMap((r) => r.items))];
      const findings = items.length;
      const label = LABELS[gate];
      console.log(`\n${label}: ${findings === 0 ? 'no findings' : `${findings} finding${findings === 1 ? '' : 's'}`}`);
      for (const r of mine) if (r.text.trim()) console.log(r.text.trimEnd());
      if (gate === 'typecheck') for (const item of items) console.log(item);
      return { gate, label, passed: findings === 0, findings };
    });
    console.log(`\nChecks took ${Math.round((Date.now() - started) / 1000)} s.`);
    return results;
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

const isMain = process.argv[1] && relative(process.argv[1], fileURLToPath(import.meta.url)) === '';
if (isMain) {
  const args = process.argv.slice(2);
  /** @param {string} flag */
  const at = (flag) => {
    const i = args.indexOf(flag);
    return i >= 0 ? args.splice(i, 2)[1] : undefined;
  };
  const part = at('--part');
  const out = at('--out');
  const unknown = args.filter((a) => !(/** @type {readonly string[]} */ (GATES).includes(a)));
  if (unknown.length) {
    console.error(`Unknown gate ${unknown.join(', ')}: name lint, format or typecheck (or none for all three).`);
    process.exit(2);
  }
  const gates = /** @type {Gate[]} */ (args.length ? args : [...GATES]);
  if (part && out) {
    writeFileSync(out, JSON.stringify(await runPart(part, gates)));
  } else {
    const results = await runChecks(gates);
    process.exit(results.every((r) => r.passed) ? 0 : 1);
  }
}
