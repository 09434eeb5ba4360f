import request from 'supertest';
import { expect } from 'vitest';
import { DrillRow } from '../../server/db/models';
import { smallList, teachingTest as test, upload } from './teaching-helpers';

const weekOne = {
  name: 'Harbor Lane week 1',
  description: 'East starts with two pairs.',
  seed: 'harbor-lane-week-01',
  jokers: true,
  secondCharleston: false,
  courtesy: true,
  racks: { east: ['bam2', 'bam2', 'dot8', 'dot8', 'flower', 'joker'] },
};

const ROUTES: [string, string][] = [
  ['get', '/api/drills'],
  ['post', '/api/drills'],
  ['post', '/api/drills/import'],
  ['get', '/api/drills/some-id'],
  ['put', '/api/drills/some-id'],
  ['delete', '/api/drills/some-id'],
  ['get', '/api/drills/some-id/export'],
];

type Caller = Record<string, (p: string) => request.Test>;

test('every drill route answers 401 signed out and 403 to a player', async ({ teaching: t }) => {
  for (const [method, path] of ROUTES) {
    expect((await (request(t.app.app) as unknown as Caller)[method](path).send(weekOne)).status, `${method} ${path} signed out`).toBe(401);
    const player = await (t.theo as unknown as Caller)[method](path).send(weekOne);
    expect(player.status, `${method} ${path} as a player`).toBe(403);
  }
  expect(await DrillRow.count()).toBe(0);
});

test('a drill is saved with its deal, parts and pattern list, and listed for its owner only', async ({ teaching: t }) => {
  const res = await t.ines.post('/api/drills').send(weekOne);
  expect(res.status).toBe(201);
  expect(res.body.drill).toMatchObject({ ...weekOne, patternListId: 'starter', patternListName: 'Starter list' });
  const own = (await t.ines.post('/api/pattern-lists').send(smallList)).body.list;
  const edited = await t.ines.put(`/api/drills/${res.body.drill.id}`).send({ ...weekOne, jokers: false, racks: { south: ['wind-n', 'wind-n'], west: [] }, patternListId: own.id });
  expect(edited.status).toBe(200);
  expect(edited.body.drill).toMatchObject({ jokers: false, racks: { south: ['wind-n', 'wind-n'] }, patternListId: own.id, patternListName: smallList.name });
  expect((await t.ines.get('/api/drills')).body.drills).toHaveLength(1);
  expect((await t.pat.get('/api/drills')).body.drills).toEqual([]);
});

test('every drill field is checked, and the deal by the engine itself', async ({ teaching: t }) => {
  const blank = await t.ines.post('/api/drills').send({ name: '', seed: '   ', jokers: 'yes', courtesy: 1, racks: { east: ['bam0'], centre: [] }, colour: 'red' });
  expect(blank.status).toBe(400);
  expect(blank.body.error.fields).toMatchObject({
    name: 'Give the drill a name.',
    seed: expect.stringContaining('Give the deal a seed'),
    jokers: 'Jokers are on (true) or off (false).',
    courtesy: 'The courtesy pass is on (true) or off (false).',
    'racks.east.0': 'That is not a tile kind.',
  });
  expect(Object.keys(blank.body.error.fields)).toEqual(expect.arrayContaining(['racks', '_']));

  const long = await t.ines.post('/api/drills').send({ ...weekOne, name: 'x'.repeat(81), description: 'y'.repeat(2001), seed: 'z'.repeat(121) });
  expect(Object.keys(long.body.error.fields).sort()).toEqual(['description', 'name', 'seed']);

  // 15 tiles for east (who holds 14), a joker in a joker-free deal, and five of one kind across seats.
  const fifteen = await t.ines.post('/api/drills').send({ ...weekOne, racks: { east: Array(15).fill('flower').map((k, i) => (i < 7 ? k : `dot${(i % 7) + 1}`)) } });
  expect(fifteen.body.error.fields['racks.east']).toBe("East's preset rack has 15 tiles; east holds 14. Remove 1 tile.");
  const jokerFree = await t.ines.post('/api/drills').send({ ...weekOne, jokers: false, racks: { south: ['joker'] } });
  expect(jokerFree.body.error.fields['racks.south']).toBe("This exchange is dealt without jokers, but south's preset rack holds one. Remove it or turn jokers on.");
  const fifth = await t.ines.post('/api/drills').send({ ...weekOne, racks: { east: ['bam3', 'bam3', 'bam3'], north: ['bam3', 'bam3'] } });
  expect(fifth.body.error.fields).toEqual({ racks: 'The preset racks hold 5 × 3 bam, but the set has only 4.' });
  expect(fifth.body.error.message).toContain('5 × 3 bam');

  const theirs = (await t.pat.post('/api/pattern-lists').send(smallList)).body.list;
  const foreignList = await t.ines.post('/api/drills').send({ ...weekOne, patternListId: theirs.id });
  expect(foreignList.body.error.fields).toEqual({ patternListId: 'Pick the starter list or one of your own lists.' });
  expect((await t.ines.post('/api/drills').send({ ...weekOne, patternListId: 'no-such-list' })).body.error.fields).toHaveProperty('patternListId');
  expect(await DrillRow.count()).toBe(0);
});

test("a teacher can't read, change, export or delete another teacher's drill by its id", async ({ teaching: t }) => {
  const drill = (await t.ines.post('/api/drills').send(weekOne)).body.drill;
  for (const res of [
    await t.pat.get(`/api/drills/${drill.id}`),
    await t.pat.put(`/api/drills/${drill.id}`).send({ ...weekOne, name: 'Taken' }),
    await t.pat.get(`/api/drills/${drill.id}/export`),
    await t.pat.delete(`/api/drills/${drill.id}`),
  ]) {
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('NOT_FOUND');
  }
  expect((await t.ines.get(`/api/drills/${drill.id}`)).body.drill.name).toBe(weekOne.name);
  expect((await t.ines.delete(`/api/drills/${drill.id}`)).status).toBe(204);
  expect((await t.ines.get(`/api/drills/${drill.id}`)).status).toBe(404);
});

test('a drill goes out as a Rackside drill file and comes back the same; a foreign list falls back to the starter', async ({ teaching: t }) => {
  const list = (await t.ines.post('/api/pattern-lists').send(smallList)).body.list;
  const drill = (await t.ines.post('/api/drills').send({ ...weekOne, patternListId: list.id })).body.drill;
  const file = await t.ines.get(`/api/drills/${drill.id}/export`);
  expect(file.headers['content-disposition']).toBe('attachment; filename="harbor-lane-week-1.rackside-drill.json"');
  expect(JSON.parse(file.text)).toEqual({
    format: 'rackside-drill',
    version: 1,
    name: weekOne.name,
    description: weekOne.description,
    deal: { seed: weekOne.seed, jokers: true, racks: weekOne.racks },
    parts: { secondCharleston: false, courtesy: true },
    patternList: { id: list.id, name: smallList.name },
  });
  const back = await upload(t.ines, '/api/drills/import', file.text, 'week1.json');
  expect(back.status).toBe(201);
  expect(back.body).toMatchObject({ drill: { ...weekOne, patternListId: list.id }, notes: [] });

  const elsewhere = await upload(t.pat, '/api/drills/import', file.text, 'week1.json');
  expect(elsewhere.status).toBe(201);
  expect(elsewhere.body.drill.patternListId).toBe('starter');
  expect(elsewhere.body.notes[0]).toContain(`“${smallList.name}” is not one of yours`);
});

test('a broken drill file is refused with the line or field at fault, and nothing is saved', async ({ teaching: t }) => {
  const good = JSON.stringify({ format: 'rackside-drill', version: 1, name: 'Week 2', description: '', deal: { seed: 'harbor-lane-week-02', jokers: true, racks: {} }, parts: { secondCharleston: true, courtesy: true }, patternList: { id: 'starter' } }, null, 2);
  const cases: [string, string, string, RegExp][] = [
    ['a syntax error', good.replace('"Week 2",', '"Week 2"'), 'w.json', /^line 5, column 3: Put a comma between entries/],
    ['a wrong format', good.replace('rackside-drill', 'deal-sheet'), 'w.json', /^format: This is not a Rackside drill file/],
    ['a missing seed', good.replace('"seed": "harbor-lane-week-02",', ''), 'w.json', /^deal\.seed: Give the deal a seed/],
    ['a bad tile', good.replace('"racks": {}', '"racks": { "west": ["dot1", "dot10"] }'), 'w.json', /^deal\.racks\.west\[1\]: That is not a tile kind/],
    ['a joker-free clash', good.replace('"jokers": true', '"jokers": false').replace('"racks": {}', '"racks": { "north": ["joker"] }'), 'w.json', /^deal\.racks\.north: This exchange is dealt without jokers/],
    ['an unknown part', good.replace('"courtesy": true', '"courtesy": true, "third": true'), 'w.json', /^parts: /],
  ];
  for (const [what, text, name, expected] of cases) {
    const res = await upload(t.ines, '/api/drills/import', text, name);
    expect(res.status, what).toBe(400);
    expect(res.body.error.fields.file, what).toMatch(expected);
  }
  expect((await upload(t.ines, '/api/drills/import', good, 'w.csv')).status).toBe(415);
  expect(await DrillRow.count()).toBe(0);
  expect((await upload(t.ines, '/api/drills/import', good, 'w.json')).status).toBe(201);
});
