import request from 'supertest';
import { afterAll, beforeAll, expect, test } from 'vitest';
import type { ComparisonDto } from '../../shared/comparisons';
import { seatRecords } from '../../server/services/exchange-stats';
import { createUser, makeApp, signedIn, type TestApp } from './helpers';
import { dealOptions, makeDrill, makeLesson, makeTable, planA, planB, playPlan } from './comparison-fixture';

let app: TestApp;
const ids: Record<string, string> = {};
let lessonId = 0;
let drillId = '';

beforeAll(async () => {
  app = await makeApp();
  const ines = await createUser('ines@harborlane.test', 'teacher');
  await createUser('pat@harborlane.test', 'admin');
  await createUser('omar@harborlane.test', 'teacher');
  const [theo, mina, sol, nadia, ruth] = await Promise.all(['theo', 'mina', 'sol', 'nadia', 'ruth'].map((n) => createUser(`${n}@harborlane.test`)));
  const { drill } = await makeDrill(ines);
  drillId = drill.id;
  const a = await makeTable(ines, drill, 'Week 1 · table 1', { east: theo, south: mina, west: 'bot', north: 'bot' }, planA);
  const b = await makeTable(ines, drill, 'Week 1 · table 2', { east: sol, south: 'bot', west: 'bot', north: 'bot' }, planB);
  // Nadia's table has not started, so the deal is still ahead of her.
  const c = await makeTable(ines, drill, 'Week 1 · table 3', { east: nadia, south: 'bot', west: 'bot', north: 'bot' });
  // Sol finished table 2 and is playing the deal again at table 4, one pass in.
  const d = await makeTable(ines, drill, 'Week 1 · table 4', { east: sol, south: 'bot', west: 'bot', north: 'bot' }, planA, 'playing');
  ids.a = a.exchange!.id;
  ids.b = b.exchange!.id;
  lessonId = (await makeLesson(ines, drill, [theo, mina, sol, nadia, ruth], [a.table, b.table, c.table, d.table])).id;
});
afterAll(() => app.dispose());

const as = (who: string) => signedIn(app.app, `${who}@harborlane.test`);

test('the fixture rebuilds each rack from the log: every pass leaves what it sent and gains what it received', () => {
  const { log, state } = playPlan(planA);
  const records = seatRecords(dealOptions, log);
  expect(records.east.passes.map((p) => p.phase)).toEqual(['first-right', 'first-across', 'first-left']);
  expect(records.east.passes[1].rack.slice().sort()).toEqual(['bam1', 'bam1', 'bam1', 'bam2', 'bam2', 'bam3', 'crack6', 'crack7', 'dot5', 'dot6', 'dot7', 'dot9', 'dot9', 'dot9']);
  expect(records.east.end.slice().sort()).toEqual(state.racks.east.map((t) => t.kind).sort());
});

test('the lesson comparison puts both finished tables side by side, best first, with the figures worked out by hand', async () => {
  const res = await (await as('ines')).get(`/api/comparisons/lessons/${lessonId}`);
  expect(res.status).toBe(200);
  const { deals, withheld } = res.body.comparison as ComparisonDto;
  expect(withheld).toEqual([]);
  expect(deals).toHaveLength(1);
  const deal = deals[0];
  expect(deal.title).toBe('Drill: Harbor Lane week 1 drill');
  expect(deal.patternListName).toBe('Harbor Lane steps list');
  expect(deal.seed).toBe('harbor-lane-week-01');
  expect(deal.stillPlaying).toBe(1);
  // Table 1's east ends 3 away, table 2's best seat (south) 5 away.
  expect(deal.tables.map((t) => [t.tableName, t.place, t.bestAfter, t.meanAfter])).toEqual([
    ['Week 1 · table 1', 1, 3, 10.5],
    ['Week 1 · table 2', 2, 5, 10.5],
  ]);
  const [one, two] = deal.tables;
  expect(one.seats.map((s) => [s.seat, s.awayBefore, s.awayAfter])).toEqual([['east', 8, 3], ['south', 8, 11], ['west', 12, 14], ['north', 14, 14]]);
  expect(two.seats.map((s) => [s.seat, s.awayBefore, s.awayAfter])).toEqual([['east', 8, 9], ['south', 8, 5], ['west', 12, 14], ['north', 14, 14]]);
  expect(one.seats[0].player).toBe('theo');
  expect(one.seats[0].nearest).toBe('Harbor steps');
  expect(one.seats[0].passes.map((p) => ({ ...p, sent: p.sent.slice().sort() }))).toEqual([
    { phase: 'first-right', sent: ['crack5', 'wind-n', 'wind-s'], blind: 0 },
    { phase: 'first-across', sent: ['dot5', 'dot6', 'dot7'], blind: 0 },
    { phase: 'first-left', sent: ['crack4', 'crack6', 'crack7'], blind: 0 },
  ]);
  expect(two.seats[0].passes[0].sent).toEqual(['bam1', 'bam1', 'bam1']);
  expect(deal.standings.slice(0, 4).map((s) => [s.place, s.tableName, s.seat, s.awayAfter])).toEqual([
    [1, 'Week 1 · table 1', 'east', 3],
    [2, 'Week 1 · table 2', 'south', 5],
    [3, 'Week 1 · table 2', 'east', 9],
    [4, 'Week 1 · table 1', 'south', 11],
  ]);
  // The four seats that end 14 away share fifth place.
  expect(deal.standings.slice(4).map((s) => s.place)).toEqual([5, 5, 5, 5]);
});

test('a student who finished a table sees the comparison without the seed', async () => {
  const res = await (await as('mina')).get(`/api/comparisons/lessons/${lessonId}`);
  expect(res.status).toBe(200);
  const deal = (res.body.comparison as ComparisonDto).deals[0];
  expect(deal.seed).toBeNull();
  expect(deal.tables).toHaveLength(2);
  expect(JSON.stringify(res.body)).not.toContain('harbor-lane-week-01');
});

test('a student still to play the deal, or who never sat at it, is told it opens later and sees no passes', async () => {
  for (const who of ['nadia', 'ruth']) {
    const res = await (await as(who)).get(`/api/comparisons/lessons/${lessonId}`);
    expect(res.status).toBe(200);
    const body = res.body.comparison as ComparisonDto;
    expect(body.deals).toEqual([]);
    expect(body.withheld).toHaveLength(1);
    expect(body.withheld[0].reason).toMatch(/opens once/);
  }
});

test('a student who finished one table but is playing the deal at another waits for that one to finish', async () => {
  const res = await (await as('sol')).get(`/api/comparisons/lessons/${lessonId}`);
  const body = res.body.comparison as ComparisonDto;
  expect(body.deals).toEqual([]);
  expect(body.withheld[0].reason).toMatch(/another table/);
});

test('people outside the lesson get 403; signed out gets 401', async () => {
  expect((await (await as('omar')).get(`/api/comparisons/lessons/${lessonId}`)).status).toBe(403);
  expect((await request(app.app).get(`/api/comparisons/lessons/${lessonId}`)).status).toBe(401);
  expect((await (await as('pat')).get(`/api/comparisons/lessons/${lessonId}`)).status).toBe(200);
});

test('the comparison from one exchange finds the host’s other table on the same deal; only its players and host may ask', async () => {
  const theo = await as('theo');
  const res = await theo.get(`/api/comparisons/exchanges/${ids.b}`);
  expect(res.status).toBe(403);
  const own = await theo.get(`/api/comparisons/exchanges/${ids.a}`);
  expect(own.status).toBe(200);
  expect((own.body.comparison as ComparisonDto).deals[0].tables.map((t) => t.exchangeId)).toEqual([ids.a, ids.b]);
  expect((await (await as('omar')).get(`/api/comparisons/exchanges/${ids.a}`)).status).toBe(403);
  expect((await (await as('ines')).get('/api/comparisons/exchanges/nope')).status).toBe(404);
});

test('the drill comparison is for the drill’s owner and admins', async () => {
  const res = await (await as('ines')).get(`/api/comparisons/drills/${drillId}`);
  expect(res.status).toBe(200);
  expect((res.body.comparison as ComparisonDto).deals[0].tables).toHaveLength(2);
  expect((await (await as('omar')).get(`/api/comparisons/drills/${drillId}`)).status).toBe(403);
  expect((await (await as('theo')).get(`/api/comparisons/drills/${drillId}`)).status).toBe(403);
});

test('the seed comparison: the host sees their tables; a player of one sees that host’s; anyone else gets the same 404 as for a seed nobody dealt', async () => {
  const host = await (await as('ines')).get('/api/comparisons?seed=harbor-lane-week-01');
  expect(host.status).toBe(200);
  expect((host.body.comparison as ComparisonDto).deals[0].tables).toHaveLength(2);
  expect((await (await as('mina')).get('/api/comparisons?seed=harbor-lane-week-01')).status).toBe(200);
  const others = await (await as('omar')).get('/api/comparisons?seed=harbor-lane-week-01');
  const nobodys = await (await as('omar')).get('/api/comparisons?seed=harbor-lane-week-99');
  expect(others.status).toBe(404);
  expect(nobodys.status).toBe(404);
  expect(others.body).toEqual(nobodys.body);
  const bad = await (await as('ines')).get('/api/comparisons');
  expect(bad.status).toBe(400);
  expect(bad.body.error.fields.seed).toMatch(/seed/);
});

test('the exchange list carries tiles away before and after and the nearest pattern', async () => {
  const res = await (await as('theo')).get('/api/exchanges');
  expect(res.status).toBe(200);
  expect(res.body.exchanges).toHaveLength(1);
  expect(res.body.exchanges[0]).toMatchObject({ id: ids.a, seat: 'east', awayBefore: 8, awayAfter: 3, nearestPattern: 'Harbor steps' });
});
