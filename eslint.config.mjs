// ESLint over the whole repository: typescript-eslint's type-aware recommended rules, the React
// hooks rules in web/, and the import boundaries of DEVELOPERS.md. This file is the one definition
// of those boundaries; `npm run lint` (and the first step of `npm test`) enforces them.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import js from '@eslint/js';
import comments from '@eslint-community/eslint-plugin-eslint-comments/configs';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import { defineConfig } from 'eslint/config';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const ROOT = import.meta.dirname;

// Every web feature is a zone of its own: web/src/features/X imports nothing from web/src/features/Y.
const FEATURES = readdirSync(join(ROOT, 'web/src/features'), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

const boundaries = [
  {
    target: 'shared',
    from: ['api', 'web', 'tests'],
    message: 'shared imports nothing of ours: api and web import shared, not the reverse.',
  },
  { target: 'web', from: 'api', message: 'The web app talks to the API over HTTP only; shared types live in shared/.' },
  { target: 'api', from: 'web', message: 'The API never imports the web app; shared types live in shared/.' },
  {
    // The engine (specs aside: they may load the reference data and fixtures) reaches no other part of the API.
    target: 'api/src/rules/core/**/!(*.spec).ts',
    from: join(ROOT, 'api/src/**'),
    except: [join(ROOT, 'api/src/rules/core/**')],
    message: 'The rules core is plain functions over a recipe book: no module of the API outside api/src/rules/core.',
  },
  ...FEATURES.map((feature) => ({
    target: `web/src/features/${feature}`,
    from: 'web/src/features',
    except: [`./${feature}`],
    message: 'A web feature imports no other feature: move what both need to web/src/api, web/src/components or web/src/lib.',
  })),
];

export default defineConfig(
  {
    ignores: ['**/node_modules/', '**/dist/', '**/coverage/', '.data/', 'tests/artifacts/'],
  },
  {
    linterOptions: { reportUnusedDisableDirectives: 'error' },
  },
  js.configs.recommended,
  tseslint.configs.recommendedTypeChecked,
  comments.recommended,
  {
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: ROOT },
    },
    plugins: { 'import-x': importX },
    settings: {
      'import-x/extensions': ['.ts', '.tsx', '.js', '.mjs', '.cjs'],
      'import-x/external-module-folders': ['node_modules', 'node_modules/@types'],
      'import-x/resolver-next': [
        createTypeScriptImportResolver({
          alwaysTryTypes: true,
          noWarnOnMultipleProjects: true,
          project: [join(ROOT, '*/tsconfig.json'), join(ROOT, 'api/scripts/tsconfig.json')],
        }),
      ],
    },
    rules: {
      // An eslint-disable comment says why on the same line: `// eslint-disable-next-line rule -- reason`.
      '@eslint-community/eslint-comments/require-description': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      // React event handlers (onSubmit={form.handleSubmit(save)}) may return a promise; elsewhere a
      // promise where nothing waits for it is a finding, as are floating promises.
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }],
      // consistent-type-imports stays off: web/ already needs `import type` (verbatimModuleSyntax),
      // and in the API (emitDecoratorMetadata) a class imported for a constructor parameter's type
      // is the token Nest injects by, so it must stay a value import.
      // import-x's other rules (named, default, namespace…) repeat what tsc already checks.
      'import-x/no-restricted-paths': ['error', { basePath: ROOT, zones: boundaries }],
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-self-import': 'error',
    },
  },
  {
    // The engine's own files name no framework, database or file system.
    files: ['api/src/rules/core/**/*.ts'],
    ignores: ['**/*.spec.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(node:|fs$|fs/|path$|os$|child_process$|http|https$|net$|@nestjs/|sequelize|mariadb|fastify|@fastify/|umzug)',
              message: 'The rules core uses no framework, database or I/O: RulesService and rules/reference-data.ts do that for it.',
            },
          ],
        },
      ],
    },
  },
  {
    // shared is plain TypeScript with zod as its dependency; the label renderer (shared/src/labels)
    // adds bwip-js (barcodes), fontkit (font metrics) and pdfmake's types. Specs may use test libraries.
    files: ['shared/src/**/*.ts'],
    ignores: ['**/*.spec.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(?!(zod|bwip-js|fontkit|pdfmake/interfaces)$|\\.{1,2}/)',
              message: 'shared depends on zod, bwip-js, fontkit and pdfmake types only, and imports nothing of ours.',
            },
          ],
        },
      ],
    },
  },
  {
    // Tests read HTTP and JSON bodies as `any` and assert on them at once (`res.json().code`,
    // `expect.any(Number)`): the no-unsafe-* family reported each such line (about 230 in api/test
    // and tests/ when these rules came in) and none was a defect, since the assertion is the check.
    // In source they stay on.
    files: ['api/test/**', 'tests/**', '**/*.spec.ts', '**/*.test.{ts,tsx}', '**/testing/**'],
    rules: {
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
    },
  },
  {
    files: ['web/src/**/*.{ts,tsx}'],
    ...reactHooks.configs.flat['recommended-latest'],
    languageOptions: { globals: globals.browser },
  },
  {
    // A table's columns hold values of every type: TanStack Table's own ColumnDef takes `any` for the value.
    files: ['web/src/components/ui/virtual-data-table.tsx'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['**/*.{js,mjs,cjs}'],
    languageOptions: { globals: globals.node },
  },
  {
    files: ['api/jest.config.js'],
    languageOptions: { sourceType: 'commonjs' },
  },
);
