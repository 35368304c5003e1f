// One lint configuration for the whole repository (`npm run lint`).
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import { createNodeResolver, importX } from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const frameworkAndIo = [
  {
    group: ['react', 'react-*', '@mantine/*', '@tanstack/*', '@nestjs/*', 'sequelize*', 'pg', 'node:*'],
    message: 'shared/src is pure domain code: no framework or I/O imports.',
  },
  {
    group: ['fs', 'path', 'child_process', 'worker_threads', 'os', 'http', 'https', 'crypto'],
    message: 'shared/src is pure domain code: no Node I/O modules.',
  },
];

// Layers of shared/src, lowest first: a folder may import only the folders listed for it (and itself).
// `sim` is the netlist-level engine and imports nothing from the domain; the test
// shared/test/architecture/import-layers.test.ts checks the whole folder graph for cycles.
const sharedLayers = {
  errors: [],
  units: ['errors'],
  methods: [],
  sim: ['errors'],
  designs: ['errors', 'units', 'methods'],
  safety: ['errors', 'units', 'methods', 'designs'],
  transformer: ['errors', 'units', 'methods', 'designs', 'safety'],
  multiplier: ['errors', 'units', 'methods', 'designs', 'safety'],
  driver: ['errors', 'units', 'methods', 'designs', 'safety', 'multiplier', 'transformer'],
  circuits: ['errors', 'units', 'methods', 'designs', 'multiplier', 'driver', 'sim', 'transformer'],
  analysis: ['errors', 'units', 'methods', 'designs', 'safety', 'multiplier', 'driver', 'transformer'],
  runs: [
    'errors',
    'units',
    'methods',
    'designs',
    'safety',
    'multiplier',
    'driver',
    'sim',
    'circuits',
    'analysis',
    'transformer',
  ],
};
const sharedZones = Object.entries(sharedLayers).map(([folder, allowed]) => ({
  target: `./shared/src/${folder}`,
  from: './shared/src',
  except: [folder, ...allowed].map((f) => `./${f}`),
  message: `shared/src/${folder} may import only ${[folder, ...allowed].join(', ')}.`,
}));

// Client features never import each other; a route composes them. Shared UI, lib and config import no feature
// and no route.
const clientFeatures = readdirSync(new URL('./client/src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);
const clientZones = [
  ...clientFeatures.map((feature) => ({
    target: `./client/src/features/${feature}`,
    from: './client/src/features',
    except: [`./${feature}`],
    message: 'Features do not import each other; compose them in a route (client/src/app).',
  })),
  ...['features', 'components', 'lib', 'config'].map((folder) => ({
    target: `./client/src/${folder}`,
    from: './client/src/app',
    message: 'Only the app imports routes.',
  })),
  ...['components', 'lib', 'config'].map((folder) => ({
    target: `./client/src/${folder}`,
    from: './client/src/features',
    message: 'Feature-agnostic code imports no feature.',
  })),
];

export default tseslint.config(
  { ignores: ['**/node_modules/**', '**/dist/**', '.data/**', '**/coverage/**', 'client/test-results/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  {
    files: ['shared/**/*.ts', 'client/src/**/*.{ts,tsx}', 'server/src/**/*.ts'],
    plugins: { 'import-x': importX },
    settings: {
      'import-x/resolver-next': [
        createNodeResolver({
          extensions: ['.ts', '.tsx', '.js', '.mjs', '.cjs', '.json'],
          conditionNames: ['source', 'import', 'require', 'default'],
        }),
      ],
    },
    rules: { 'import-x/no-cycle': ['error', { ignoreExternal: true }] },
  },
  {
    files: ['shared/src/**/*.ts'],
    ignores: ['shared/src/**/*.test.ts'],
    rules: { 'import-x/no-restricted-paths': ['error', { zones: sharedZones }] },
  },
  {
    files: ['client/src/**/*.{ts,tsx}'],
    rules: { 'import-x/no-restricted-paths': ['error', { zones: clientZones }] },
  },
  // Type-aware rules on the product code (tests keep the syntactic set: their response bodies and mocks are untyped).
  {
    files: ['shared/src/**/*.ts', 'shared/cli/**/*.ts', 'server/src/**/*.ts', 'client/src/**/*.{ts,tsx}'],
    ignores: ['**/*.test.{ts,tsx}', 'client/src/testing/**'],
    extends: [tseslint.configs.recommendedTypeCheckedOnly],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      // React Router loaders throw the Response of redirect(); a caught error of unknown type is rethrown as is.
      '@typescript-eslint/only-throw-error': [
        'error',
        { allow: [{ from: 'lib', name: 'Response' }], allowThrowingUnknown: true },
      ],
    },
  },
  {
    files: ['**/*.cjs'],
    languageOptions: { sourceType: 'commonjs' },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    files: ['shared/src/**/*.ts'],
    ignores: ['shared/src/**/*.test.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: frameworkAndIo }],
      'no-restricted-properties': [
        'error',
        { object: 'Date', property: 'now', message: 'Time arrives as an argument in shared/src.' },
        { object: 'Math', property: 'random', message: 'Random seeds arrive as arguments in shared/src.' },
      ],
      'no-restricted-globals': ['error', 'fetch', 'process', 'require'],
    },
  },
  {
    files: ['client/src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['@ladderwright/shared/src/*', '../../shared/*', '@nestjs/*', 'sequelize*'],
              message: 'Import shared code through its public subpaths.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['server/src/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['@ladderwright/shared/src/*', '../../shared/*', 'react', '@mantine/*'],
              message: 'Import shared code through its public subpaths.',
            },
          ],
        },
      ],
    },
  },
);
