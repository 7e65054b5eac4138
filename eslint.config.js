// Lint rules, including the runtime boundaries: the engine and contract stay pure,
// the renderer never imports Electron or Node.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import vue from 'eslint-plugin-vue';
import vueParser from 'vue-eslint-parser';
import globals from 'globals';

const nodeBuiltins = ['node:*', 'fs', 'path', 'os', 'child_process', 'worker_threads', 'url', 'crypto'];
const rendererBoundary = {
  group: ['electron', ...nodeBuiltins, '**/electron/**'],
  message: 'The renderer reaches the engine only through the transport (EngineApi).',
};

export default tseslint.config(
  { ignores: ['out/**', 'dist/**', 'node_modules/**', 'release/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...vue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parser: vueParser, parserOptions: { parser: tseslint.parser, sourceType: 'module', extraFileExtensions: ['.vue'] } },
  },
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/html-self-closing': 'off',
      'vue/multi-word-component-names': 'off',
      'vue/html-indent': 'off',
      'vue/html-closing-bracket-newline': 'off',
      'vue/multiline-html-element-content-newline': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['electron/engine/**/*.ts', 'shared-types/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['electron', 'vue', 'pinia', 'zod', ...nodeBuiltins, '**/renderer/**', '**/handlers/**', '**/schemas/**'],
              message: 'The engine and the contract are pure TypeScript: no Electron, Node, DOM, Vue or schema imports.',
            },
          ],
        },
      ],
      'no-restricted-globals': ['error', 'window', 'document', 'process', 'require', 'localStorage', 'navigator'],
    },
  },
  {
    // The report's rendering: pure string building over the engine's data (the handler assembles, this writes).
    files: ['electron/report/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['electron', 'vue', 'pinia', 'zod', ...nodeBuiltins, '**/renderer/**', '**/handlers/**', '**/schemas/**'],
              message: 'The report renderer is pure TypeScript over engine data: no Electron, Node, DOM, schema or handler imports.',
            },
          ],
        },
      ],
      'no-restricted-globals': ['error', 'window', 'document', 'process', 'require', 'localStorage', 'navigator'],
    },
  },
  {
    files: ['renderer/**/*.ts', 'renderer/**/*.vue'],
    // The engine worker and the pool it starts run the handlers themselves (off the UI thread).
    ignores: ['renderer/transport/engine.worker.ts', 'renderer/transport/pool.worker.ts', 'renderer/transport/web-pool.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [rendererBoundary],
        },
      ],
    },
  },
  {
    // Views and components see the stores through their public face (`renderer/stores/index.ts`) only.
    files: ['renderer/App.vue', 'renderer/views/**/*.{ts,vue}', 'renderer/components/**/*.{ts,vue}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            rendererBoundary,
            { group: ['**/stores/*'], message: "Import stores from 'renderer/stores' (its index is the stores' public face), not from a store's own file." },
          ],
        },
      ],
    },
  },
);
