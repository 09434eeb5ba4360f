import { ESLint } from 'eslint';
import { expect, test } from 'vitest';

const eslint = new ESLint({ cwd: process.cwd() });

async function ruleIdsFor(code: string, filePath: string) {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.map((m) => m.ruleId);
}

test('lint refuses Math.random in shared/', async () => {
  expect(await ruleIdsFor('export const x = Math.random();\n', 'shared/example.ts')).toContain('no-restricted-properties');
});

test('lint refuses the clock in shared/', async () => {
  expect(await ruleIdsFor('export const x = Date.now();\n', 'shared/example.ts')).toContain('no-restricted-properties');
  expect(await ruleIdsFor('export const x = new Date();\n', 'shared/example.ts')).toContain('no-restricted-syntax');
});

test('lint refuses Node built-ins in shared/', async () => {
  expect(await ruleIdsFor("import { readFileSync } from 'node:fs';\nexport const r = readFileSync;\n", 'shared/example.ts')).toContain('no-restricted-imports');
  expect(await ruleIdsFor("import { join } from 'path';\nexport const j = join;\n", 'shared/example.ts')).toContain('no-restricted-imports');
});

test('lint refuses imports from src/ and server/ in shared/', async () => {
  expect(await ruleIdsFor("import { App } from '../src/App';\nexport const a = App;\n", 'shared/example.ts')).toContain('no-restricted-imports');
  expect(await ruleIdsFor("import { loadConfig } from '../server/config';\nexport const c = loadConfig;\n", 'shared/exchange/example.ts')).toContain('no-restricted-imports');
});

test('the same code is allowed on the server', async () => {
  expect(await ruleIdsFor("import { join } from 'node:path';\nexport const x = [Math.random(), join];\n", 'server/example.ts')).toEqual([]);
});
