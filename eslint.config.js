// ESLint's flat config cannot live in package.json, hence this file.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';

const nodeModules = [
  'node:*',
  'fs',
  'path',
  'os',
  'child_process',
  'worker_threads',
  'url',
  'crypto',
];

export default tseslint.config(
  { ignores: ['dist/', 'node_modules/', 'notebooks/', '**/*.ipynb', 'coverage/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
    },
  },
  {
    files: ['**/*.mjs', '**/*.js'],
    languageOptions: {
      globals: {
        process: 'readonly',
        console: 'readonly',
        URL: 'readonly',
        performance: 'readonly',
      },
    },
  },
  {
    // The core runs in browsers and worker threads too: no Node imports there: see DEVELOPERS.md, Layout.
    files: [
      'src/climate/**',
      'src/drainage/**',
      'src/engine/**',
      'src/nitrate/**',
      'src/scenarios/**',
      'src/units/**',
      'src/explorer/browser/**',
    ],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: nodeModules, message: 'The core must not import Node modules.' }] },
      ],
    },
  },
);
