// One linter for the whole repository (run by `npm test`): typescript-eslint everywhere, angular-eslint's
// TypeScript and template rules for the dashboard. Formatting is Prettier's job, not ESLint's.
import { builtinModules } from 'node:module';
import js from '@eslint/js';
import angular from 'angular-eslint';
import tseslint from 'typescript-eslint';

// Import boundaries (DEVELOPERS.md, "Models, raw SQL and boundaries"): the arrows of the tree run one way.
const NODE_BUILTINS = builtinModules.filter((name) => !name.startsWith('_'));
const pureSharedRule = [
  'error',
  {
    paths: NODE_BUILTINS.map((name) => ({ name, message: 'shared/ is pure: no Node built-ins.' })),
    patterns: [
      { group: ['node:*'], message: 'shared/ is pure: no Node built-ins.' },
      {
        group: ['@angular/*', 'express', 'express/*', 'sequelize', 'sequelize/*', 'pg', 'pg/*', 'ws', 'mqtt'],
        message:
          'shared/ is pure: no framework, database or network packages (they belong to server/ or web/).',
      },
      { group: ['aedes', 'aedes-*', 'mqtt/*'], message: 'shared/ is pure: no broker packages.' },
      {
        group: ['**/server/**', '**/web/**', '**/simulator/**', '**/db/**'],
        message: 'shared/ imports nothing above it.',
      },
    ],
  },
];
// A feature folder of the dashboard (web/src/app/<feature>/…) imports core/ and its own folder only; a helper two
// features need moves to core/. Written per folder depth, since the rule sees the import as written.
const featureBoundary = (depth, severity) => {
  const up = '../'.repeat(depth);
  return {
    files: [`web/src/app/*/${'*/'.repeat(depth - 1)}*.ts`],
    ignores: ['web/src/app/core/**'],
    rules: {
      'no-restricted-imports': [
        severity,
        {
          patterns: [
            {
              group: [`${up}*`, `!${up}core`, `!${up}core/**`],
              message: 'A feature imports core/ and its own folder only; move a shared helper to core/.',
            },
          ],
        },
      ],
    },
  };
};
// Imports across features still to be moved to core/ (warned, not failed; new ones fail). None left: the list
// stays for a crossing that cannot move at once, and DEVELOPERS.md names it.
const KNOWN_FEATURE_CROSSINGS = [];
// Seeders go through models and services, never a server repository (the one arrow back up the tree). History
// made elsewhere goes in through a component's import service (readings-history-import, alert-history-import).
const seederBoundary = {
  files: ['db/seeders/**/*.ts'],
  rules: {
    'no-restricted-imports': [
      'error',
      {
        patterns: [
          {
            group: ['**/server/src/**/*-repository'],
            message: 'Seeders use models or services, not server repositories.',
          },
        ],
      },
    ],
  },
};

export default tseslint.config(
  { ignores: ['dist/**', '.angular/**', 'coverage/**', '.data/**', 'node_modules/**'] },
  {
    files: ['**/*.ts'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_' },
      ],
      // Node's and the browser's globals are known to TypeScript; ESLint's own check would only duplicate it.
      'no-undef': 'off',
    },
  },
  {
    files: ['web/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'cw', style: 'kebab-case' }],
      '@angular-eslint/directive-selector': [
        'error',
        { type: 'attribute', prefix: 'cw', style: 'camelCase' },
      ],
    },
  },
  {
    files: ['web/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
    // `x != null` is the one idiom that tests for both null and undefined in a template.
    rules: { '@angular-eslint/template/eqeqeq': ['error', { allowNullOrUndefined: true }] },
  },
  {
    files: ['**/*.mjs', '**/*.js'],
    extends: [js.configs.recommended],
    languageOptions: {
      globals: {
        process: 'readonly',
        console: 'readonly',
        setTimeout: 'readonly',
        clearTimeout: 'readonly',
        __dirname: 'readonly',
        module: 'writable',
        require: 'readonly',
        URL: 'readonly',
        Buffer: 'readonly',
        fetch: 'readonly',
      },
    },
  },
  { files: ['shared/**/*.ts'], rules: { 'no-restricted-imports': pureSharedRule } },
  featureBoundary(1, 'error'),
  featureBoundary(2, 'error'),
  featureBoundary(3, 'error'),
  featureBoundary(4, 'error'),
  ...[1, 2, 3, 4]
    .map((depth) => ({
      ...featureBoundary(depth, 'warn'),
      files: KNOWN_FEATURE_CROSSINGS.filter((file) => file.split('/').length === depth + 4),
    }))
    .filter((config) => config.files.length > 0),
  seederBoundary,
);
