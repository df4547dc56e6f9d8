// @ts-check
/**
 * Lint: typescript-eslint's recommended rules, Astro and React hooks, and the
 * import rules that keep the layout honest (docs/decisions/003-domain-layout.md):
 * the engine imports nothing of the app, platform imports no domain, and a
 * domain reaches another only through its public index. Formatting is Prettier's.
 */
import js from '@eslint/js';
import prettier from 'eslint-config-prettier';
import astro from 'eslint-plugin-astro';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const DOMAIN_NAMES = ['briefs', 'review', 'quotes', 'payments', 'invoices', 'catalog', 'accounts', 'demo'];
const DOMAINS = `(${DOMAIN_NAMES.join('|')})`;

/**
 * An import rule as `no-restricted-imports` patterns, each a regular expression over the import's text.
 * @param {...[string, string]} patterns [regex, message]
 * @returns {import('eslint').Linter.RuleEntry}
 */
const restrict = (...patterns) => ['error', { patterns: patterns.map(([regex, message]) => ({ regex, message })) }];
/**
 * The same, where a type-only import is harmless (it leaves no code in the browser bundle).
 * @param {...[string, string]} patterns [regex, message]
 * @returns {import('eslint').Linter.RuleEntry}
 */
const restrictCode = (...patterns) => [
  'error',
  { patterns: patterns.map(([regex, message]) => ({ regex, message, allowTypeImports: true })) },
];

const LEAVES_ENGINE = 'The engine is pure: it imports nothing of the app.';

export default tseslint.config(
  { ignores: ['dist/', 'data/', 'drizzle/', '.astro/', 'node_modules/', 'src/lib/platform/db/auth-schema.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...astro.configs.recommended,
  {
    files: ['**/*.{ts,tsx,mts,mjs,js}'],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    // Scripts served as they are to the browser (no inline script runs under the page policy).
    files: ['public/**/*.js'],
    languageOptions: { globals: { ...globals.browser } },
  },
  {
    files: ['src/components/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      // The two classic hook rules; the compiler-era rules stay off until the islands are written for the compiler.
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
      'no-restricted-imports': restrictCode([
        '\\.server$|/platform/(db|auth|mail|http|rate-limit|engine-pool|uploads|pdf|config|log|links)',
        'Browser code may not import server-only modules.',
      ]),
    },
  },
  {
    files: ['src/lib/engine/*.ts'],
    rules: { 'no-restricted-imports': restrict(['^~/|^\\.\\./', LEAVES_ENGINE]) },
  },
  {
    files: ['src/lib/engine/*/**/*.ts'],
    rules: { 'no-restricted-imports': restrict(['^~/|^\\.\\./\\.\\./', LEAVES_ENGINE]) },
  },
  {
    files: ['src/lib/platform/**/*.ts'],
    ignores: ['src/lib/platform/db/schema.ts'],
    rules: {
      'no-restricted-imports': restrict([
        `^(~/lib/|(\\.\\./)+)${DOMAINS}(/|$)`,
        'Platform serves every domain and imports none: pass what it needs in from the caller.',
      ]),
    },
  },
  {
    files: [`src/lib/{${DOMAIN_NAMES.join(',')}}/**/*.ts`],
    rules: {
      'no-restricted-imports': restrict(
        [
          `^~/lib/${DOMAINS}/(?!index\\.server$)`,
          "Another domain is reached through its public index: '~/lib/<domain>' or '~/lib/<domain>/index.server'.",
        ],
        [
          `^\\.\\./${DOMAINS}(/|$)`,
          "Another domain is reached through its public index: '~/lib/<domain>' or '~/lib/<domain>/index.server'.",
        ],
      ),
    },
  },
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  prettier,
);
