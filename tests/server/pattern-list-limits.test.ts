/**
 * Checking a pattern list and building it for a table run on the event loop, so the work a list
 * may ask for is bounded: the server keeps answering while the costliest allowed list is handled.
 */
import request from 'supertest';
import { expect } from 'vitest';
import { bestAway } from '../../shared/analysis';
import { PATTERN_WORK_LIMITS } from '../../shared/analysis/pattern';
import { patternsForTable } from '../../server/teaching/pattern-lists/service';
import { PatternListRow } from '../../server/db/models';
import { eightLetters, worstAllowed, worstAllowedList } from '../unit/analysis/limit-patterns';
import { teachingTest as test, upload, type TestTeaching } from './teaching-helpers';

/**
 * Asks /api/health again and again until `busy` settles, and returns how long each answer took.
 * The first request is on its way before `busy` is started, so any stretch the event loop spends
 * on `busy` delays an answer.
 */
async function healthWhile<T>(t: TestTeaching, busy: () => Promise<T>): Promise<{ result: T; waits: number[] }> {
  const waits: number[] = [];
  let settled = false;
  const ask = async () => {
    const start = performance.now();
    const res = await request(t.app.app).get('/api/health');
    waits.push(performance.now() - start);
    expect(res.status).toBe(200);
  };
  const first = ask();
  const work = busy().finally(() => {
    settled = true;
  });
  await first;
  while (!settled) await ask();
  return { result: await work, waits };
}

test('a list with patterns of eight number letters is refused with a field error on each, by the editor and by import', async ({ teaching: t }) => {
  const list = { name: 'Spread thin', patterns: [eightLetters('spread-01'), eightLetters('spread-02'), eightLetters('spread-03')] };
  const res = await t.ines.post('/api/pattern-lists').send(list);
  expect(res.status).toBe(400);
  expect(res.body.error.code).toBe('BAD_INPUT');
  const fields = res.body.error.fields as Record<string, string>;
  expect(Object.keys(fields)).toEqual(['patterns.0.groups', 'patterns.1.groups', 'patterns.2.groups']);
  expect(fields['patterns.0.groups']).toBe(
    `Pattern "spread-01": This pattern uses 8 number letters (a, b, c, d, e, f, g, h); at most ${PATTERN_WORK_LIMITS.rankVariables} are allowed, so Rackside can check it quickly. Tie numbers together with offsets (n, n+1) or use fixed numbers.`,
  );

  const file = JSON.stringify({ format: 'rackside-pattern-list', version: 1, ...list });
  const imported = await upload(t.ines, '/api/pattern-lists/import', file, 'spread.json');
  expect(imported.status).toBe(400);
  expect(imported.body.error.fields.file).toMatch(/^line 1, pattern 1 \(spread-01\), groups: This pattern uses 8 number letters/);
  expect(await PatternListRow.count()).toBe(0);
});

test('a list whose patterns together ask too much is refused with a field error on the list', async ({ teaching: t }) => {
  const count = Math.floor(PATTERN_WORK_LIMITS.listAssignments / PATTERN_WORK_LIMITS.assignments) + 1;
  const res = await t.ines.post('/api/pattern-lists').send({ name: 'Too costly', patterns: Array.from({ length: count }, (_, i) => worstAllowed(`worst-${i}`)) });
  expect(res.status).toBe(400);
  expect(Object.keys(res.body.error.fields)).toEqual(['patterns']);
  expect(res.body.error.fields.patterns).toMatch(/^Together these patterns have up to [\d,]+ ways to choose suits and numbers; a list may have at most [\d,]+/);
});

test('health answers within a second while the costliest allowed list is checked, stored and built for a table', async ({ teaching: t }) => {
  const list = { name: 'Costliest allowed', patterns: worstAllowedList() };
  expect(list.patterns).toHaveLength(200);

  // The upload is in flight while health is asked.
  const saved = await healthWhile(t, () => t.ines.post('/api/pattern-lists').send(list).then((r) => r));
  expect(saved.result.status).toBe(201);

  const table = await t.ines.post('/api/tables').send({ name: 'Costly table', options: { patternListId: saved.result.body.list.id } });
  expect(table.status).toBe(201);
  const { patterns } = await patternsForTable(table.body.table.options.patternListId);
  expect(patterns).toHaveLength(200);

  // Building every pattern for the table's analysis (what a bot's first look at a rack does), on this event loop.
  const rack = ['bam1', 'bam2', 'bam3', 'bam4', 'crack5', 'crack5', 'crack5', 'dot7', 'dot7', 'wind-s', 'wind-s', 'flower', 'joker'] as const;
  const built = await healthWhile(
    t,
    () =>
      new Promise<number>((resolve) => {
        setImmediate(() => resolve(bestAway([...rack], patterns)));
      }),
  );
  expect(built.result).toBeLessThan(14);

  // The one timed assertion: no health answer waited a second, during either stretch of work.
  for (const wait of [...saved.waits, ...built.waits]) expect(wait).toBeLessThan(1000);
}, 120_000);

test('a list stored before the limits is judged without its patterns that are past them', async ({ teaching: t }) => {
  const owner = (await t.ines.get('/api/auth/me')).body.user.id as number;
  const fine = worstAllowed('fine-01');
  const mixed = await PatternListRow.create({ id: 'older-list', ownerId: owner, name: 'Older list', description: '', patterns: [eightLetters('spread-01'), fine] });
  expect((await patternsForTable(mixed.id)).patterns).toEqual([fine]);

  const onlyCostly = await PatternListRow.create({ id: 'older-costly', ownerId: owner, name: 'Older costly list', description: '', patterns: [eightLetters('spread-02')] });
  const fallback = await patternsForTable(onlyCostly.id);
  expect(fallback.id).toBe('starter');

  // Past the list's budget, the list is cut where the budget runs out.
  const count = Math.floor(PATTERN_WORK_LIMITS.listAssignments / PATTERN_WORK_LIMITS.assignments) + 5;
  const long = await PatternListRow.create({ id: 'older-long', ownerId: owner, name: 'Older long list', description: '', patterns: Array.from({ length: count }, (_, i) => worstAllowed(`w-${i}`)) });
  expect((await patternsForTable(long.id)).patterns).toHaveLength(Math.floor(PATTERN_WORK_LIMITS.listAssignments / PATTERN_WORK_LIMITS.assignments));
});
