// The lint rules of Dubito: the recommended JavaScript and TypeScript rules (syntax only, no type
// information, so a run stays fast), the rules of hooks, and the import boundaries between the
// parts of the product. DEVELOPERS.md ("Rules the linter enforces") explains each boundary.
import js from '@eslint/js';
import boundaries from 'eslint-plugin-boundaries';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const TS_AND_JS = ['**/*.{ts,tsx,mts,cts,js,mjs,cjs}'];

/**
 * The parts of the product, by folder. The first descriptor that matches a file names its part;
 * `partialMatch: false` anchors every pattern at the repository root.
 */
const PARTS = [
  { type: 'feature', pattern: 'src/features/*', capture: ['feature'], partialMatch: false },
  { type: 'client-budget', pattern: 'src/budget', partialMatch: false },
  { type: 'client', pattern: 'src', partialMatch: false },
  { type: 'shared', pattern: 'shared', partialMatch: false },
  { type: 'server', pattern: 'server', partialMatch: false },
  { type: 'cli', pattern: 'cli', partialMatch: false },
];

const local = (type) => ({ to: { element: { type } } });
const localTypes = (types) => ({ to: { element: { types: { anyOf: types } } } });
const anyPackage = { to: { module: { origin: 'external' } } };
const nodeBuiltin = { to: { module: { origin: 'core' } } };

/** Who may import whom; everything not named here is allowed. */
const BOUNDARY_POLICIES = [
  {
    from: { element: { type: 'feature' } },
    disallow: { to: { element: { type: 'feature', captured: { feature: '!{{ from.element.captured.feature }}' } } } },
    message: 'a feature never imports another feature ({{ from.element.captured.feature }} → {{ to.element.captured.feature }}): pass it in through a slot from src/app',
  },
  {
    from: { element: { type: 'client-budget' } },
    disallow: local('feature'),
    message: 'src/budget is used by every feature and never imports one',
  },
  {
    from: { element: { types: { anyOf: ['feature', 'client-budget', 'client'] } } },
    disallow: localTypes(['server', 'cli']),
    message: 'the client never imports the server or the command line: what both need lives in shared/',
  },
  {
    from: { element: { type: 'shared' } },
    disallow: localTypes(['feature', 'client-budget', 'client', 'server', 'cli']),
    message: 'shared/ runs in the browser, the server and the command line: it imports only shared/ and plain packages',
  },
  {
    from: { element: { type: 'shared' } },
    disallow: nodeBuiltin,
    message: 'shared/ runs in the browser too: no Node built-in modules',
  },
  {
    from: { element: { type: 'server' } },
    disallow: localTypes(['feature', 'client-budget', 'client']),
    message: 'the server never imports the client: what both need lives in shared/',
  },
  {
    from: { element: { type: 'cli' } },
    disallow: localTypes(['feature', 'client-budget', 'client', 'server']),
    message: 'the command line imports only shared/ and Node',
  },
  {
    from: { element: { type: 'cli' } },
    disallow: anyPackage,
    message: 'the command line imports only shared/ and Node: a package it needs comes through shared/',
  },
];

export default tseslint.config(
  {
    ignores: ['node_modules/', 'dist/', 'cli/dist/', 'server/dist/', 'data/', 'tests/.artifacts/', '.tsbuild/', '.vite/', 'drizzle/meta/'],
  },
  { files: TS_AND_JS, ...js.configs.recommended },
  ...tseslint.configs.recommended,
  {
    files: TS_AND_JS,
    languageOptions: { ecmaVersion: 2023, sourceType: 'module' },
    rules: {
      // `_name` marks a parameter kept for its position; TypeScript's noUnusedLocals checks the rest too.
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      // the rules of hooks and the React Compiler's checks (purity, refs, state set in effects)
      ...reactHooks.configs['recommended-latest'].rules,
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  {
    files: ['server/**', 'cli/**', 'bench/**', 'tests/**', '*.config.{ts,js,mjs}', '.ci/**'],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    files: ['src/**/*.worker.ts'],
    languageOptions: { globals: { ...globals.worker } },
  },
  {
    files: ['src/**', 'shared/**', 'server/**', 'cli/**'],
    plugins: { boundaries },
    settings: {
      'boundaries/elements': PARTS,
      'boundaries/include': ['{src,shared,server,cli}/**/*.{ts,tsx}'],
      'import/resolver': { node: { extensions: ['.ts', '.tsx', '.mts', '.js', '.mjs', '.json'] } },
    },
    rules: {
      'boundaries/dependencies': ['error', { default: 'allow', checkAllOrigins: true, policies: BOUNDARY_POLICIES }],
    },
  },
);
