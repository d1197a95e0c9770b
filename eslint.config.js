// Lint: typescript-eslint's recommended rules, plus eslint-plugin-regexp to reject
// regular expressions that can backtrack super-linearly (names and contracts are untrusted input).
import tseslint from 'typescript-eslint';
import regexp from 'eslint-plugin-regexp';

// resolvers/ is pure: data flows services → resolvers and services → db, never back, and no I/O.
const IMPURE_FOR_RESOLVERS = [
  { regex: '^(\\.\\./)+(db|services|bin|bench|scripts|tests|migrations)(/|$)', message: 'resolvers/ is pure: it never imports db/, services/ or tooling.' },
  {
    regex: '^(node:|(fs|path|os|child_process|worker_threads|net|http|https|crypto|stream|zlib)(/|$))',
    message: 'resolvers/ is pure: no I/O or Node built-ins (the service around it reads and writes).',
  },
  {
    regex: '^(fastify|@fastify/|kysely|pg|pg-boss|@electric-sql/|pino|yauzl|unpdf|mammoth)(/|$)',
    message: 'resolvers/ is pure: no server, database or file libraries.',
  },
];
// A stage (resolvers/<stage>/) is used through its index.ts; the other files are its inside.
const PAST_STAGE_INDEX_FROM_RESOLVERS = {
  regex: '^\\.\\./[a-z-]+/(?!index\\.ts$)[^/]+$',
  message: 'Import another stage through its index.ts (add the export there).',
};
const PAST_STAGE_INDEX = {
  regex: '(^|/)resolvers/[a-z-]+/(?!index\\.ts$)[^/]+$',
  message: 'Import a resolvers stage through its index.ts (add the export there).',
};

export default tseslint.config(
  { ignores: ['node_modules/**', 'data/**', 'test-output/**', 'bench/results/**', 'resolvers/analyse/elf-table.json'] },
  ...tseslint.configs.recommended,
  regexp.configs['flat/recommended'],
  {
    rules: {
      'regexp/no-super-linear-backtracking': 'error',
      'regexp/no-super-linear-move': 'error',
      '@typescript-eslint/consistent-type-imports': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['resolvers/**/*.ts'],
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      'no-restricted-imports': ['error', { patterns: [...IMPURE_FOR_RESOLVERS, PAST_STAGE_INDEX_FROM_RESOLVERS] }],
    },
  },
  {
    files: ['services/**/*.ts', 'db/**/*.ts', 'bench/**/*.ts', 'scripts/**/*.ts', '*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [PAST_STAGE_INDEX] }] },
  },
  {
    files: ['tests/**/*.ts', 'bench/**/*.ts', 'services/**/*.ts', 'db/**/*.ts', 'migrations/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
);
