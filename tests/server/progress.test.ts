import request from 'supertest';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { advisePass } from '../../shared/analysis';
import type { Pattern } from '../../shared/analysis';
import type { TileKind } from '../../shared/tiles';
import type { ProgressDto } from '../../shared/progress';
import { breaksPair } from '../../server/services/exchange-stats';
import { createUser, makeApp, signedIn, type TestApp } from './helpers';
import { makeDrill, makeLesson, makeTable, planA, planB, stepsPattern } from './comparison-fixture';

let app: TestApp;
const userIds: Record<string, number> = {};

beforeAll(async () => {
  app = await makeApp();
  const ines = await createUser('ines@harborlane.test', 'teacher');
  const omar = await createUser('omar@harborlane.test', 'teacher');
  await createUser('pat@harborlane.test', 'admin');
  const [theo, mina, sol, ruth] = await Promise.all(['theo', 'mina', 'sol', 'ruth'].map((n) => createUser(`${n}@harborlane.test`)));
  for (const u of [ines, omar, theo, mina, sol, ruth]) userIds[u.email.split('@')[0]] = u.id;
  const { drill } = await makeDrill(ines);
  // Theo east at table 1; Mina south at table 1 and east at table 2; Ruth north at table 2.
  const a = await makeTable(ines, drill, 'Week 1 · table 1', { east: theo, south: mina, west: 'bot', north: 'bot' }, planA);
  const b = await makeTable(ines, drill, 'Week 1 · table 2', { east: mina, south: 'bot', west: 'bot', north: ruth }, planB);
  await b.exchange!.update({ finishedAt: new Date('2030-05-21T23:20:00Z') });
  await makeLesson(ines, drill, [theo, mina], [a.table, b.table]);
  // Sol is only invited to Omar's lesson, and has not accepted.
  const other = await makeLesson(omar, drill, [], []);
  const { Enrollment } = await import('../../server/db/models');
  await Enrollment.create({ lessonId: other.id, userId: sol.id, status: 'invited' });
});
afterAll(() => app.dispose());

const as = (who: string) => signedIn(app.app, `${who}@harborlane.test`);
const list = [stepsPattern] as unknown as Pattern[];
const same = (a: readonly TileKind[], b: readonly TileKind[]) => a.slice().sort().join() === b.slice().sort().join();
/** Whether a pass is one of the suggestions tied for the top score. */
function advised(rack: TileKind[], phase: 'first-right' | 'first-across' | 'first-left', sent: TileKind[]) {
  const advice = advisePass(rack, list, { phase, blindAllowed: phase === 'first-left' });
  return advice.some((a) => a.score >= advice[0].score - 1e-9 && a.blind === 0 && same(a.tiles, sent));
}

test('a pass breaks a pair when it sends a kind held two or more times', () => {
  expect(breaksPair(['bam2', 'bam2', 'dot1'], ['bam2'])).toBe(true);
  expect(breaksPair(['bam2', 'bam2', 'dot1'], ['bam2', 'bam2'])).toBe(true);
  expect(breaksPair(['bam2', 'dot3', 'dot1'], ['bam2', 'dot1'])).toBe(false);
});

test('my progress: tiles away gained, passes, pairs broken and flowers passed, worked out by hand', async () => {
  const res = await (await as('mina')).get('/api/progress/me');
  expect(res.status).toBe(200);
  const p = res.body.progress as ProgressDto;
  expect(p.user.displayName).toBe('mina');
  // Table 1 south: 8 away after the deal, 11 at the end; the left pass (1, 2, 4 bam) broke the 2 bam and 4 bam pairs.
  // Table 2 east: 8 away, then 9; the right pass sent all three 1 bam, which breaks a pair by this count.
  expect(p.points.map((x) => [x.tableName, x.seat, x.awayBefore, x.awayAfter, x.gained, x.passes, x.brokePair, x.passedFlower])).toEqual([
    ['Week 1 · table 1', 'south', 8, 11, -3, 3, 1, 0],
    ['Week 1 · table 2', 'east', 8, 9, -1, 3, 1, 0],
  ]);
  expect(p.totals.exchanges).toBe(2);
  expect(p.totals.passes).toBe(6);
  expect(p.totals.meanGained).toBe(-2);
  expect(p.truncated).toBe(false);
});

test('a pass matches the advice when it sends the kinds of the top suggestion for that rack', async () => {
  // Theo's racks before each pass at table 1, by hand (see the fixture).
  const racksBefore: [TileKind[], 'first-right' | 'first-across' | 'first-left', TileKind[]][] = [
    [['bam1', 'bam1', 'bam1', 'bam2', 'bam2', 'bam3', 'dot5', 'dot6', 'dot7', 'crack5', 'crack6', 'crack7', 'wind-n', 'wind-s'], 'first-right', ['wind-n', 'wind-s', 'crack5']],
    [['bam1', 'bam1', 'bam1', 'bam2', 'bam2', 'bam3', 'dot5', 'dot6', 'dot7', 'crack6', 'crack7', 'dot9', 'dot9', 'dot9'], 'first-across', ['dot5', 'dot6', 'dot7']],
    [['bam1', 'bam1', 'bam1', 'bam2', 'bam2', 'bam3', 'bam3', 'bam4', 'crack4', 'crack6', 'crack7', 'dot9', 'dot9', 'dot9'], 'first-left', ['crack4', 'crack6', 'crack7']],
  ];
  const expected = racksBefore.filter(([rack, phase, sent]) => advised(rack, phase, sent)).length;
  const p = (await (await as('theo')).get('/api/progress/me')).body.progress as ProgressDto;
  expect(p.points).toHaveLength(1);
  expect(p.points[0]).toMatchObject({ seat: 'east', awayBefore: 8, awayAfter: 3, gained: 5, passes: 3, brokePair: 0, passedFlower: 0, asAdvised: expected });
  expect(p.totals.asAdvisedRate).toBeCloseTo(expected / 3);
  expect(p.totals.meanGained).toBe(5);
});

test('passing flowers counts once per pass', async () => {
  // Ruth, north at table 2, passes three 9 dot, three 9 crack, then three flowers: each breaks a multiple.
  const p = (await (await as('ruth')).get('/api/progress/me')).body.progress as ProgressDto;
  expect(p.points[0]).toMatchObject({ seat: 'north', awayBefore: 14, awayAfter: 14, gained: 0, passes: 3, passedFlower: 1 });
  expect(p.totals.passedFlowerRate).toBeCloseTo(1 / 3);
  // Each pass broke a multiple, but only those where the advice kept it count (progress-figures.test.ts holds the rule).
  expect(p.points[0].brokePair).toBeGreaterThanOrEqual(1);
  expect(p.points[0].brokePair).toBeLessThanOrEqual(3);
  expect(p.totals.brokePairRate).toBeCloseTo(p.points[0].brokePair / 3);
});

test('a teacher sees the progress of a student of their lessons; a student cannot see another student’s', async () => {
  const ines = await as('ines');
  const seen = await ines.get(`/api/progress/${userIds.theo}`);
  expect(seen.status).toBe(200);
  expect((seen.body.progress as ProgressDto).user.id).toBe(userIds.theo);
  const theo = await as('theo');
  const peek = await theo.get(`/api/progress/${userIds.mina}`);
  expect(peek.status).toBe(403);
  expect(peek.body.error.message).toMatch(/your own progress/);
  expect(peek.body.progress).toBeUndefined();
  expect((await theo.get(`/api/progress/${userIds.theo}`)).status).toBe(200);
});

test('a teacher cannot see a player who is not a student of theirs, nor one only invited', async () => {
  const ines = await as('ines');
  expect((await ines.get(`/api/progress/${userIds.ruth}`)).status).toBe(403);
  const omar = await as('omar');
  expect((await omar.get(`/api/progress/${userIds.theo}`)).status).toBe(403);
  expect((await omar.get(`/api/progress/${userIds.sol}`)).status).toBe(403);
});

test('admins see anyone; odd ids and signed-out requests are refused', async () => {
  const pat = await as('pat');
  expect((await pat.get(`/api/progress/${userIds.ruth}`)).status).toBe(200);
  expect((await pat.get('/api/progress/99999')).status).toBe(404);
  expect((await pat.get('/api/progress/abc')).status).toBe(403);
  expect((await request(app.app).get('/api/progress/me')).status).toBe(401);
  expect((await request(app.app).get(`/api/progress/${userIds.theo}`)).status).toBe(401);
});
