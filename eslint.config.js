// ESLint flat config: the rules of the code base and the boundaries between its parts.
// Each boundary is a `no-restricted-imports` rule on paths (the import as written), so crossing one fails `npm run lint`.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import pluginVue from 'eslint-plugin-vue';
import prettier from 'eslint-config-prettier';
import globals from 'globals';

/** Packages of the client and the server: none of them may enter the pure core in shared/. */
const FRAMEWORKS = [
  'vue',
  'vue-router',
  'pinia',
  'quasar',
  'konva',
  'vue-konva',
  'chart.js',
  'vue-chartjs',
  'express',
  'express-session',
  'sequelize',
  'sqlite3',
  'pg',
  'passport',
  'passport-local',
  'multer',
  'nodemailer',
];
/** Packages only the browser client uses: the server never imports them. */
const CLIENT_PACKAGES = ['vue', 'vue-router', 'pinia', 'quasar', 'konva', 'vue-konva', 'chart.js', 'vue-chartjs'];

/** One import boundary: a package name, a package prefix, or a path pattern (a regular expression on the import). */
const pkg = (name, message) => ({ name, message });
const under = (regex, message) => ({ regex, message });

const SHARED_IS_PURE = 'shared/ is the pure core: no framework, no database, no DOM.';
const sharedRules = {
  paths: FRAMEWORKS.map((name) => pkg(name, SHARED_IS_PURE)),
  patterns: [
    under('^(@vue|@quasar|@vueuse)/', SHARED_IS_PURE),
    under('^(express|sequelize|konva)(-|/)', SHARED_IS_PURE),
    under('(^|/)(src|server)(/|$)', 'shared/ is used by the client and the server and imports neither.'),
  ],
};

/** A rule that joins the lists of several boundaries (a later config object would otherwise replace an earlier one's). */
function restrict(...groups) {
  return ['error', { paths: groups.flatMap((g) => g.paths ?? []), patterns: groups.flatMap((g) => g.patterns ?? []) }];
}

export default tseslint.config(
  {
    ignores: [
      'dist/**',
      'node_modules/**',
      'data/**',
      'tests/e2e/artifacts/**',
      'test-results/**',
      'playwright-report/**',
    ],
  },
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
      'vue/valid-v-slot': ['error', { allowModifiers: true }],
    },
  },
  {
    // The kinematics core and the schemas are pure: no framework, no database, no DOM, neither side of the app.
    files: ['shared/**/*.ts'],
    languageOptions: { globals: { ...globals.es2021 } },
    rules: {
      'no-restricted-imports': restrict(sharedRules),
      'no-restricted-globals': [
        'error',
        'window',
        'document',
        'navigator',
        'localStorage',
        'sessionStorage',
        'HTMLElement',
        'fetch',
      ],
    },
  },
  {
    // The schemas describe data; the kinematics computes from it. The dependency runs one way only.
    files: ['shared/schema/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict(sharedRules, {
        patterns: [
          under('(^|/)kinematics(/|$)', 'shared/schema never imports the kinematics (it runs the other way).'),
        ],
      }),
    },
  },
  {
    // The kinematics index is what the sweep worker and the command line load: it re-exports no zod value, so the
    // worker stays free of zod (type-only re-exports cost nothing at run time).
    files: ['shared/kinematics/index.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          paths: [{ name: 'zod', message: 'The kinematics index re-exports no zod.', allowTypeImports: true }],
          patterns: [
            {
              regex: '(^|/)schema/(sketch|errors|sketchRequests|boardFields|accounts)$',
              message: 'The kinematics index re-exports no zod schema: import it from shared/schema.',
              allowTypeImports: true,
            },
          ],
        },
      ],
    },
  },
  {
    // The command line may use Node's own modules; it still must not reach into the app's frameworks.
    files: ['shared/cli/**/*.ts'],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    // The browser client talks to the server over HTTP only.
    files: ['src/**/*.ts', 'src/**/*.vue'],
    rules: {
      'no-restricted-imports': restrict({
        patterns: [
          under('(^|/)server(/|$)', 'The client never imports the server: use the API (src/api) and shared/.'),
        ],
      }),
    },
  },
  {
    // Components and pages render and dispatch: they reach data through stores and the API, never a model.
    files: ['src/components/**/*.vue', 'src/pages/**/*.vue', 'src/layouts/**/*.vue'],
    rules: {
      'no-restricted-imports': restrict({
        patterns: [
          under('(^|/)server(/|$)', 'The client never imports the server: use the API (src/api) and shared/.'),
          under('(^|/)models(/|$)', 'Components never import models: read a store.'),
        ],
      }),
    },
  },
  {
    // The server never imports the client or its packages.
    files: ['server/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict({
        paths: CLIENT_PACKAGES.map((name) => pkg(name, 'The server never imports a client package.')),
        patterns: [under('(^|/)src(/|$)', 'The server never imports the client.')],
      }),
    },
  },
  prettier,
);
