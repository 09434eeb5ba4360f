import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { expect } from 'vitest';
import { starterPatterns, type Pattern } from '../../shared/analysis';
import { PatternListRow } from '../../server/db/models';
import { smallList, teachingTest as test, upload, windsPattern } from './teaching-helpers';

const ROUTES: [string, string][] = [
  ['get', '/api/pattern-lists'],
  ['post', '/api/pattern-lists'],
  ['post', '/api/pattern-lists/import'],
  ['get', '/api/pattern-lists/starter'],
  ['post', '/api/pattern-lists/starter/copy'],
  ['put', '/api/pattern-lists/some-id'],
  ['delete', '/api/pattern-lists/some-id'],
  ['get', '/api/pattern-lists/starter/export'],
];

test('every pattern-list route answers 401 signed out and 403 to a player', async ({ teaching: t }) => {
  for (const [method, path] of ROUTES) {
    const out = await (request(t.app.app) as unknown as Record<string, (p: string) => request.Test>)[method](path).send(smallList);
    expect(out.status, `${method} ${path} signed out`).toBe(401);
    const player = await (t.theo as unknown as Record<string, (p: string) => request.Test>)[method](path).send(smallList);
    expect(player.status, `${method} ${path} as a player`).toBe(403);
    expect(player.body.error.code).toBe('FORBIDDEN');
  }
});

test('the starter list is served read-only and can be copied into a list of my own', async ({ teaching: t }) => {
  const list = await t.ines.get('/api/pattern-lists');
  expect(list.body.lists).toEqual([expect.objectContaining({ id: 'starter', readOnly: true, patternCount: starterPatterns.length })]);
  const starter = await t.ines.get('/api/pattern-lists/starter');
  expect(starter.body.list.patterns).toEqual(starterPatterns);
  expect((await t.ines.put('/api/pattern-lists/starter').send(smallList)).body.error.code).toBe('READ_ONLY');
  expect((await t.ines.delete('/api/pattern-lists/starter')).status).toBe(403);

  const copy = await t.ines.post('/api/pattern-lists/starter/copy').send({});
  expect(copy.status).toBe(201);
  expect(copy.body.list).toMatchObject({ name: 'Copy of Starter list', readOnly: false, patternCount: starterPatterns.length });
  expect(copy.body.list.patterns).toEqual(starterPatterns);
  const named = await t.ines.post(`/api/pattern-lists/${copy.body.list.id}/copy`).send({ name: 'Tuesday evens' });
  expect(named.body.list.name).toBe('Tuesday evens');
  expect((await t.ines.post('/api/pattern-lists/starter/copy').send({ name: '' })).body.error.fields).toHaveProperty('name');
  expect((await t.ines.get('/api/pattern-lists')).body.lists).toHaveLength(3);
});

test('a new list checks its own fields and every pattern, naming the pattern and group at fault', async ({ teaching: t }) => {
  const empty = await t.ines.post('/api/pattern-lists').send({ name: ' ', patterns: [] });
  expect(empty.status).toBe(400);
  expect(empty.body.error.fields).toMatchObject({ name: 'Give the list a name.', patterns: 'A list needs at least one pattern.' });

  const badSize = structuredClone(windsPattern);
  badSize.groups[1].size = 7;
  const tooFew = { ...structuredClone(windsPattern), id: 'short-01', groups: windsPattern.groups.slice(1) };
  const pairOfJokers = { ...structuredClone(windsPattern), id: 'jokers-01', groups: [{ size: 2, tile: 'joker' }, ...windsPattern.groups.slice(1)] };
  const res = await t.ines.post('/api/pattern-lists').send({ name: 'Broken', patterns: [badSize, tooFew, pairOfJokers, windsPattern] });
  expect(res.status).toBe(400);
  const fields = res.body.error.fields as Record<string, string>;
  expect(fields['patterns.0.groups.1.size']).toBe('Pattern "harbor-01", group 2 of 5: A group holds at most 6 tiles (a sextet).');
  expect(fields['patterns.1.groups']).toMatch(/^Pattern "short-01": The groups add up to 12 tiles; a hand has 14\./);
  expect(fields['patterns.2.groups.0']).toMatch(/^Pattern "jokers-01", group 1 of 5: A group can't be made of jokers/);
  // The fourth pattern repeats the first one's id.
  expect(fields['patterns.3.id']).toMatch(/^Pattern "harbor-01": pattern 1 already has this id/);
  expect(res.body.error.message).toContain('Pattern "harbor-01", group 2 of 5');
  expect(await PatternListRow.count()).toBe(0);

  const unknownField = await t.ines.post('/api/pattern-lists').send({ ...smallList, colour: 'red' });
  expect(unknownField.status).toBe(400);
  const ok = await t.ines.post('/api/pattern-lists').send(smallList);
  expect(ok.status).toBe(201);
  expect(ok.body.list).toMatchObject({ name: smallList.name, description: smallList.description, patternCount: 2 });
});

test('editing and deleting my list; a list a drill uses is kept until the drill moves off it', async ({ teaching: t }) => {
  const made = (await t.ines.post('/api/pattern-lists').send(smallList)).body.list;
  const edited = await t.ines.put(`/api/pattern-lists/${made.id}`).send({ ...smallList, name: 'Renamed', patterns: [windsPattern] });
  expect(edited.status).toBe(200);
  expect(edited.body.list).toMatchObject({ name: 'Renamed', patternCount: 1 });
  const invalid = await t.ines.put(`/api/pattern-lists/${made.id}`).send({ ...smallList, patterns: [{ ...windsPattern, value: -1 }] });
  expect(invalid.status).toBe(400);
  expect(Object.keys(invalid.body.error.fields)).toEqual(['patterns.0.value']);
  expect((await t.ines.get(`/api/pattern-lists/${made.id}`)).body.list.name).toBe('Renamed');

  const drill = await t.ines.post('/api/drills').send({ name: 'Uses it', seed: 'harbor-lane-week-01', patternListId: made.id });
  expect(drill.status).toBe(201);
  const inUse = await t.ines.delete(`/api/pattern-lists/${made.id}`);
  expect(inUse.status).toBe(409);
  expect(inUse.body.error.message).toContain('“Uses it”');
  await t.ines.put(`/api/drills/${drill.body.drill.id}`).send({ name: 'Uses it', seed: 'harbor-lane-week-01', patternListId: 'starter' });
  expect((await t.ines.delete(`/api/pattern-lists/${made.id}`)).status).toBe(204);
  expect((await t.ines.get(`/api/pattern-lists/${made.id}`)).status).toBe(404);
});

test("a teacher can't read, change, copy, export or delete another teacher's list by its id", async ({ teaching: t }) => {
  const mine = (await t.ines.post('/api/pattern-lists').send(smallList)).body.list;
  for (const res of [
    await t.pat.get(`/api/pattern-lists/${mine.id}`),
    await t.pat.put(`/api/pattern-lists/${mine.id}`).send({ ...smallList, name: 'Taken over' }),
    await t.pat.post(`/api/pattern-lists/${mine.id}/copy`).send({}),
    await t.pat.get(`/api/pattern-lists/${mine.id}/export`),
    await t.pat.delete(`/api/pattern-lists/${mine.id}`),
  ]) {
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('NOT_FOUND');
  }
  expect((await t.pat.get('/api/pattern-lists')).body.lists.map((l: { id: string }) => l.id)).toEqual(['starter']);
  expect((await t.ines.get(`/api/pattern-lists/${mine.id}`)).body.list.name).toBe(smallList.name);
});

test('the starter list goes out as JSON and CSV and both come back as the same patterns', async ({ teaching: t }) => {
  const json = await t.ines.get('/api/pattern-lists/starter/export');
  expect(json.status).toBe(200);
  expect(json.headers['content-type']).toMatch(/^application\/json/);
  expect(json.headers['content-disposition']).toBe('attachment; filename="starter-list.rackside-patterns.json"');
  const file = JSON.parse(json.text);
  expect(file).toMatchObject({ format: 'rackside-pattern-list', version: 2, name: 'Starter list' });

  const csv = await t.ines.get('/api/pattern-lists/starter/export?format=csv');
  expect(csv.headers['content-type']).toMatch(/^text\/csv/);
  expect(csv.text.split('\n').slice(0, 4)).toEqual([
    'rackside-pattern-list,2',
    'name,Starter list',
    expect.stringMatching(/^description,/),
    'id,name,family,value,sealed,size,tile,suit,rank,dragon',
  ]);
  expect((await t.ines.get('/api/pattern-lists/starter/export?format=xml')).status).toBe(400);

  const fromJson = await upload(t.ines, '/api/pattern-lists/import', json.text, 'starter.json');
  expect(fromJson.status).toBe(201);
  expect(fromJson.body.list.patterns).toEqual(starterPatterns);
  const fromCsv = await upload(t.ines, '/api/pattern-lists/import', csv.text, 'starter.csv');
  expect(fromCsv.status).toBe(201);
  expect(fromCsv.body.list.patterns).toEqual(starterPatterns);
  expect(fromCsv.body.list.name).toBe('Starter list');
});

test('a CSV download keeps formula-like names as text, and reads them back unchanged', async ({ teaching: t }) => {
  const sly = { name: '=HYPERLINK("x")', description: '', patterns: [{ ...windsPattern, name: '+1 winds', family: '@home' }] };
  const made = (await t.ines.post('/api/pattern-lists').send(sly)).body.list;
  const csv = (await t.ines.get(`/api/pattern-lists/${made.id}/export?format=csv`)).text;
  expect(csv).toContain(`name,"'=HYPERLINK(""x"")"`);
  expect(csv).toContain("harbor-01,'+1 winds,'@home,25,no");
  const back = (await upload(t.ines, '/api/pattern-lists/import', csv, 'sly.csv')).body.list;
  expect(back).toMatchObject({ name: sly.name, patterns: [{ name: '+1 winds', family: '@home' }] });
});

const goodCsv = [
  'rackside-pattern-list,2',
  'name,Harbor Lane CSV list',
  'id,name,family,value,sealed,size,tile,suit,rank,dragon',
  'harbor-01,Harbor winds,compass,25,no,2,flower,,,',
  'harbor-01,,,,,3,wind-n,,,',
  'harbor-01,,,,,3,wind-e,,,',
  'harbor-01,,,,,3,,A,n,',
  'harbor-01,,,,,3,,A,,match',
  'step-01,Two steps,ladder,30,yes,4,,A,n,',
  'step-01,,,,,4,,A,n+1,',
  'step-01,,,,,3,,B,n+2,',
  'step-01,,,,,3,,bam,9,',
].join('\n');

test('a hand-written CSV list imports with its ranks, dragons and sealed marks', async ({ teaching: t }) => {
  const res = await upload(t.ines, '/api/pattern-lists/import', goodCsv, 'harbor.csv');
  expect(res.status).toBe(201);
  expect(res.body.list.patterns[0]).toEqual(windsPattern);
  expect(res.body.list.patterns[1]).toEqual({
    id: 'step-01', name: 'Two steps', family: 'ladder', value: 30, sealed: true,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 2 } },
      { size: 3, suit: 'bam', rank: 9 },
    ],
  });
});

test('a broken CSV file is refused with the line and column at fault, and nothing is saved', async ({ teaching: t }) => {
  const lines = goodCsv.split('\n');
  const cases: [string, string, RegExp][] = [
    ['a size of 7', lines.map((l, i) => (i === 4 ? 'harbor-01,,,,,7,wind-n,,,' : l)).join('\n'), /^line 5, pattern harbor-01, column size: Group 2 of 5: A group holds at most 6 tiles/],
    ['a group short', lines.filter((_, i) => i !== 5).join('\n'), /^line 4, pattern harbor-01: The groups add up to 11 tiles/],
    ['a bad rank', lines.map((l, i) => (i === 9 ? 'step-01,,,,,4,,A,n plus one,' : l)).join('\n'), /^line 10, pattern step-01, column rank: Group 2: The rank "n plus one"/],
    ['split rows', [...lines, 'harbor-01,,,,,1,flower,,,'].join('\n'), /^line 13, pattern harbor-01, column id: This pattern already ended above/],
    ['an unknown column', lines.map((l, i) => (i === 2 ? `${l},colour` : l)).join('\n'), /^line 3: The header row has unknown columns: "colour"/],
    ['a wrong first line', ['some-other-list,1', ...lines.slice(1)].join('\n'), /^line 1: This is not a Rackside pattern-list file/],
    ['a newer version', ['rackside-pattern-list,3', ...lines.slice(1)].join('\n'), /^line 1: This file is version 3; this Rackside reads version 1 or 2/],
    ['an open quote', lines.map((l, i) => (i === 6 ? 'harbor-01,"Harbor,,,,3,,A,n,' : l)).join('\n'), /^line \d+: This line can't be read as CSV/],
    ['a tile and a suit at once', lines.map((l, i) => (i === 3 ? 'harbor-01,Harbor winds,compass,25,no,2,flower,A,,' : l)).join('\n'), /^line 4, pattern harbor-01, column tile: Group 1: a group with a tile/],
    ['sealed maybe', lines.map((l, i) => (i === 8 ? 'step-01,Two steps,ladder,30,maybe,4,,A,n,' : l)).join('\n'), /^line 9, pattern step-01, column sealed: sealed must be yes or no/],
  ];
  for (const [what, text, expected] of cases) {
    const res = await upload(t.ines, '/api/pattern-lists/import', text, 'harbor.csv');
    expect(res.status, what).toBe(400);
    expect(res.body.error.code, what).toBe('BAD_FILE');
    expect(res.body.error.fields.file, what).toMatch(expected);
    expect(res.body.error.message, what).toMatch(/Nothing was saved\.$/);
  }
  expect(await PatternListRow.count()).toBe(0);
});

test('a broken JSON file is refused with the line or field at fault, and nothing is saved', async ({ teaching: t }) => {
  const good = JSON.stringify({ format: 'rackside-pattern-list', version: 2, name: 'Harbor JSON', patterns: [windsPattern] }, null, 2);
  const badGroup = structuredClone(windsPattern) as Record<string, unknown> & { groups: Record<string, unknown>[] };
  badGroup.groups[3] = { size: 3, suit: 'Q', rank: 4 };
  const cases: [string, string, RegExp][] = [
    ['a trailing comma', good.replace('"name": "Harbor JSON",', '"name": "Harbor JSON",,'), /^line 4, column 25: Two commas in a row/],
    ['a missing bracket', good.slice(0, -1), new RegExp(`^line ${good.split('\n').length}, column 1: The file ends inside an object`)],
    ['single quotes', good.replace('"Harbor JSON"', "'Harbor JSON'"), /^line 4, column 11: Strings take double quotes/],
    ['a wrong format', good.replace('rackside-pattern-list', 'tile-list'), /^format: This is not a Rackside pattern-list file/],
    ['a bad group', JSON.stringify({ format: 'rackside-pattern-list', version: 2, name: 'x', patterns: [badGroup] }), /^line 1, pattern 1 \(harbor-01\), groups\[3\]: Group 4 of 5: A group has a size and either a tile, a suit with a rank/],
    ['no patterns', JSON.stringify({ format: 'rackside-pattern-list', version: 2, name: 'x', patterns: [] }), /^patterns: A list needs at least one pattern/],
    ['an extra key', JSON.stringify({ format: 'rackside-pattern-list', version: 2, name: 'x', patterns: [windsPattern], owner: 'pat' }), /^owner: "owner" is not part of a pattern-list file/],
    ['an empty file', '  ', /^line 1: The file is empty/],
  ];
  for (const [what, text, expected] of cases) {
    const res = await upload(t.ines, '/api/pattern-lists/import', text, 'harbor.json');
    expect(res.status, what).toBe(400);
    expect(res.body.error.fields.file, what).toMatch(expected);
  }
  expect(await PatternListRow.count()).toBe(0);
  expect((await upload(t.ines, '/api/pattern-lists/import', good, 'harbor.json')).status).toBe(201);
});

test('uploads are limited in size, type and shape', async ({ teaching: t }) => {
  const big = await upload(t.ines, '/api/pattern-lists/import', 'x'.repeat(256 * 1024 + 1), 'big.json');
  expect(big.status).toBe(413);
  expect(big.body.error.code).toBe('FILE_TOO_LARGE');
  const png = await upload(t.ines, '/api/pattern-lists/import', goodCsv, 'list.png', 'image/png');
  expect(png.status).toBe(415);
  const disguised = await upload(t.ines, '/api/pattern-lists/import', goodCsv, 'list.csv', 'image/png');
  expect(disguised.status).toBe(415);
  const binary = await upload(t.ines, '/api/pattern-lists/import', Buffer.from([0xff, 0xfe, 0x00, 0x41]), 'list.csv');
  expect(binary.status).toBe(415);
  const none = await t.ines.post('/api/pattern-lists/import').field('name', 'nothing');
  expect(none.status).toBe(400);
  expect(none.body.error.code).toBe('NO_FILE');
  const two = await t.ines.post('/api/pattern-lists/import').attach('file', Buffer.from(goodCsv), 'a.csv').attach('file', Buffer.from(goodCsv), 'b.csv');
  expect(two.status).toBe(400);
  const json = await t.ines.post('/api/pattern-lists/import').send({ file: goodCsv });
  expect(json.status).toBe(400);
  expect(await PatternListRow.count()).toBe(0);
});

test('a JSON file without its "format" or "version" is refused with a field error, not a server error', async ({ teaching: t }) => {
  const cases: [string, Record<string, unknown>, string, RegExp][] = [
    ['no format and no version', { name: 'x', patterns: [windsPattern] }, 'format', /^This is not a Rackside pattern-list file: "format" must be "rackside-pattern-list"\./],
    ['no version', { format: 'rackside-pattern-list', name: 'x', patterns: [windsPattern] }, 'version', /^"version" must be 1 or 2\./],
    ['a version in words', { format: 'rackside-pattern-list', version: 'one', name: 'x', patterns: [windsPattern] }, 'version', /^"version" must be 1 or 2\./],
  ];
  for (const [what, file, field, expected] of cases) {
    const res = await upload(t.ines, '/api/pattern-lists/import', JSON.stringify(file), 'harbor.json');
    expect(res.status, what).toBe(400);
    expect(res.body.error.code, what).toBe('BAD_FILE');
    expect(res.body.error.fields[field], what).toMatch(expected);
    expect(res.body.error.fields.file, what).toMatch(new RegExp(`^${field}: `));
  }
  expect(await PatternListRow.count()).toBe(0);
});

test('a JSON file nested far too deep is refused with the line and column where it goes wrong', async ({ teaching: t }) => {
  const deep = '['.repeat(120_000);
  const open = await upload(t.ines, '/api/pattern-lists/import', deep, 'deep.json');
  expect(open.status).toBe(400);
  expect(open.body.error.fields.file).toBe('line 1, column 120001: The file ends where a value was expected.');

  // Deep, closed, and broken at the far end: the place is still found.
  const wrapped = `{\n  "format": "rackside-pattern-list",\n  "patterns": ${'['.repeat(100_000)}1,,${']'.repeat(100_000)}\n}`;
  const broken = await upload(t.ines, '/api/pattern-lists/import', wrapped, 'deep.json');
  expect(broken.status).toBe(400);
  expect(broken.body.error.fields.file).toBe(`line 3, column ${15 + 100_000 + 2}: Two commas in a row: remove one.`);

  // Deep and well-formed: read, then refused for what it holds.
  const valid = `{"format": "rackside-pattern-list", "version": 1, "name": "x", "patterns": [${'['.repeat(100_000)}${']'.repeat(100_000)}]}`;
  const held = await upload(t.ines, '/api/pattern-lists/import', valid, 'deep.json');
  expect(held.status).toBe(400);
  expect(held.body.error.fields.file).toMatch(/^line 1, pattern 1: A pattern is named fields written \{ … \}/);
  expect(await PatternListRow.count()).toBe(0);
});

test('every cell of a CSV download that a spreadsheet could run as a formula is kept as text, and reads back unchanged', async ({ teaching: t }) => {
  // Names as a stored list may hold them, whatever the editor trims today.
  const owner = (await t.ines.get('/api/auth/me')).body.user.id as number;
  const risky = ['\r=1+1', '\t=1+1', '=HYPERLINK("x")', '+1 winds', '-1 winds', '@home', "'=already quoted"];
  const row = await PatternListRow.create({
    id: 'risky-list',
    ownerId: owner,
    name: risky[0],
    description: risky[1],
    patterns: risky.slice(2).map((name, i) => ({ ...windsPattern, id: `risky-${i}`, name, family: risky[(i + 1) % risky.length] })) as Pattern[],
  });
  const csv = (await t.ines.get(`/api/pattern-lists/${row.id}/export?format=csv`)).text;
  // OWASP "CSV Injection": a cell starting with =, +, -, @, TAB (0x09) or CR (0x0D) is run as a formula; a leading ' keeps it text.
  const cells = (parse(csv, { relax_column_count: true }) as string[][]).flat();
  expect(cells.length).toBeGreaterThan(0);
  for (const cell of cells) expect(cell, JSON.stringify(cell)).not.toMatch(/^[=+\-@\t\r]/);
  expect(cells).toEqual(expect.arrayContaining(["'\r=1+1", "'\t=1+1", "'=HYPERLINK(\"x\")", "'+1 winds", "'-1 winds", "'@home", "''=already quoted"]));

  const back = await upload(t.ines, '/api/pattern-lists/import', csv, 'risky.csv');
  expect(back.status).toBe(201);
  // Names are trimmed as any list's are; everything else comes back as it went out.
  expect(back.body.list.name).toBe('=1+1');
  expect(back.body.list.description).toBe('=1+1');
  expect(back.body.list.patterns.map((p: { name: string }) => p.name)).toEqual(['=HYPERLINK("x")', '+1 winds', '-1 winds', '@home', "'=already quoted"]);
});
