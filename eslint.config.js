// @ts-check
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import pluginQuery from '@tanstack/eslint-plugin-query';
import globals from 'globals';
import { existsSync, readdirSync } from 'node:fs';

/** Layer boundaries (DEVELOPERS.md, "Layout"): shared/ is pure and layered; features do not import each other. */
const featuresDir = new URL('./frontend/src/features', import.meta.url);
const featureNames = existsSync(featuresDir) ? readdirSync(featuresDir, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name) : [];

/**
 * The layers of shared/src, bottom first (DEVELOPERS.md, "Layers of shared/"): a folder imports
 * only folders of lower layers, never a peer of its own layer or anything above it.
 */
const SHARED_LAYERS = [['validation'], ['chemistry'], ['thermal'], ['schemas'], ['hazards'], ['calibration'], ['evaluation'], ['optimiser', 'lab-logs', 'reviews'], ['demo']];
const SHARED_PURITY = [
  { group: ['@/*', '**/frontend/**', '**/backend/**'], message: 'shared/ is pure: it imports nothing from frontend/ or backend/.' },
  { group: ['node:*', 'fs', 'path', 'http', 'pg', 'sequelize', 'express'], message: 'shared/ does no I/O.' },
];
const sharedLayerRules = SHARED_LAYERS.flatMap((layer, k) =>
  layer.map((folder) => {
    const above = SHARED_LAYERS.slice(k + 1).flat();
    const peers = layer.filter((f) => f !== folder);
    const forbidden = [...peers, ...above];
    return {
      files: [`shared/src/${folder}/**/*.ts`],
      ignores: ['**/*.test.ts', '**/__fixtures__/**'],
      rules: {
        'no-restricted-imports': ['error', {
          patterns: [
            ...SHARED_PURITY,
            ...(forbidden.length
              ? [{ group: forbidden.flatMap((f) => [`../${f}`, `../${f}/**`, `../../${f}`, `../../${f}/**`, `**/shared/src/${f}`, `**/shared/src/${f}/**`, `@shared/${f}`, `@shared/${f}/**`]), message: `shared/src/${folder} sits below ${forbidden.join(', ')} in the layer order ${SHARED_LAYERS.map((l) => l.join(' | ')).join(' → ')}: move the code down or call it from above.` }]
              : []),
          ],
        }],
      },
    };
  }),
);

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', '.test-artifacts/**', 'coverage/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node }, ecmaVersion: 2023, sourceType: 'module' },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_' }],
      '@typescript-eslint/no-non-null-assertion': 'off',
    },
  },
  {
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: SHARED_PURITY,
      }],
    },
  },
  ...sharedLayerRules,
  {
    files: ['frontend/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks, '@tanstack/query': pluginQuery },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...pluginQuery.configs.recommended.rules,
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/backend/**'], message: 'The front end talks to the back end over HTTP only.' }] }],
    },
  },
  // Each feature may import shared UI, lib and shared/, but never another feature.
  ...featureNames.map((feature) => ({
    files: [`frontend/src/features/${feature}/**/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['**/backend/**'], message: 'The front end talks to the back end over HTTP only.' },
          {
            group: featureNames.filter((f) => f !== feature).flatMap((f) => [`@/features/${f}`, `@/features/${f}/**`, `**/features/${f}`, `**/features/${f}/**`]),
            message: `Features do not import each other (${feature} → another feature): move shared code to src/components, src/lib or shared/.`,
          },
        ],
      }],
    },
  })),
  {
    files: ['backend/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['@/*', '**/frontend/**'], message: 'The back end does not import the front end.' }] }],
    },
  },
);
