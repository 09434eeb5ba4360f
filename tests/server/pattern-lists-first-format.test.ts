/** Lists written before `value` and `sealed` (version 1 files, stored rows, an open editor page) keep working. */
import { readFileSync } from 'node:fs';
import { QueryTypes } from 'sequelize';
import { expect } from 'vitest';
import { openDatabase } from '../../server/db';
import { migrate, migrator } from '../../server/db/migrate';
import { PatternListRow } from '../../server/db/models';
import type { Pattern } from '../../shared/analysis';
import { teachingTest as test, upload, windsPattern } from './teaching-helpers';

/** windsPattern as version 1 wrote it. */
const { value: _value, sealed: _sealed, ...windsBody } = windsPattern;
const firstFormat = { id: windsBody.id, name: windsBody.name, family: windsBody.family, points: 35, concealed: true, groups: windsBody.groups };
const current = { ...windsPattern, value: 35, sealed: true };

test('migration 0008 renames points and concealed in stored lists, and going down names them back', async () => {
  const db = await openDatabase('sqlite::memory:');
  try {
    await migrator(db).up({ to: '0007-payment-refund-reason' });
    const qi = db.getQueryInterface();
    const stamps = { createdAt: new Date(), updatedAt: new Date() };
    await qi.bulkInsert('Users', [{ id: 1, email: 'ines@harborlane.test', passwordHash: 'x', displayName: 'Ines', role: 'teacher', ...stamps }]);
    const mixed = [firstFormat, { ...current, id: 'harbor-02' }];
    await qi.bulkInsert('PatternLists', [
      { id: 'old-list', ownerId: 1, name: 'Old', description: '', patterns: JSON.stringify(mixed), ...stamps },
      { id: 'new-list', ownerId: 1, name: 'New', description: '', patterns: JSON.stringify([current]), ...stamps },
    ]);
    const stored = async (id: string) => {
      const [row] = await db.query<{ patterns: string }>(`SELECT "patterns" FROM "PatternLists" WHERE "id" = :id`, { replacements: { id }, type: QueryTypes.SELECT });
      return JSON.parse(row.patterns) as Record<string, unknown>[];
    };

    await migrate(db);
    const after = await stored('old-list');
    expect(after).toEqual([current, { ...current, id: 'harbor-02' }]);
    expect(Object.keys(after[0])).toEqual(['id', 'name', 'family', 'value', 'sealed', 'groups']);
    expect(await stored('new-list')).toEqual([current]);

    await migrator(db).down({ to: '0008-pattern-value-sealed' });
    expect(await stored('old-list')).toEqual([firstFormat, { ...firstFormat, id: 'harbor-02' }]);
  } finally {
    await db.close();
  }
});

test('a version 1 JSON file and a version 1 CSV file import in today\'s names', async ({ teaching: t }) => {
  const json = JSON.stringify({ format: 'rackside-pattern-list', version: 1, name: 'From version 1', patterns: [firstFormat] });
  const fromJson = await upload(t.ines, '/api/pattern-lists/import', json, 'old.json');
  expect(fromJson.status).toBe(201);
  expect(fromJson.body.list.patterns).toEqual([current]);

  const csv = [
    'rackside-pattern-list,1',
    'name,From version 1',
    'id,name,family,points,concealed,size,tile,suit,rank,dragon',
    'harbor-01,Harbor winds,compass,35,yes,2,flower,,,',
    'harbor-01,,,,,3,wind-n,,,',
    'harbor-01,,,,,3,wind-e,,,',
    'harbor-01,,,,,3,,A,n,',
    'harbor-01,,,,,3,,A,,match',
  ];
  const fromCsv = await upload(t.ines, '/api/pattern-lists/import', csv.join('\n'), 'old.csv');
  expect(fromCsv.status).toBe(201);
  expect(fromCsv.body.list.patterns).toEqual([current]);
  const stored = await PatternListRow.findByPk(fromCsv.body.list.id);
  expect(stored!.patterns).toEqual([current]);

  // A version 1 file's problems are named by its own columns.
  const wrong = csv.map((l, i) => (i === 3 ? 'harbor-01,Harbor winds,compass,35,maybe,2,flower,,,' : l)).join('\n');
  const refused = await upload(t.ines, '/api/pattern-lists/import', wrong, 'old.csv');
  expect(refused.status).toBe(400);
  expect(refused.body.error.fields.file).toMatch(/^line 4, pattern harbor-01, column concealed: concealed must be yes or no/);
  // Version 2's header in a file that says version 1 is refused, naming the columns version 1 expects.
  const mixed = csv.map((l, i) => (i === 2 ? 'id,name,family,value,sealed,size,tile,suit,rank,dragon' : l)).join('\n');
  expect((await upload(t.ines, '/api/pattern-lists/import', mixed, 'old.csv')).body.error.fields.file).toMatch(/^line 3: The header row lacks "points", "concealed"/);
});

test('a version 2 file that still uses points or concealed is told the names to use', async ({ teaching: t }) => {
  const json = JSON.stringify({ format: 'rackside-pattern-list', version: 2, name: 'Half renamed', patterns: [firstFormat] });
  const res = await upload(t.ines, '/api/pattern-lists/import', json, 'half.json');
  expect(res.status).toBe(400);
  expect(res.body.error.code).toBe('BAD_FILE');
  expect(res.body.error.fields.file).toMatch(/^line 1, pattern 1 \(harbor-01\), points: Version 2 names this field "value"; "points" is version 1's name\./);
  expect(await PatternListRow.count()).toBe(0);
});

test('a list stored in the old names is served, copied, exported and saved in today\'s names', async ({ teaching: t }) => {
  const owner = (await t.ines.get('/api/auth/me')).body.user.id as number;
  // As a process not yet upgraded would still write it.
  await PatternListRow.create({ id: 'left-behind', ownerId: owner, name: 'Left behind', description: '', patterns: [firstFormat as unknown as Pattern] });

  expect((await t.ines.get('/api/pattern-lists/left-behind')).body.list.patterns).toEqual([current]);
  expect((await t.ines.post('/api/pattern-lists/left-behind/copy').send({})).body.list.patterns).toEqual([current]);
  const file = JSON.parse((await t.ines.get('/api/pattern-lists/left-behind/export')).text);
  expect(file).toMatchObject({ version: 2, patterns: [current] });
  const csv = (await t.ines.get('/api/pattern-lists/left-behind/export?format=csv')).text;
  expect(csv).toContain('harbor-01,Harbor winds,compass,35,yes,2,flower');

  // An editor page loaded before the rename sends the old names; they are stored in the new ones.
  const saved = await t.ines.put('/api/pattern-lists/left-behind').send({ name: 'Left behind', patterns: [{ ...firstFormat, points: 40 }] });
  expect(saved.status).toBe(200);
  expect((await PatternListRow.findByPk('left-behind'))!.patterns).toEqual([{ ...current, value: 40 }]);
});

test('the teacher\'s list in tests/fixtures imports through the route as it stands, and comes back out the same', async ({ teaching: t }) => {
  const text = readFileSync(new URL('../fixtures/teacher-list.json', import.meta.url), 'utf8');
  const file = JSON.parse(text) as { version: number; name: string; patterns: Pattern[] };
  expect(file.version).toBe(2);
  const res = await upload(t.ines, '/api/pattern-lists/import', text, 'teacher-list.json');
  expect(res.status).toBe(201);
  expect(res.body.list).toMatchObject({ name: file.name, patternCount: file.patterns.length });
  expect(res.body.list.patterns).toEqual(file.patterns);
  const out = JSON.parse((await t.ines.get(`/api/pattern-lists/${res.body.list.id}/export`)).text);
  expect(out.patterns).toEqual(file.patterns);
});
