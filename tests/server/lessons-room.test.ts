import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { expect } from 'vitest';
import { DrillRow, ExchangeRow, TableRow, User } from '../../server/db/models';
import { STARTER_LIST_ID } from '../../shared/pattern-lists';
import { liveTest as test, register, type Server } from './live';
import { lessonBody, linkIn, mailsTo } from './lesson-helpers';

async function teacher(s: Server, name: string) {
  const cookie = await register(s, name);
  await User.update({ role: 'teacher' }, { where: { email: `${name.toLowerCase()}@harborlane.test` } });
  return cookie;
}

/** A free lesson, its students invited in one go and each accepting through their mailed link. */
async function lessonWith(s: Server, teacherCookie: string, names: string[], extra: object = {}) {
  const created = await request(s.url).post('/api/lessons').set('Cookie', teacherCookie).send(lessonBody(extra));
  expect(created.status).toBe(201);
  const id = created.body.lesson.id as number;
  const emails = names.map((n) => `${n.toLowerCase()}@harborlane.test`);
  expect((await request(s.url).post(`/api/lessons/${id}/invitations`).set('Cookie', teacherCookie).send({ emails })).status).toBe(201);
  const cookies: Record<string, string> = {};
  for (const [i, name] of names.entries()) {
    cookies[name] = await register(s, name);
    const mails = await mailsTo(emails[i], 'invitation');
    const token = new URL(linkIn(mails[mails.length - 1], '/invitations')).pathname.split('/').pop();
    expect((await request(s.url).post(`/api/invitations/${token}/accept`).set('Cookie', cookies[name])).status).toBe(200);
  }
  return { id, cookies };
}

test('the lesson room: students split over tables, bots in the gaps, one seed everywhere, the teacher in every huddle', async ({ live, server: s }) => {
  const ines = await teacher(s, 'Ines');
  const students = ['Theo', 'Mina', 'Ruth', 'Sol', 'Ada'];
  const { id, cookies } = await lessonWith(s, ines, students);
  const other = await lessonWith(s, ines, ['Pia'], { title: 'Another evening' });
  const room = (body: object) => request(s.url).post(`/api/lessons/${id}/room`).set('Cookie', ines).send(body);

  expect((await room({ tables: 1 })).body.error.fields.tables).toBe('5 students need at least 2 tables of 4.');
  expect((await room({ tables: 6 })).body.error.fields.tables).toMatch(/at most 5 tables/);
  expect((await room({ bot: 'oracle' })).body.error.fields.bot).toMatch(/A bot is/);
  expect((await request(s.url).post(`/api/lessons/${other.id}/room/start`).set('Cookie', ines)).body.error.code).toBe('NO_ROOM');

  const split = await room({});
  expect(split.status).toBe(201);
  const tables = split.body.tables as { id: string; seats: Record<string, { kind: string; displayName: string } | null>; seed: string }[];
  expect(tables).toHaveLength(2);
  const kinds = tables.map((t) => Object.values(t.seats).map((o) => o!.kind));
  expect(kinds).toEqual([
    ['user', 'user', 'user', 'bot'],
    ['user', 'user', 'bot', 'bot'],
  ]);
  // Students are dealt round the tables in the order they joined.
  expect(tables.map((t) => Object.values(t.seats).filter((o) => o!.kind === 'user').map((o) => o!.displayName))).toEqual([
    ['Theo', 'Ruth', 'Ada'],
    ['Mina', 'Sol'],
  ]);
  expect(tables.map((t) => t.seed)).toEqual(['harbor-lane-week-01', 'harbor-lane-week-01']);
  expect((await room({})).body.error.code).toBe('ROOM_EXISTS');

  // A student sees only their own table; a student of another lesson sees none and cannot open one.
  const theoRoom = await request(s.url).get(`/api/lessons/${id}/room`).set('Cookie', cookies.Theo);
  expect(theoRoom.body.tables.map((t: { id: string }) => t.id)).toEqual([tables[0].id]);
  expect(theoRoom.body.tables[0].seed).toBeNull();
  expect((await request(s.url).get(`/api/lessons/${id}/room`).set('Cookie', other.cookies.Pia)).status).toBe(403);
  expect((await request(s.url).get(`/api/tables/${tables[0].id}`).set('Cookie', other.cookies.Pia)).body.error.code).toBe('INVITE_REQUIRED');
  expect((await request(s.url).post(`/api/lessons/${id}/room/start`).set('Cookie', cookies.Theo)).status).toBe(403);

  const started = await request(s.url).post(`/api/lessons/${id}/room/start`).set('Cookie', ines);
  expect(started.body.started).toBe(2);
  const rows = await TableRow.findAll({ where: { id: tables.map((t) => t.id) } });
  expect(rows.map((r) => r.status)).toEqual(['playing', 'playing']);
  const exchanges = await ExchangeRow.findAll({ where: { tableId: tables.map((t) => t.id) } });
  // One deal at every table of the lesson: the same engine seed, derived from the lesson's seed name.
  expect(exchanges.map((e) => e.options.seedName)).toEqual(['harbor-lane-week-01', 'harbor-lane-week-01']);
  expect(new Set(exchanges.map((e) => e.options.seed)).size).toBe(1);
  expect(exchanges[0].options.seed).not.toBe('harbor-lane-week-01');

  // Theo plays at his table; Ines steps into its huddle, and Theo sees the pass held.
  const theo = await live.client('Theo', cookies.Theo);
  const joined = await theo.ok('table:join', { tableId: tables[0].id, as: 'player' });
  expect((joined.state as { mySeat: string }).mySeat).toBe('east');
  const host = await live.client('Ines', ines);
  await host.ok('table:join', { tableId: tables[0].id, as: 'spectator' });
  await host.ok('huddle:call');
  await theo.until((st) => st.huddle.open);
  // …and into the other table's too.
  await host.ok('table:join', { tableId: tables[1].id, as: 'spectator' });
  await host.ok('huddle:call');
  // Theo cannot walk into the other table.
  expect((await theo.emit('table:join', { tableId: tables[1].id, as: 'player' })).code).toBe('INVITE_REQUIRED');
});

test('a lesson played from a drill deals the drill at every table', async ({ server: s }) => {
  const ines = await teacher(s, 'Ines');
  const inesId = (await User.findOne({ where: { email: 'ines@harborlane.test' } }))!.id;
  const drill = await DrillRow.create({
    id: randomUUID(),
    ownerId: inesId,
    name: 'Harbor Lane week 2',
    description: '',
    seed: 'harbor-lane-week-02',
    jokers: false,
    secondCharleston: true,
    courtesy: true,
    racks: {},
    patternListId: STARTER_LIST_ID,
  });
  const { id } = await lessonWith(s, ines, ['Theo', 'Mina'], { seed: undefined, drillIds: [drill.id] });
  const split = await request(s.url).post(`/api/lessons/${id}/room`).set('Cookie', ines).send({ tables: 2 });
  expect(split.status).toBe(201);
  expect(split.body.tables.map((t: { drillId: string }) => t.drillId)).toEqual([drill.id, drill.id]);
  const rows = await TableRow.findAll({ where: { id: split.body.tables.map((t: { id: string }) => t.id) } });
  expect(rows.map((r) => [r.options.seed, r.options.jokers, r.options.drillName])).toEqual([
    ['harbor-lane-week-02', false, 'Harbor Lane week 2'],
    ['harbor-lane-week-02', false, 'Harbor Lane week 2'],
  ]);
  expect((await request(s.url).post(`/api/lessons/${id}/room`).set('Cookie', ines).send({ drillId: 'other' })).body.error.code).toBe('ROOM_EXISTS');
});
