import { ESLint } from 'eslint';
import { expect, test } from 'vitest';

// The client's folder rules (eslint.config.js): features never import each other, shared code imports no feature.

const eslint = new ESLint({ cwd: process.cwd() });

async function ruleIdsFor(code: string, filePath: string) {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.map((m) => m.ruleId);
}

test('a feature may not import another feature, by a relative path or through src/features', async () => {
  expect(await ruleIdsFor("import { Playing } from '../../table/components/Playing';\nexport const p = Playing;\n", 'src/features/replay/routes/Example.tsx')).toContain(
    'no-restricted-imports',
  );
  expect(await ruleIdsFor("import { useReplay } from '../../../features/replay/api/replay';\nexport const r = useReplay;\n", 'src/features/history/routes/Example.tsx')).toContain(
    'no-restricted-imports',
  );
  expect(await ruleIdsFor("export const page = () => import('../../lessons/routes/LessonsPage');\n", 'src/features/teaching/routes/Example.tsx')).toContain('no-restricted-syntax');
});

test('shared client code may not import a feature', async () => {
  expect(await ruleIdsFor("import { useTableStore } from '../features/table/api/table-store';\nexport const s = useTableStore;\n", 'src/lib/example.ts')).toContain('no-restricted-imports');
  expect(await ruleIdsFor("import { Playing } from '../../features/table/components/Playing';\nexport const p = Playing;\n", 'src/components/ui/Example.tsx')).toContain('no-restricted-imports');
});

test('a feature may import itself, src/lib, src/components/ui and shared/', async () => {
  const code = [
    "import { AwayChart } from '../components/AwayChart';",
    "import { oddsWord } from '../../../lib/phase-words';",
    "import { Button } from '../../../components/ui/Button';",
    "import { SEATS } from '../../../../shared/seats';",
    'export const parts = [AwayChart, oddsWord, Button, SEATS];',
    '',
  ].join('\n');
  expect(await ruleIdsFor(code, 'src/features/replay/routes/Example.tsx')).toEqual([]);
});
