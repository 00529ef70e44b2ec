// ESLint flat config: the rules of the code base and the boundaries between its parts.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import pluginVue from 'eslint-plugin-vue';
import globals from 'globals';

const FRAMEWORKS = ['vue', 'vue-router', 'pinia', 'quasar', 'konva', 'vue-konva', 'chart.js', 'vue-chartjs', 'express', 'sequelize', 'sqlite3', 'passport'];

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'data/**', 'tests/e2e/artifacts/**', 'test-results/**', 'playwright-report/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginVue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser, extraFileExtensions: ['.vue'] } },
  },
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser }, ecmaVersion: 2022, sourceType: 'module' },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'vue/multi-word-component-names': 'off',
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/html-self-closing': 'off',
      'vue/valid-v-slot': ['error', { allowModifiers: true }],
    },
  },
  {
    // The kinematics core is pure: no framework, no database, no DOM.
    files: ['shared/**/*.ts'],
    languageOptions: { globals: { ...globals.es2021 } },
    rules: {
      'no-restricted-imports': [
        'error',
        { paths: FRAMEWORKS.map((name) => ({ name, message: 'shared/ is a pure core: no framework imports.' })), patterns: ['@vue/*', '@quasar/*', 'express-*'] },
      ],
      'no-restricted-globals': ['error', 'window', 'document', 'navigator', 'localStorage', 'sessionStorage', 'HTMLElement', 'fetch'],
    },
  },
  {
    // The command line may use Node's own modules; it still must not reach into the app's frameworks.
    files: ['shared/cli/**/*.ts'],
    languageOptions: { globals: { ...globals.node } },
  },
);
