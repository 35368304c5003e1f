// One lint configuration for the whole repository (`npm run lint`).
import js from '@eslint/js';
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
