import request from 'supertest';
import { expect } from 'vitest';
import { liveTest as test } from './live';

test('a practice table seats the player in east and three bots, and deals at once when the player starts', async ({ live, server }) => {
  const ines = await live.client('Ines');
  const res = await request(server.url).post('/api/tables/practice').set('Cookie', ines.cookie).send({});
  expect(res.status).toBe(201);
  const table = res.body.table;
  expect(table).toMatchObject({ status: 'lobby', private: true, hostName: 'Ines' });
  expect(table.seats.east).toMatchObject({ kind: 'user', displayName: 'Ines' });
  for (const seat of ['south', 'west', 'north']) expect(table.seats[seat]).toMatchObject({ kind: 'bot', strategy: 'advised' });

  // It is the player's own table: listed as theirs, never offered to others.
  const mine = await request(server.url).get('/api/tables').set('Cookie', ines.cookie);
  expect(mine.body.mine.map((t: { id: string }) => t.id)).toEqual([table.id]);
  const sol = await live.client('Sol');
  expect((await request(server.url).get('/api/tables').set('Cookie', sol.cookie)).body.open).toEqual([]);

  await ines.ok('table:join', { tableId: table.id, as: 'player' });
  expect(ines.state.mySeat).toBe('east');
  await ines.ok('table:start');
  const dealt = await ines.until((s) => s.exchangeId !== null && s.myRack.length > 0);
  expect(dealt.phase).not.toBe('lobby');
});

test('a practice table is only for someone signed in, and takes no fields', async ({ live, server }) => {
  expect((await request(server.url).post('/api/tables/practice').send({})).status).toBe(401);
  const ines = await live.client('Ines');
  const bad = await request(server.url).post('/api/tables/practice').set('Cookie', ines.cookie).send({ seats: { east: 'someone else' } });
  expect(bad.status).toBe(400);
  expect(bad.body.error.code).toBe('BAD_INPUT');
});
