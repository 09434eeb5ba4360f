/**
 * One seat, two checkouts: a student who starts checkout again after the first hold ran out, and
 * pays both, keeps one paid seat and gets the other payment back, whatever order the payment
 * service's events arrive in, late, twice, or at the same instant.
 */
import { UniqueConstraintError } from 'sequelize';
import request from 'supertest';
import { expect } from 'vitest';
import { openDatabase } from '../../server/db';
import { migrate, migrator } from '../../server/db/migrate';
import { Enrollment, Mail, Payment } from '../../server/db/models';
import { liveTest as test, type Server } from './live';
import { mailsTo } from './lesson-helpers';
import { checkout, endHold, lessonSeen, outcome, pricedLesson, sessionOf } from './payment-helpers';

/** Starts a checkout, lets its hold run out, and starts a second one; `before` runs in between. */
async function twoCheckouts(s: Server, cookie: string, lessonId: number, before?: (firstSession: string) => Promise<unknown>) {
  const first = await checkout(s, cookie, lessonId);
  expect(first.status).toBe(201);
  const firstSession = await sessionOf(first.body.paymentId);
  await before?.(firstSession);
  await endHold(first.body.paymentId);
  const second = await checkout(s, cookie, lessonId);
  expect(second.status).toBe(201);
  expect(second.body.paymentId).not.toBe(first.body.paymentId);
  return { first: first.body.paymentId as number, second: second.body.paymentId as number, firstSession, secondSession: await sessionOf(second.body.paymentId) };
}

async function statusOf(paymentId: number) {
  return (await Payment.findByPk(paymentId))!.status;
}

/** One paid payment, one receipt, a paid place and the seat counted once. */
async function expectOneSeat(s: Server, cookie: string, lessonId: number, email: string) {
  expect(await Payment.count({ where: { lessonId, status: 'paid' } })).toBe(1);
  expect((await mailsTo(email, 'receipt')).length).toBe(1);
  expect(await lessonSeen(s, cookie, lessonId)).toMatchObject({ myStatus: 'paid', seatsTaken: 1 });
}

test('a new checkout expires the one it replaces at the payment service, so the old page takes no money', async ({ server: s }) => {
  const fake = s.fakes.payments!;
  const { lessonId, cookies } = await pricedLesson(s, ['Theo'], 2);
  const { first, firstSession, secondSession } = await twoCheckouts(s, cookies.Theo, lessonId);

  expect(fake.sessions.get(firstSession)!.status).toBe('expired');
  await expect(fake.pay(firstSession)).rejects.toThrow(/expired/);
  // The service tells us of the expiry too; it changes nothing more.
  await fake.idle();
  const expiredEvent = [...fake.events.values()].find((e) => e.type === 'checkout.session.expired')!;
  expect(outcome(fake.deliveries.find((d) => d.eventId === expiredEvent.id)!)).toMatch(/^(expired|ignored)$/);
  expect(await statusOf(first)).toBe('expired');
  expect(await lessonSeen(s, cookies.Theo, lessonId)).toMatchObject({ myStatus: 'enrolled', seatsTaken: 1 });

  expect(outcome((await fake.pay(secondSession)).delivery)).toBe('paid');
  await expectOneSeat(s, cookies.Theo, lessonId, 'theo@harborlane.test');
  expect(fake.refunds).toEqual([]);
});

test('both checkouts paid, the older payment heard of late: the seat is paid once and the late payment refunded', async ({ server: s }) => {
  const fake = s.fakes.payments!;
  const { lessonId, cookies } = await pricedLesson(s, ['Theo'], 2);
  // The first is paid on the service's page, but its event is slow to come: too late to expire it.
  let firstEvent = '';
  const { first, second, secondSession } = await twoCheckouts(s, cookies.Theo, lessonId, async (session) => {
    firstEvent = (await fake.pay(session, { deliver: false })).event.id;
  });
  expect(outcome((await fake.pay(secondSession)).delivery)).toBe('paid');
  expect(outcome(await fake.deliver(firstEvent))).toBe('refunded');

  expect(await statusOf(second)).toBe('paid');
  const late = (await Payment.findByPk(first))!;
  expect(late.status).toBe('refunded');
  expect(fake.refunds).toEqual([expect.objectContaining({ payment_intent: late.paymentIntentId, amount: 1500 })]);
  await expectOneSeat(s, cookies.Theo, lessonId, 'theo@harborlane.test');
  const refundMails = await mailsTo('theo@harborlane.test', 'refund');
  expect(refundMails.length).toBe(1);
  expect(refundMails[0].text).toMatch(/already paid/);
  expect(refundMails[0].text).toContain('$15.00');
  const receipt = await request(s.url).get(`/api/payments/${first}`).set('Cookie', cookies.Theo);
  expect(receipt.body.receipt).toMatchObject({ status: 'refunded' });
  expect(receipt.body.receipt.message).toMatch(/already paid/);

  // The same event again changes nothing: no second refund, no second mail.
  expect(outcome(await fake.deliver(firstEvent))).toBe('duplicate');
  expect(fake.refunds.length).toBe(1);
  expect((await mailsTo('theo@harborlane.test', 'refund')).length).toBe(1);
  await expectOneSeat(s, cookies.Theo, lessonId, 'theo@harborlane.test');
});

test('a payment made after the seat is already paid is refunded, and the seat counts once meanwhile', async ({ server: s }) => {
  const fake = s.fakes.payments!;
  const { lessonId, cookies } = await pricedLesson(s, ['Theo'], 2);
  // The service cannot be reached to expire anything, so both checkout pages stay open.
  fake.outage.add('expire');
  const { first, second, firstSession, secondSession } = await twoCheckouts(s, cookies.Theo, lessonId);
  expect(fake.sessions.get(firstSession)!.status).toBe('open');

  expect(outcome((await fake.pay(firstSession)).delivery)).toBe('paid');
  // The second checkout no longer holds a seat: the student has one, paid.
  expect(await lessonSeen(s, cookies.Theo, lessonId)).toMatchObject({ myStatus: 'paid', seatsTaken: 1 });
  expect(outcome((await fake.pay(secondSession)).delivery)).toBe('refunded');

  expect(await statusOf(first)).toBe('paid');
  expect(await statusOf(second)).toBe('refunded');
  expect(fake.refunds).toEqual([expect.objectContaining({ payment_intent: (await Payment.findByPk(second))!.paymentIntentId })]);
  expect((await mailsTo('theo@harborlane.test', 'refund')).length).toBe(1);
  await expectOneSeat(s, cookies.Theo, lessonId, 'theo@harborlane.test');
});

test('when the refund cannot be made it stays due, and the student is told it is on its way', async ({ server: s }) => {
  const fake = s.fakes.payments!;
  const { lessonId, cookies } = await pricedLesson(s, ['Theo'], 2);
  fake.outage.add('expire');
  fake.outage.add('refunds');
  const { second, firstSession, secondSession } = await twoCheckouts(s, cookies.Theo, lessonId);
  expect(outcome((await fake.pay(firstSession)).delivery)).toBe('paid');
  expect(outcome((await fake.pay(secondSession)).delivery)).toBe('refund-due');
  const receipt = await request(s.url).get(`/api/payments/${second}`).set('Cookie', cookies.Theo);
  expect(receipt.body.receipt.status).toBe('refund-due');
  expect(receipt.body.receipt.message).toMatch(/already paid.*refund is on its way/);
  await expectOneSeat(s, cookies.Theo, lessonId, 'theo@harborlane.test');
});

test('completed and expired events in either order leave one paid seat and the right count', async ({ server: s }) => {
  const fake = s.fakes.payments!;
  const { lessonId, cookies } = await pricedLesson(s, ['Theo', 'Mina'], 3);
  fake.holdDeliveries = true;

  for (const [name, order] of [['Theo', 'completed first'], ['Mina', 'expired first']] as const) {
    fake.held.length = 0;
    const before = (await lessonSeen(s, cookies[name], lessonId)).seatsTaken;
    const { first, second, secondSession } = await twoCheckouts(s, cookies[name], lessonId);
    await fake.pay(secondSession);
    const expired = fake.held.find((id) => fake.events.get(id)!.type === 'checkout.session.expired')!;
    const completed = fake.held.find((id) => fake.events.get(id)!.type === 'checkout.session.completed')!;
    expect(expired, 'the replaced checkout was expired at the service').toBeTruthy();
    const sequence = order === 'completed first' ? [completed, expired] : [expired, completed];
    for (const id of sequence) await fake.deliver(id);
    expect(await statusOf(first), name).toBe('expired');
    expect(await statusOf(second), name).toBe('paid');
    expect(await lessonSeen(s, cookies[name], lessonId), name).toMatchObject({ myStatus: 'paid', seatsTaken: before + 1 });
    // Every event again, in the other order: nothing changes.
    for (const id of [...sequence].reverse()) expect(outcome(await fake.deliver(id))).toBe('duplicate');
    expect(await lessonSeen(s, cookies[name], lessonId)).toMatchObject({ seatsTaken: before + 1 });
  }
  expect(await Payment.count({ where: { lessonId, status: 'paid' } })).toBe(2);
  expect(await Mail.count({ where: { kind: 'receipt' } })).toBe(2);
  expect(fake.refunds).toEqual([]);
});

test('two completed payments for one seat reach the webhook at the same instant: one paid, one refunded', async ({ server: s }) => {
  const fake = s.fakes.payments!;
  const { lessonId, cookies } = await pricedLesson(s, ['Theo', 'Mina'], 2);
  let firstEvent = '';
  const { secondSession } = await twoCheckouts(s, cookies.Theo, lessonId, async (session) => {
    firstEvent = (await fake.pay(session, { deliver: false })).event.id;
  });
  const secondEvent = (await fake.pay(secondSession, { deliver: false })).event.id;

  const deliveries = await Promise.all([fake.deliver(firstEvent), fake.deliver(secondEvent)]);
  expect(deliveries.map(outcome).sort()).toEqual(['paid', 'refunded']);
  expect(fake.refunds.length).toBe(1);
  expect(await Enrollment.count({ where: { lessonId, status: 'paid' } })).toBe(1);
  await expectOneSeat(s, cookies.Theo, lessonId, 'theo@harborlane.test');

  // Both again at once, and the very same event twice at once: nothing changes.
  const again = await Promise.all([fake.deliver(firstEvent), fake.deliver(secondEvent), fake.deliver(firstEvent)]);
  expect(again.map(outcome)).toEqual(['duplicate', 'duplicate', 'duplicate']);
  const mina = await checkout(s, cookies.Mina, lessonId);
  const minaEvent = (await fake.pay(await sessionOf(mina.body.paymentId), { deliver: false })).event.id;
  const twice = await Promise.all([fake.deliver(minaEvent), fake.deliver(minaEvent)]);
  expect(twice.map(outcome).sort()).toEqual(['duplicate', 'paid']);

  expect(fake.refunds.length).toBe(1);
  expect((await mailsTo('theo@harborlane.test', 'refund')).length).toBe(1);
  expect((await mailsTo('mina@harborlane.test', 'receipt')).length).toBe(1);
  expect(await lessonSeen(s, cookies.Mina, lessonId)).toMatchObject({ myStatus: 'paid', seatsTaken: 2 });
});

test('two checkouts started at the same instant by one student leave one open checkout page', async ({ server: s }) => {
  const fake = s.fakes.payments!;
  const { lessonId, cookies } = await pricedLesson(s, ['Theo'], 2);
  const both = await Promise.all([checkout(s, cookies.Theo, lessonId), checkout(s, cookies.Theo, lessonId)]);
  // Either the second found the first ready and took it, or it replaced the first, which says so.
  const started = both.filter((r) => r.status === 201 || r.status === 200);
  const urls = new Set(started.map((r) => r.body.url as string));
  expect(urls.size).toBe(1);
  for (const r of both.filter((r) => !started.includes(r))) expect([r.status, r.body.error.code]).toEqual([409, 'CHECKOUT_REPLACED']);
  const open = [...fake.sessions.values()].filter((session) => session.status === 'open');
  expect(open.map((session) => session.url)).toEqual([...urls]);
  const pending = await Payment.findAll({ where: { lessonId, status: 'pending' } });
  expect(pending.map((p) => p.checkoutSessionId)).toEqual([open[0].id]);
  expect(await lessonSeen(s, cookies.Theo, lessonId)).toMatchObject({ seatsTaken: 1 });
});

test('the database keeps one paid payment per seat; seats already paid twice are set aside for a refund by hand', async () => {
  const db = await openDatabase('sqlite::memory:');
  try {
    await migrator(db).up({ to: '0006-table-revision' });
    const qi = db.getQueryInterface();
    const at = (minute: number) => new Date(Date.UTC(2030, 0, 1, 12, minute));
    const stamps = { createdAt: at(0), updatedAt: at(0) };
    await qi.bulkInsert('Users', [1, 2, 3].map((id) => ({ id, email: `u${id}@harborlane.test`, passwordHash: 'x', displayName: `U${id}`, role: id === 1 ? 'teacher' : 'player', ...stamps })));
    await qi.bulkInsert('Lessons', [{ id: 1, teacherId: 1, title: 'Week 1', description: '', startsAt: at(0), timeZone: 'UTC', durationMinutes: 60, seats: 4, priceCents: 1500, currency: 'usd', drillIds: '[]', ...stamps }]);
    const paid = (id: number, userId: number, minute: number) => ({ id, lessonId: 1, userId, status: 'paid', amountCents: 1500, currency: 'usd', holdUntil: at(minute), paidAt: at(minute), ...stamps });
    // User 2 paid twice (the second payment first in id order, paid later); user 3 once.
    await qi.bulkInsert('Payments', [paid(1, 2, 20), paid(2, 2, 10), paid(3, 3, 15)]);

    await migrate(db);
    const rows = await Payment.findAll({ order: [['id', 'ASC']] });
    expect(rows.map((p) => [p.id, p.status, p.refundReason])).toEqual([
      [1, 'refund-due', 'already-paid'],
      [2, 'paid', null],
      [3, 'paid', null],
    ]);
    // A second paid payment for one seat is refused by the database itself.
    await expect(Payment.update({ status: 'paid' }, { where: { id: 1 } })).rejects.toThrow(UniqueConstraintError);
    const another = { lessonId: 1, userId: 3, amountCents: 1500, currency: 'usd' as const, holdUntil: at(30) };
    await expect(Payment.create({ ...another, status: 'paid' })).rejects.toThrow(UniqueConstraintError);
    await Payment.create({ ...another, status: 'refunded' });
  } finally {
    await db.close();
  }
});
