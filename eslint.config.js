// One flat config for the whole repository (`npm run lint`, also the first suite of `npm test`).
// Aim: catch real mistakes (unused code, floating promises of hooks, any-leaks), not argue style:
// formatting is left to the editor and reviewers.
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import { defineConfig, globalIgnores } from 'eslint/config';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

// Boundaries (DEVELOPERS.md, "Boundaries"): ui code flows shared -> features -> app routes, one
// feature never imports another, features never import app/, the ui never imports api code, and
// link-core imports nothing from api, ui or fixtures. Checked with ESLint's own no-restricted-imports,
// one block per feature (scripts/lib/lint-boundaries.test.mjs proves each zone fails a bad import).
const UI_FEATURES = readdirSync(new URL('./ui/src/features', import.meta.url), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);
const NO_API_CODE = { group: ['@beamwright/api', '@beamwright/api/*', '**/api/src/**'], message: 'The ui never imports api code: share contracts through @beamwright/link-core/contracts.' };
const NO_APP = { group: ['@/app', '@/app/**'], message: 'Features never import app/: routes compose features, not the other way round.' };
// Relative paths stay inside a feature; anything further away is imported through '@/…'.
const NO_FAR_RELATIVE = { regex: '^\\.\\./\\.\\./', message: "Import through '@/…' rather than climbing two folders: a relative path must not leave its feature." };
const featureBoundaries = UI_FEATURES.flatMap((feature) => [
  {
    name: `beamwright/boundaries/ui-feature-${feature}`,
    files: [`ui/src/features/${feature}/**/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          {
            group: ['@/features/*', `!@/features/${feature}`, '@/features/*/**', `!@/features/${feature}/**`],
            message: `A feature never imports another feature (this is ${feature}): move the shared piece to components/, lib/ or link-core, or compose the two in a route.`,
          },
          NO_APP,
          NO_API_CODE,
          NO_FAR_RELATIVE,
        ],
      }],
    },
  },
  {
    // a file at the feature's top level must not step out of it with '../'
    name: `beamwright/boundaries/ui-feature-${feature}-top`,
    files: [`ui/src/features/${feature}/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['@/features/*', `!@/features/${feature}`, '@/features/*/**', `!@/features/${feature}/**`], message: `A feature never imports another feature (this is ${feature}).` },
          NO_APP,
          NO_API_CODE,
          { regex: '^\\.\\./', message: "A relative path must not leave its feature: import through '@/…'." },
        ],
      }],
    },
  },
]);

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

  // The rest of the ui (shared components, lib, config, app routes) never reaches into the api.
  {
    name: 'beamwright/boundaries/ui',
    files: ['ui/src/**/*.{ts,tsx}'],
    ignores: ['ui/src/features/**'],
    rules: { 'no-restricted-imports': ['error', { patterns: [NO_API_CODE] }] },
  },
  {
    name: 'beamwright/boundaries/ui-shared',
    files: ['ui/src/components/**/*.{ts,tsx}', 'ui/src/lib/**/*.{ts,tsx}', 'ui/src/config/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [NO_API_CODE, { group: ['@/features/*', '@/features/**', '@/app', '@/app/**'], message: 'Shared ui code sits below features and routes: it imports neither.' }],
      }],
    },
  },
  ...featureBoundaries,

  // link-core is the bottom layer: it imports nothing from the api, the ui or the fixtures.
  {
    name: 'beamwright/boundaries/link-core',
    files: ['link-core/src/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [{
          group: ['@beamwright/api', '@beamwright/api/*', '@beamwright/ui', '@beamwright/ui/*', '**/api/**', '**/ui/**', '**/fixtures/**'],
          message: 'link-core is pure and at the bottom: no imports from the api, the ui or the fixtures (tests read fixtures from link-core/test/).',
        }],
      }],
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
