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
// The same purity for what needs no import: a stage's answer is a function of its arguments, so it neither reaches
// outside the process (network, environment, standard streams, storage) nor reads the clock, the scheduler or a
// random source, which would give two runs on the same input two answers. Allowed: Intl (the CLDR data inside Node,
// the same on every run of one Node build), `new Date(x)` of a given instant (calendar arithmetic), and
// resolvers/prng.ts (seeded random numbers, a function of the seed).
const PURE = 'resolvers/ is pure: a stage is a function of its arguments;';
const IO_GLOBALS_FOR_RESOLVERS = [
  ...['fetch', 'XMLHttpRequest', 'WebSocket', 'EventSource', 'navigator'].map((name) => ({ name, message: `${PURE} no network (the service fetches).` })),
  ...['process', 'require', 'console', 'Deno', 'Bun'].map((name) => ({
    name,
    message: `${PURE} no environment, arguments, standard streams or exit (the service passes what a stage needs as arguments, and reports).`,
  })),
  ...['window', 'document', 'localStorage', 'sessionStorage', 'indexedDB'].map((name) => ({ name, message: `${PURE} no browser state or storage.` })),
  ...['setTimeout', 'setInterval', 'setImmediate', 'queueMicrotask', 'requestAnimationFrame'].map((name) => ({
    name,
    message: `${PURE} nothing scheduled for later (the answer is the return value).`,
  })),
  ...['performance', 'crypto'].map((name) => ({ name, message: `${PURE} no clock or random source (seeded random numbers: resolvers/prng.ts).` })),
  { name: 'globalThis', message: `${PURE} no reaching for globals through globalThis.` },
];
const CLOCK_AND_RANDOM_FOR_RESOLVERS = [
  { object: 'Date', property: 'now', message: `${PURE} no clock (the caller passes the instant).` },
  { object: 'Math', property: 'random', message: `${PURE} no unseeded random numbers (resolvers/prng.ts is seeded).` },
];
const CLOCK_AND_LOADING_SYNTAX_FOR_RESOLVERS = [
  { selector: "NewExpression[callee.name='Date'][arguments.length=0]", message: `${PURE} no clock: new Date() reads it (the caller passes the instant).` },
  { selector: "CallExpression[callee.name='Date']", message: `${PURE} no clock: Date() reads it (the caller passes the instant).` },
  { selector: 'ImportExpression', message: `${PURE} no import() (it escapes the import rules above; import statically).` },
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
      'no-restricted-globals': ['error', ...IO_GLOBALS_FOR_RESOLVERS],
      'no-restricted-properties': ['error', ...CLOCK_AND_RANDOM_FOR_RESOLVERS],
      'no-restricted-syntax': ['error', ...CLOCK_AND_LOADING_SYNTAX_FOR_RESOLVERS],
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
