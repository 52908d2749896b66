import js from '@eslint/js'
import tseslint from 'typescript-eslint'
import pluginVue from 'eslint-plugin-vue'
import prettier from 'eslint-config-prettier'
import globals from 'globals'

// The demo town is data the seed loads into the database: the app never imports it.
const noSeeds = {
  group: ['**/seeds/**', '**/seeds'],
  message: 'server/ and src/ must not import the demo seed: read what it stored instead',
}

export default tseslint.config(
  {
    ignores: [
      'dist/**',
      'node_modules/**',
      '.data/**',
      '.test-data*/**',
      '.bench-data*/**',
      '.bench-web*/**',
      '.cluster-data/**',
      'backups/**',
      'uploads/**',
      'dev-dist/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginVue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser } },
  },
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'vue/multi-word-component-names': 'off',
    },
  },
  {
    // The shared core is used by client and server alike: it may import neither.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/src/**', '**/server/**', 'express', 'knex', 'vue', 'quasar'],
              message: 'shared/ must not import client or server code',
            },
          ],
        },
      ],
    },
  },
  {
    // Schema modules build zod schemas as they load: a screen (or a plain shared module a screen uses)
    // takes words, lists and limits from shared/vocab and imports a schema module for its types only
    // (issue 14: zod was 174 kB of the signed-in shell). The estate forms build on the schemas themselves.
    files: ['src/**/*.ts', 'src/**/*.vue', 'shared/**/*.ts'],
    ignores: ['shared/schemas/**', 'src/components/estate/estate-form.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['zod', 'zod/*', '**/schemas/*', '**/schemas'],
              allowTypeImports: true,
              message:
                'import words, lists and limits from shared/vocab; a schema module only with `import type`',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['server/**/*.ts', 'src/**/*.ts', 'src/**/*.vue'],
    rules: { 'no-restricted-imports': ['error', { patterns: [noSeeds] }] },
  },
  {
    // The phone's store and the HTTP client sit below the screens: a form converts to their formats,
    // never the other way round. (A later block replaces the rule's options, so the seed ban is repeated.)
    files: ['src/offline/**/*.ts', 'src/api/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            noSeeds,
            {
              group: ['**/components/**', '**/components', '**/pages/**', '**/pages', '**/*.vue'],
              message: 'src/offline/ and src/api/ must not import components/ or pages/',
            },
          ],
        },
      ],
    },
  },
  prettier,
)
