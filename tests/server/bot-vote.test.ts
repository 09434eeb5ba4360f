/** Bots wait for the people at the table to vote, and a practice table can have its bots always play the second Charleston. */
import request from 'supertest';
import { expect } from 'vitest';
import type { ExchangeReplayDto, TableStateDto } from '../../shared/protocol';
import { createTable, liveTest as test, simpleAction, type LiveKit } from './live';

/** Theo sits east with three bots that vote on a coin flip, and plays the first Charleston. */
async function botTable(live: LiveKit, options: object) {
  const server = await live.start();
  const theo = await live.client('Theo');
  const table = await createTable(server, theo.cookie, { options: { courtesy: false, ...options } });
  await theo.ok('table:join', { tableId: table.id, as: 'player' });
  await theo.ok('table:sit', { seat: 'east' });
  for (const seat of ['south', 'west', 'north']) await theo.ok('table:bot', { seat, strategy: 'random' });
  await theo.ok('table:start');
  const voting = await (async () => {
    for (;;) {
      const s = await theo.until((st) => st.phase === 'vote' || (st.view !== null && !st.view.seats.east.committed && simpleAction(st) !== null));
      if (s.phase === 'vote') return s;
      await theo.emit('exchange:act', { action: simpleAction(s) });
    }
  })();
  return { theo, table, voting };
}

test('bots do not vote before the person at the table: the vote screen waits for him, and every vote shows as it comes', async ({ live }) => {
  const { theo, voting } = await botTable(live, {});
  // The table stopped at the vote for Theo: no bot has voted yet.
  expect(voting.view!.votes).toEqual({});
  await theo.ok('exchange:act', { action: { type: 'vote', stop: false } });
  const after = await theo.until((s: TableStateDto) => s.phase !== 'vote');
  // Every vote is in the state Theo holds afterwards: his own and the bots' (one stop ends the vote early).
  expect(after.view!.votes.east).toBe(false);
  const votes = Object.values(after.view!.votes);
  const result = after.phase === 'second-left' ? votes.length === 4 && votes.every((v) => v === false) : votes.includes(true);
  expect(result, `phase ${after.phase}, votes ${JSON.stringify(after.view!.votes)}`).toBe(true);
});

test('on a practice table whose bots always play the second Charleston, the second Charleston follows Theo’s continue', async ({ live }) => {
  const { theo } = await botTable(live, { botsPlaySecond: true });
  await theo.ok('exchange:act', { action: { type: 'vote', stop: false } });
  const after = await theo.until((s) => s.phase !== 'vote');
  expect(after.phase).toBe('second-left');
  expect(after.view!.votes).toEqual({ east: false, south: false, west: false, north: false });
});

test('the first vote in the stored log is the person’s, never a bot’s', async ({ live }) => {
  const { theo } = await botTable(live, {});
  await theo.ok('exchange:act', { action: { type: 'vote', stop: true } });
  const done = await theo.until((s) => s.phase === 'done', 10_000);
  const replay = (await request(live.server.url).get(`/api/exchanges/${done.exchangeId}/replay`).set('Cookie', theo.cookie)).body.replay as ExchangeReplayDto;
  const votes = replay.log.filter((e) => 'action' in e && e.action.type === 'vote');
  expect(votes.length).toBeGreaterThan(0);
  expect(votes[0]).toMatchObject({ seat: 'east', action: { type: 'vote', stop: true } });
});
