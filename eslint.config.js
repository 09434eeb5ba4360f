import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist', 'node_modules', 'coverage', 'data', '.tmp'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: globals.browser },
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    files: ['server/**/*.ts', 'tests/**/*.{ts,tsx}', '*.config.{js,ts}'],
    languageOptions: { globals: globals.node },
  },
  {
    // The engine is pure: it runs the same in the browser, on the server and in tests.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['node:*'], message: 'shared/ runs in the browser too: no Node built-ins.' },
            { group: ['**/src/**', '**/server/**', '../src/*', '../server/*', '../../src/*', '../../server/*'], message: 'shared/ imports nothing from src/ or server/.' },
          ],
          paths: ['fs', 'path', 'os', 'crypto', 'child_process', 'http', 'net', 'url', 'util', 'events', 'stream', 'buffer', 'process'].map((name) => ({
            name,
            message: 'shared/ runs in the browser too: no Node built-ins.',
          })),
        },
      ],
      'no-restricted-properties': [
        'error',
        { object: 'Math', property: 'random', message: 'Chance comes only from the seeded generator in shared/random.ts.' },
        { object: 'Date', property: 'now', message: 'shared/ never reads the clock.' },
      ],
      'no-restricted-syntax': ['error', { selector: "NewExpression[callee.name='Date']", message: 'shared/ never reads the clock.' }],
      'no-restricted-globals': ['error', { name: 'process', message: 'shared/ runs in the browser too.' }, { name: 'require', message: 'Use ES imports.' }],
    },
  },
);
