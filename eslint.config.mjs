// ESLint: the recommended rules of ESLint and typescript-eslint over the sources, tests, benchmarks and
// scripts; formatting is Prettier's (.prettierrc.json), so no style rules here.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'test-output/**', 'bench/tmp/**', 'bench/out/**', 'server/src/chem/data/generated.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { ecmaVersion: 2022, sourceType: 'module' },
    rules: {
      // `_name` marks a parameter kept for its place in a signature.
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      // Matching control characters is the point in places (what reaches a terminal, what XML may hold).
      'no-control-regex': 'off',
    },
  },
  {
    // Stand-ins for VS Code and parsed manifests in the tests are untyped on purpose.
    files: ['test/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['scripts/**/*.mjs'],
    languageOptions: { globals: { process: 'readonly', console: 'readonly', URL: 'readonly' } },
  },
);
