import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

/** The client's feature folders (src/features/<name>): each imports only itself, src/lib, src/components/ui and shared/. */
const FEATURES = ['account', 'history', 'lessons', 'replay', 'table', 'teaching'];

/**
 * Import paths that reach into one of `features`: climbing out of a feature folder into a sibling
 * ('../../replay/api/replay'), or going through src/features ('../../../features/replay/…'). The regex
 * spells "/" as \x2F because ESLint's selector syntax ends a regex at the first slash.
 */
const reaching = (features) => `^(\\.\\.\\x2F)+(${features.join('|')})(\\x2F|$)|(^|\\x2F)features\\x2F(${features.join('|')})(\\x2F|$)`;

/** Refuses static and dynamic imports whose path matches `regex`. */
function refuseImports(files, regex, message) {
  return {
    files,
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ regex, message }] }],
      'no-restricted-syntax': ['error', { selector: `ImportExpression[source.value=/${regex}/]`, message }],
    },
  };
}

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
  // Features never import each other: what two features need lives in src/lib or src/components/ui.
  ...FEATURES.map((feature) =>
    refuseImports(
      [`src/features/${feature}/**/*.{ts,tsx}`],
      reaching(FEATURES.filter((f) => f !== feature)),
      `src/features/${feature} imports no other feature: move what both need to src/lib or src/components/ui.`,
    ),
  ),
  // Shared client code never imports a feature; only src/router.tsx brings the features together.
  refuseImports(
    ['src/lib/**/*.{ts,tsx}', 'src/components/**/*.{ts,tsx}'],
    reaching(FEATURES),
    'src/lib and src/components/ui are shared by every feature and import none of them.',
  ),
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
