// Lint: typescript-eslint's recommended rules, plus eslint-plugin-regexp to reject
// regular expressions that can backtrack super-linearly (names and contracts are untrusted input).
import tseslint from 'typescript-eslint';
import regexp from 'eslint-plugin-regexp';

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
    rules: { '@typescript-eslint/no-explicit-any': 'error' },
  },
  {
    files: ['tests/**/*.ts', 'bench/**/*.ts', 'services/**/*.ts', 'db/**/*.ts', 'migrations/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
);
