import js from '@eslint/js';
import globals from 'globals';
import tseslint from 'typescript-eslint';
import pluginVue from 'eslint-plugin-vue';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'data/**', 'coverage/**', 'tests/.artifacts/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginVue.configs['flat/recommended'],
  pluginVue.configs['no-layout-rules'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser } },
  },
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'vue/multi-word-component-names': 'off',
    },
  },
  {
    // The engine and shared schemas stay pure: no UI, server, database or DOM code.
    files: ['shared/**/*.ts'],
    languageOptions: { globals: {} },
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['vue', 'vue/*', '@vue/*', 'pinia', 'naive-ui', 'express', 'knex', 'better-sqlite3', 'node:*'], message: 'shared/ stays pure.' },
            { group: ['**/src/**', '**/server/**', '**/db/**'], message: 'shared/ imports nothing from the app or server.' },
          ],
        },
      ],
    },
  },
  {
    // The client, the server and the database code reach the engine through its two declared entries only.
    files: ['src/**/*.{ts,vue}', 'server/**/*.ts', 'db/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '(^@shared|/shared)/engine/(?!(index|documents)$).+',
              message: 'Import the engine from @shared/engine (index.ts) or @shared/engine/documents only.',
            },
          ],
        },
      ],
    },
  },
);
