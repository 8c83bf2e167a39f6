// Lint: recommended JS + typescript-eslint rules; the type checker (tsc) does the rest.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['node_modules/**', 'client/dist/**', 'artifacts/**', 'data/**', 'scripts/reference/*.py'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: {
      globals: {
        console: 'readonly', process: 'readonly', URL: 'readonly', performance: 'readonly',
        setTimeout: 'readonly', clearTimeout: 'readonly', window: 'readonly', document: 'readonly',
        self: 'readonly', Worker: 'readonly', fetch: 'readonly', Buffer: 'readonly',
      },
    },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'no-constant-condition': ['error', { checkLoops: false }],
    },
  },
);
