import fc from 'fast-check';
import request from 'supertest';
import { expect } from 'vitest';
import { clientEventSchemas } from '../../shared/protocol';
import { createTable, liveTest, simpleAction } from './live';

/** `started` seats four and deals, waiting for every seat's first pass; `person` signs someone up and connects them. */
const test = liveTest
  .extend('started', async ({ live }) => async () => {
    const t = await live.fullTable();
    await t.host.ok('table:start');
    await Promise.all(t.clients.map((c) => c.until((s) => s.phase === 'first-right')));
    return t;
  })
  .extend('person', async ({ live }) => (name: string) => live.client(name));

test('a malformed payload gets BAD_INPUT and changes nothing', async ({ started }) => {
  const { clients: [, theo] } = await started();
  const version = theo.state.version;
  for (const payload of [{ action: { type: 'pass', tiles: 'abc' } }, { action: { type: 'fly' } }, 'just a string', 42, { action: { type: 'pass', tiles: ['a', 'b', 'c', 'd'] } }]) {
    const ack = await theo.emit('exchange:act', payload);
    expect(ack).toMatchObject({ ok: false, code: 'BAD_INPUT' });
  }
  expect((await theo.emit('table:sit', { seat: 'middle' })).code).toBe('BAD_INPUT');
  expect(theo.state.version).toBe(version);
});

test('an engine rule error comes back with its rule code', async ({ started }) => {
  const { clients: [ines] } = await started();
  const rack = ines.state.myRack;
  const ack = await ines.emit('exchange:act', { action: { type: 'pass', tiles: rack.slice(0, 2).map((t) => t.id) } });
  expect(ack).toMatchObject({ ok: false, code: 'WRONG_COUNT' });
  const blind = await ines.emit('exchange:act', { action: { type: 'pass', tiles: rack.slice(0, 2).map((t) => t.id), blind: 1 } });
  expect(blind).toMatchObject({ ok: false, code: 'BLIND_NOT_ALLOWED' });
});

test('acting without a seat is refused', async ({ started, person }) => {
  const { table } = await started();
  const sol = await person('Sol');
  await sol.ok('table:join', { tableId: table.id, as: 'spectator' });
  const ack = await sol.emit('exchange:act', { action: { type: 'vote', stop: true } });
  expect(ack).toMatchObject({ ok: false, code: 'NOT_SEATED' });
});

test('no one can act for a seat that is not theirs: a seat field is refused, and actions land on your own seat', async ({ started }) => {
  const { clients: [, theo, mina] } = await started();
  const ack = await theo.emit('exchange:act', { action: simpleAction(theo.state), seat: 'west' });
  expect(ack).toMatchObject({ ok: false, code: 'BAD_INPUT' });
  const minaTiles = mina.state.myRack.filter((t) => t.kind !== 'joker').slice(0, 3).map((t) => t.id);
  const foreign = await theo.emit('exchange:act', { action: { type: 'pass', tiles: minaTiles } });
  expect(foreign).toMatchObject({ ok: false, code: 'NOT_YOUR_TILE' });
  await theo.ok('exchange:act', { action: simpleAction(theo.state) });
  const s = await mina.until((x) => x.seats.south.committed);
  expect(s.seats.west.committed).toBe(false);
});

test('a non-host gets NOT_HOST for every host event', async ({ started }) => {
  const { clients: [, theo] } = await started();
  for (const [event, payload] of [
    ['table:bot', { seat: 'north', strategy: 'random' }],
    ['table:start', {}],
    ['huddle:call', {}],
    ['huddle:reveal', { seat: 'east' }],
    ['huddle:note', { text: 'hello' }],
    ['huddle:release', {}],
    ['table:advice', { hidden: true }],
  ] as const) {
    expect(await theo.emit(event, payload), event).toMatchObject({ ok: false, code: 'NOT_HOST' });
  }
});

test('a private table needs its invite, over the socket and over REST', async ({ server, person }) => {
  const ines = await person('Ines');
  const theo = await person('Theo');
  const t = await createTable(server, ines.cookie, { private: true });
  expect(t.inviteCode).toBeTruthy();
  expect(await theo.emit('table:join', { tableId: t.id, as: 'player' })).toMatchObject({ ok: false, code: 'INVITE_REQUIRED' });
  expect(await theo.emit('table:join', { tableId: t.id, as: 'player', invite: 'guess' })).toMatchObject({ ok: false, code: 'INVITE_REQUIRED' });
  expect((await request(server.url).get(`/api/tables/${t.id}`).set('Cookie', theo.cookie)).status).toBe(403);
  const withInvite = await request(server.url).get(`/api/tables/${t.id}?invite=${t.inviteCode}`).set('Cookie', theo.cookie);
  expect(withInvite.status).toBe(200);
  expect(withInvite.body.table.inviteCode).toBeUndefined();
  await theo.ok('table:join', { tableId: t.id, as: 'player', invite: t.inviteCode });
  const open = await request(server.url).get('/api/tables').set('Cookie', theo.cookie);
  expect(open.body.open.map((x: { id: string }) => x.id)).not.toContain(t.id);
});

test('starting with an empty seat is refused and says which', async ({ server, person }) => {
  const ines = await person('Ines');
  const t = await createTable(server, ines.cookie);
  await ines.ok('table:join', { tableId: t.id, as: 'player' });
  await ines.ok('table:sit', { seat: 'east' });
  const ack = await ines.emit('table:start');
  expect(ack).toMatchObject({ ok: false, code: 'SEATS_EMPTY' });
  expect(ack.message).toMatch(/south, west, north/);
});

test('talking before sign-in is impossible; talking before joining gets NOT_JOINED', async ({ server, person }) => {
  const theo = await person('Theo');
  expect(await theo.emit('chat:send', { text: 'hello?' })).toMatchObject({ ok: false, code: 'NOT_JOINED' });
  expect(await theo.emit('exchange:act', { action: { type: 'withdraw' } })).toMatchObject({ ok: false, code: 'NOT_JOINED' });
  const res = await request(server.url).post('/api/tables').send({ name: 'x' });
  expect(res.status).toBe(401);
});

test('a taken seat cannot be taken, and a seated player cannot be replaced by a bot while here', async ({ live }) => {
  const { host, clients: [, theo], table } = await (async () => {
    const t = await live.fullTable();
    return t;
  })();
  expect(await theo.emit('table:sit', { seat: 'east' })).toMatchObject({ ok: false, code: 'SEAT_TAKEN' });
  expect(await host.emit('table:bot', { seat: 'south', strategy: 'random' })).toMatchObject({ ok: false, code: 'SEAT_TAKEN' });
  expect(table.id).toBeTruthy();
});

test('the host replaces a player who left mid-exchange with a bot, and the bot plays on', async ({ started }) => {
  const { host, clients: cs } = await started();
  const ruth = cs[3];
  ruth.socket.disconnect();
  await host.until((s) => s.seats.north.occupant?.kind === 'user' && !s.seats.north.occupant.connected);
  await host.ok('table:bot', { seat: 'north', strategy: 'advised' });
  await host.until((s) => s.seats.north.committed);
});

test('chat reaches everyone at the table with the sender and seat', async ({ started }) => {
  const { clients: cs } = await started();
  await cs[1].ok('chat:send', { text: 'Passing my flowers?' });
  for (const c of cs) await expect.poll(() => c.chats.length).toBe(1);
  expect(cs[0].chats[0]).toMatchObject({ text: 'Passing my flowers?', seat: 'south', displayName: 'Theo' });
  expect((await cs[1].emit('chat:send', { text: 'x'.repeat(501) })).code).toBe('BAD_INPUT');
});

test('an unknown event gets UNKNOWN_EVENT', async ({ person }) => {
  const theo = await person('Theo');
  expect(await theo.emit('table:explode', {})).toMatchObject({ ok: false, code: 'UNKNOWN_EVENT' });
});

test('random payloads of random shapes on every client event never crash the server or change the table', async ({ server, started, person }) => {
  const { table, clients: cs } = await started();
  const sol = await person('Sol');
  await sol.ok('table:join', { tableId: table.id, as: 'spectator' });
  const version = (await cs[0].until((s) => s.spectators === 1)).version;
  const events = [...Object.keys(clientEventSchemas).filter((e) => e !== 'table:join' && e !== 'chat:send' && e !== 'table:leave'), 'nonsense:event'];
  await fc.assert(
    fc.asyncProperty(fc.constantFrom(...events), fc.anything(), async (event, payload) => {
      const ack = await sol.emit(event, payload);
      expect(ack.ok).toBe(false);
    }),
    { numRuns: 150, seed: 20261201 },
  );
  // Garbage joins do not move the spectator anywhere, and the table still answers.
  await fc.assert(
    fc.asyncProperty(fc.anything(), async (payload) => {
      const ack = await cs[1].emit('table:join', payload);
      if (ack.ok) throw new Error('a random join payload was accepted');
    }),
    { numRuns: 50, seed: 7 },
  );
  expect((await request(server.url).get('/api/health')).status).toBe(200);
  await new Promise((r) => setTimeout(r, 50));
  expect(cs[0].state.version).toBe(version);
  expect(cs[0].states.filter((s) => s.version > version)).toEqual([]);
  await cs[0].ok('table:join', { tableId: table.id, as: 'player' });
  expect(cs[0].state.phase).toBe('first-right');
  const stored = await request(server.url).get(`/api/tables/${table.id}`).set('Cookie', cs[0].cookie);
  expect(stored.body.table.status).toBe('playing');
});

test('a second tab or a reconnect of the same person gets that seat back, rack and all', async ({ live, started }) => {
  const { table, clients: cs } = await started();
  const theo = cs[1];
  const tab = await live.reconnect({ name: 'Theo tab 2', cookie: theo.cookie });
  await tab.ok('table:join', { tableId: table.id, as: 'player' });
  expect(tab.state.mySeat).toBe('south');
  expect(tab.state.myRack).toEqual(theo.state.myRack);
  await tab.ok('exchange:act', { action: simpleAction(tab.state) });
  await theo.until((s) => s.seats.south.committed);
});

test('the host hides and shows the advice mid-exchange; everyone sees the change', async ({ started }) => {
  const { host, clients: cs } = await started();
  await host.ok('table:advice', { hidden: true });
  for (const c of cs) await c.until((s) => s.options.hideAdvice === true);
  await host.ok('table:advice', { hidden: false });
  for (const c of cs) await c.until((s) => s.options.hideAdvice === false);
});

test('leaving a table stops its states and frees the presence', async ({ started }) => {
  const { table, clients: cs } = await started();
  const theo = cs[1];
  await theo.ok('table:leave');
  await cs[0].until((s) => s.seats.south.occupant?.kind === 'user' && !s.seats.south.occupant.connected);
  const seen = theo.states.length;
  await cs[0].ok('chat:send', { text: 'still here?' });
  await cs[0].ok('exchange:act', { action: simpleAction(cs[0].state) });
  await new Promise((r) => setTimeout(r, 50));
  expect(theo.states.length).toBe(seen);
  expect(await theo.emit('table:leave')).toMatchObject({ ok: false, code: 'NOT_JOINED' });
  await theo.ok('table:join', { tableId: table.id, as: 'player' });
  expect(theo.state.mySeat).toBe('south');
});

test('two bots of one strategy get names that tell them apart', async ({ server, person }) => {
  const ines = await person('Ines');
  const t = await createTable(server, ines.cookie);
  await ines.ok('table:join', { tableId: t.id, as: 'player' });
  await ines.ok('table:bot', { seat: 'south', strategy: 'advised' });
  await ines.ok('table:bot', { seat: 'north', strategy: 'advised' });
  const names = [ines.state.seats.south.occupant!.displayName, ines.state.seats.north.occupant!.displayName];
  expect(new Set(names).size).toBe(2);
});

test('a pass sent with the version of the current step is taken even if others committed since; one from an earlier step is stale', async ({ started }) => {
  const { clients: cs } = await started();
  const [ines, theo, mina] = cs;
  const seenAtStep = theo.state.version;
  await ines.ok('exchange:act', { action: simpleAction(ines.state) });
  await mina.ok('exchange:act', { action: simpleAction(mina.state) });
  await theo.until((s) => s.version > seenAtStep + 1);
  await theo.ok('exchange:act', { action: simpleAction(theo.states.find((s) => s.version === seenAtStep)!), version: seenAtStep });
  await cs[3].ok('exchange:act', { action: simpleAction(cs[3].state) });
  await theo.until((s) => s.phase === 'first-across');
  const ack = await theo.emit('exchange:act', { action: simpleAction(theo.state), version: seenAtStep });
  expect(ack).toMatchObject({ ok: false, code: 'STALE' });
});
