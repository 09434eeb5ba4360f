import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, test } from 'vitest';

const root = join(import.meta.dirname, '../../shared');

function sources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sources(path);
    return /\.ts$/.test(entry.name) && !/\.test\.ts$/.test(entry.name) ? [path] : [];
  });
}

const forbidden: [string, RegExp][] = [
  ['Math.random', /Math\.random/],
  ['the clock', /\bDate\b|performance\.now/],
  ['node built-ins', /from ['"]node:|from ['"](fs|path|crypto|os)['"]/],
  ['require', /\brequire\(/],
  ['the client or server', /from ['"][./]*(src|server)\//],
];

test('shared/ uses no chance, clock, node module or app code', () => {
  const found: string[] = [];
  const files = sources(root);
  expect(files.length).toBeGreaterThan(0);
  for (const file of files) {
    // Comments may name what the code must not use.
    const text = readFileSync(file, 'utf8')
      .replace(/\/\*[\s\S]*?\*\//g, '')
      .replace(/^\s*\/\/.*$/gm, '');
    for (const [what, pattern] of forbidden) if (pattern.test(text)) found.push(`${file}: ${what}`);
  }
  expect(found).toEqual([]);
});
