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
