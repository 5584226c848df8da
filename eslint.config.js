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

/**
 * The folders of src/ from the bottom layer up: a folder may import its own and lower layers
 * only (DEVELOPERS.md, Layout). `units` shares the bottom with src/errors.ts and src/version.ts.
 */
const LAYERS = [
  'units',
  'climate',
  'drainage',
  'engine',
  'nitrate',
  'scenarios',
  'io',
  'report',
  'explorer',
  'cli',
];

/** Folders (and files) that must run in a browser or a worker: no Node modules. */
const PURE = [
  'src/units/**',
  'src/climate/**',
  'src/drainage/**',
  'src/engine/**',
  'src/nitrate/**',
  'src/scenarios/**',
  'src/explorer/browser/**',
  'src/report/charts.ts',
  'src/report/charts/**',
  'src/report/chartTheme.ts',
  'src/report/chartSeries.ts',
  'src/report/sweepCharts.ts',
  'src/report/fitCharts.ts',
  'src/report/systemCharts.ts',
  'src/report/reportData.ts',
  'src/report/fitSummary.ts',
  'src/report/summary.ts',
  'src/report/format.ts',
  'src/report/units.ts',
  'src/report/types.ts',
];

/** One no-restricted-imports setting per layer: higher layers banned, plus Node in pure files. */
function layerRules() {
  const nodeBan = { group: nodeModules, message: 'The core must not import Node modules.' };
  const configs = [];
  LAYERS.forEach((layer, i) => {
    const higher = LAYERS.slice(i + 1);
    const upBan = higher.length
      ? [
          {
            regex: `^(\\.\\./)+(${higher.join('|')})/`,
            message: `${layer}/ is below ${higher.join(', ')} and must not import them (DEVELOPERS.md, Layout).`,
          },
        ]
      : [];
    const files = [`src/${layer}/**`];
    const pure = PURE.filter((p) => p.startsWith(`src/${layer}/`));
    // Pure files of the layer: both bans; the rest of the layer: the layer ban only.
    if (upBan.length) {
      configs.push({
        files,
        ignores: pure,
        rules: { 'no-restricted-imports': ['error', { patterns: upBan }] },
      });
    }
    if (pure.length) {
      configs.push({
        files: pure,
        rules: { 'no-restricted-imports': ['error', { patterns: [nodeBan, ...upBan] }] },
      });
    }
  });
  return configs;
}

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
  ...layerRules(),
);
