// One flat config for the whole repository (`npm run lint`, also the first suite of `npm test`).
// Aim: catch real mistakes (unused code, floating promises of hooks, any-leaks), not argue style:
// formatting is left to the editor and reviewers.
import js from '@eslint/js';
import { defineConfig, globalIgnores } from 'eslint/config';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

export default defineConfig(
  globalIgnores([
    '**/dist/**',
    '**/node_modules/**',
    '**/coverage/**',
    '.data/**',
    '.test-data/**',
    'ui/e2e/artifacts/**',
    '**/*.tsbuildinfo',
  ]),

  js.configs.recommended,
  tseslint.configs.recommended,

  {
    name: 'beamwright/all',
    linterOptions: { reportUnusedDisableDirectives: 'warn' },
    rules: {
      // `_`-prefixed names are deliberately unused (positional parameters, destructured rest).
      '@typescript-eslint/no-unused-vars': ['error', {
        argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true,
      }],
      // Type-only imports keep the emitted ESM free of side-effect imports (isolatedModules).
      '@typescript-eslint/consistent-type-imports': ['error', { prefer: 'type-imports', fixStyle: 'inline-type-imports', disallowTypeAnnotations: false }],
      // NestJS modules and DTO classes are legitimately empty or decorator-only.
      '@typescript-eslint/no-extraneous-class': 'off',
      'no-empty': ['error', { allowEmptyCatch: true }],
      eqeqeq: ['error', 'always', { null: 'ignore' }],
      'prefer-const': 'error',
    },
  },

  // Node: scripts, configs, the api, link-core tests and benchmarks.
  {
    name: 'beamwright/node',
    files: ['scripts/**', '**/*.{mjs,cjs}', '**/*.config.{js,ts}', 'api/**', 'link-core/**', 'ui/e2e/**', 'ui/scripts/**', 'fixtures/**'],
    languageOptions: { globals: { ...globals.node } },
  },

  // NestJS relies on emitted decorator metadata: importing a class with `import type` silently
  // breaks dependency injection, so value imports of types are allowed in the api.
  {
    name: 'beamwright/api',
    files: ['api/**/*.ts'],
    rules: {
      '@typescript-eslint/consistent-type-imports': 'off',
    },
  },

  // Published tables (quadrature nodes, series coefficients) are copied with every printed digit,
  // even past double precision, so that they can be compared with the source line by line.
  {
    name: 'beamwright/link-core',
    files: ['link-core/src/**/*.ts'],
    rules: { 'no-loss-of-precision': 'off' },
  },

  // Browser code: the React app.
  {
    name: 'beamwright/ui',
    files: ['ui/src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },

  // Browser tests run in Node but hand callbacks to the page (page.evaluate), where window and
  // document exist.
  {
    name: 'beamwright/ui-e2e',
    files: ['ui/e2e/**'],
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
  },
);
