// ESLint flat config: typescript-eslint for every part of the repo, angular-eslint for the console.
import js from '@eslint/js';
import angular from 'angular-eslint';
import globals from 'globals';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  {
    ignores: [
      'dist/',
      'node_modules/',
      '.angular/',
      'coverage/',
      'test-artifacts/',
      'out-tsc/',
      '**/*.generated.js',
    ],
  },
  {
    files: ['**/*.ts', '**/*.js', '**/*.mjs'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
  },
  {
    files: ['**/*.ts', '**/*.js', '**/*.mjs'],
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/consistent-type-imports': 'error',
      eqeqeq: ['error', 'always'],
      'no-console': 'error',
    },
  },
  {
    files: ['**/*.js', '**/*.mjs'],
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    // Formula YAML is parsed only through parseYamlWithinLimits, which refuses a text larger or
    // deeper than a formula before the parser builds anything; specs parse their own fixed text.
    files: ['**/*.ts', '**/*.js', '**/*.mjs'],
    ignores: ['shared/formula/parse-yaml.ts', '**/*.spec.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'yaml',
              importNames: [
                'default',
                'parse',
                'parseDocument',
                'parseAllDocuments',
                'Parser',
                'Composer',
              ],
              message:
                'parse formula YAML with parseYamlWithinLimits (shared/formula/parse-yaml.ts), which checks its size and nesting first',
            },
          ],
        },
      ],
    },
  },
  // Boundaries between the parts. The import-boundary rule is typescript-eslint's, so that it
  // stands beside the core rule's YAML restriction above instead of replacing it (flat config
  // keeps one set of options per rule and file). Only static imports are checked, not import().
  {
    // The core is pure and stands alone: the server, the command and the console build on it,
    // never the other way round. Specs may check it against the build scripts.
    files: ['shared/**/*.ts', 'shared/**/*.js'],
    ignores: ['**/*.spec.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(\\.\\./)+(server|cli|src|tests|scripts|bench|bin)/',
              message:
                'shared/ imports nothing outside itself; move what both sides need into shared/',
            },
          ],
        },
      ],
    },
  },
  {
    // The console talks to the back end over HTTP only; the contract's shapes come from shared/api
    // as types, so no server code lands in the browser bundle.
    files: ['src/**/*.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(\\.\\./)+(server|cli|tests|scripts)/',
              message:
                'the console imports shared/ and nothing of server/ or cli/; it reaches the server through the API',
            },
            {
              regex: '^(\\.\\./)+shared/api/',
              allowTypeImports: true,
              message:
                'the console imports the API shapes of shared/api/ as types only (import type)',
            },
          ],
        },
      ],
    },
  },
  {
    // The command reaches the back end only through its door, server/records/records.ts: the same
    // record keeping as the API, with nothing of Express, the routers or HTTP.
    files: ['cli/**/*.ts'],
    ignores: ['**/*.spec.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(\\.\\./)+(server/(?!records/records\\.ts$)|src/)',
              message: 'cli/ reaches the back end only through its door, server/records/records.ts',
            },
          ],
        },
      ],
    },
  },
  {
    // The console: Angular's own rules; values and types are imported as Angular's tooling writes them.
    files: ['src/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      '@typescript-eslint/consistent-type-imports': 'off',
      '@angular-eslint/directive-selector': [
        'error',
        { type: 'attribute', prefix: 'app', style: 'camelCase' },
      ],
      '@angular-eslint/component-selector': [
        'error',
        { type: 'element', prefix: 'app', style: 'kebab-case' },
      ],
      '@angular-eslint/prefer-on-push-component-change-detection': 'error',
    },
  },
  {
    files: ['src/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  {
    files: ['src/main.ts'],
    rules: { 'no-console': 'off' },
  },
);
