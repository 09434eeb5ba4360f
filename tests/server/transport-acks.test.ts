/** Each client event answers with the ack shared/protocol.ts names for it, and nothing more. */
import { expect } from 'vitest';
import type { AckPayloads, ClientEventName } from '../../shared/protocol';
import { liveTest as test, simpleAction, type Client } from './live';

/** Sends the event and checks that its ack holds exactly `ok: true` and the keys of its payload type. */
async function answers<E extends ClientEventName>(c: Client, event: E, payload: unknown, keys: (keyof AckPayloads[E])[]) {
  const ack = await c.ok(event, payload);
  expect(Object.keys(ack).sort(), event).toEqual(['ok', ...keys].sort());
  return ack as unknown as { ok: true } & AckPayloads[E];
}

test('join answers the state, a table change its version, chat the message id, leave nothing', async ({ live }) => {
  await live.start();
  const t = await live.fullTable({ options: { secondCharleston: false, courtesy: false } });
  const [ines, theo] = t.clients;

  const joined = await answers(theo, 'table:join', { tableId: t.table.id, as: 'player' }, ['state']);
  expect(joined.state).toMatchObject({ tableId: t.table.id, mySeat: 'south' });

  await answers(theo, 'table:stand', undefined, ['version']);
  await answers(ines, 'table:bot', { seat: 'south', strategy: 'random' }, ['version']);
  await answers(ines, 'table:advice', { hidden: true }, ['version']);
  const started = await answers(ines, 'table:start', undefined, ['version']);
  expect(typeof started.version).toBe('number');
  const state = await ines.until((s) => s.phase === 'first-right');

  await answers(ines, 'huddle:call', undefined, ['version']);
  await answers(ines, 'huddle:reveal', { seat: 'west' }, ['version']);
  await answers(ines, 'huddle:note', { text: 'Keep your pairs.' }, ['version']);
  await answers(ines, 'huddle:release', undefined, ['version']);
  await answers(ines, 'exchange:act', { action: simpleAction(state) }, ['version']);

  const sent = await answers(theo, 'chat:send', { text: 'Still watching.' }, ['id']);
  await expect.poll(() => ines.chats.map((m) => m.id)).toEqual([sent.id]);

  await answers(theo, 'table:leave', undefined, []);
});

test('the host stands, sits again and closes the table: each answers a version', async ({ live }) => {
  await live.start();
  const t = await live.fullTable();
  await answers(t.host, 'table:stand', undefined, ['version']);
  await answers(t.host, 'table:sit', { seat: 'east' }, ['version']);
  await answers(t.host, 'table:close', undefined, ['version']);
});

test('a message sent without an ack is still carried out', async ({ live }) => {
  await live.start();
  const t = await live.fullTable();
  t.host.socket.emit('table:advice', { hidden: true });
  await t.clients[1].until((s) => s.options.hideAdvice === true);
});

test('once the server drains, a new message is answered SHUTTING_DOWN and changes nothing', async ({ live }) => {
  const server = await live.start();
  const t = await live.fullTable();
  await server.io.drain(0);
  expect(await t.host.emit('table:start')).toMatchObject({ ok: false, code: 'SHUTTING_DOWN' });
  expect(t.host.state.phase).toBe('lobby');
});
