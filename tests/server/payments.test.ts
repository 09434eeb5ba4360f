import Stripe from 'stripe';
import request from 'supertest';
import { expect } from 'vitest';
import { LOCAL_WEBHOOK_SECRET } from '../../server/config';
import { Enrollment, Mail, Payment, PaymentEvent, User } from '../../server/db/models';
import { liveTest as test } from './live';
import { lessonBody, mailsTo } from './lesson-helpers';
import { account, checkout, pricedLesson } from './payment-helpers';

test('a seat is paid through the SDK and the fake checkout page; a repeated webhook pays it once', async ({ server: s }) => {
  const { lessonId, cookies } = await pricedLesson(s, ['Theo'], 2);
  const started = await checkout(s, cookies.Theo, lessonId);
  expect(started.status).toBe(201);
  const url = new URL(started.body.url);
  expect(url.origin).toBe(s.fakes.payments!.url);
  // Asking again while the checkout is open hands back the same one.
  expect((await checkout(s, cookies.Theo, lessonId)).body.url).toBe(started.body.url);

  // The fake's own page (no card field, nothing of Rackside's), then its "Pay" button.
  const page = await fetch(url);
  const html = await page.text();
  expect(html).toContain('Local test checkout');
  expect(html).toContain('$15.00');
  expect(html).not.toMatch(/card number/i);
  const paid = await fetch(`${url.origin}${url.pathname}/pay`, { method: 'POST', redirect: 'manual' });
  expect(paid.status).toBe(303);
  const back = new URL(paid.headers.get('location')!);
  expect(back.pathname).toBe(`/lessons/${lessonId}/receipt`);
  const sessionId = back.searchParams.get('session_id')!;
  expect(sessionId).toMatch(/^cs_test_/);

  const delivery = s.fakes.payments!.deliveries.at(-1)!;
  expect(delivery.status).toBe(200);
  expect(JSON.parse(delivery.body)).toEqual({ received: true, outcome: 'paid' });
  const receipt = await request(s.url).get(`/api/payments/session/${sessionId}`).set('Cookie', cookies.Theo);
  expect(receipt.body.receipt).toMatchObject({ status: 'paid', amountCents: 1500, currency: 'usd', payerName: 'Theo', lesson: { id: lessonId, teacherName: 'Ines' } });
  expect(receipt.body.receipt.message).toMatch(/Your seat is yours/);
  expect((await request(s.url).get(`/api/lessons/${lessonId}`).set('Cookie', cookies.Theo)).body.lesson).toMatchObject({ myStatus: 'paid', seatsTaken: 1 });

  // The service may deliver the same event again: nothing changes.
  const resent = await fetch(`${s.fakes.payments!.url}/_fake/events/${delivery.eventId}/resend`, { method: 'POST' });
  expect(JSON.parse((await resent.json()).delivery.body)).toEqual({ received: true, outcome: 'duplicate' });
  expect(await Payment.count({ where: { status: 'paid' } })).toBe(1);
  expect(await PaymentEvent.count()).toBe(1);
  expect(await Mail.count({ where: { kind: 'receipt' } })).toBe(1);
  expect((await mailsTo('theo@harborlane.test', 'receipt'))[0].text).toMatch(/Amount: \$15\.00\. Receipt number: R-\d+/);

  // Paying twice is refused plainly.
  expect((await checkout(s, cookies.Theo, lessonId)).body.error.code).toBe('ALREADY_PAID');
});

test('an unsigned, forged, altered or stale webhook is refused and changes nothing', async ({ server: s }) => {
  const { lessonId, cookies } = await pricedLesson(s, ['Mina'], 2);
  const started = await checkout(s, cookies.Mina, lessonId);
  const payment = (await Payment.findByPk(started.body.paymentId))!;
  const session = { ...s.fakes.payments!.sessions.get(payment.checkoutSessionId!)!, status: 'complete', payment_status: 'paid', payment_intent: 'pi_forged' };
  const event = { id: 'evt_forged_1', object: 'event', type: 'checkout.session.completed', created: Math.floor(Date.now() / 1000), data: { object: session } };
  const body = JSON.stringify(event);
  const hook = () => request(s.url).post('/api/payments/webhook').set('Content-Type', 'application/json');

  const unsigned = await hook().send(body);
  expect(unsigned.status).toBe(400);
  expect(unsigned.body.error.code).toBe('UNSIGNED_WEBHOOK');
  // stripe-node docs: webhooks.generateTestHeaderString signs a payload for tests.
  const forged = Stripe.webhooks.generateTestHeaderString({ payload: body, secret: 'whsec_someone_else' });
  expect((await hook().set('Stripe-Signature', forged).send(body)).body.error.code).toBe('BAD_SIGNATURE');
  const good = Stripe.webhooks.generateTestHeaderString({ payload: body, secret: LOCAL_WEBHOOK_SECRET });
  const altered = body.replace('"amount_total":1500', '"amount_total":1');
  expect((await hook().set('Stripe-Signature', good).send(altered)).status).toBe(400);
  // The SDK's default tolerance is 300 seconds (stripe-node docs: DEFAULT_TOLERANCE).
  const stale = Stripe.webhooks.generateTestHeaderString({ payload: body, secret: LOCAL_WEBHOOK_SECRET, timestamp: Math.floor(Date.now() / 1000) - 3600 });
  expect((await hook().set('Stripe-Signature', stale).send(body)).status).toBe(400);
  expect((await hook().set('Stripe-Signature', good).set('Content-Type', 'text/plain').send(body)).status).toBe(400);

  await payment.reload();
  expect(payment.status).toBe('pending');
  expect(await PaymentEvent.count()).toBe(0);
  expect((await Enrollment.findOne({ where: { lessonId } }))!.status).toBe('enrolled');

  // The same event signed with our secret is accepted: the check is the signature, nothing else.
  const accepted = await hook().set('Stripe-Signature', good).send(body);
  expect(accepted.body).toEqual({ received: true, outcome: 'paid' });
});

test('two students start checkout for the last seat at once: one gets it, the other is told it is taken', async ({ server: s }) => {
  const { lessonId, cookies } = await pricedLesson(s, ['Theo', 'Mina'], 1);
  const [a, b] = await Promise.all([checkout(s, cookies.Theo, lessonId), checkout(s, cookies.Mina, lessonId)]);
  expect([a.status, b.status].sort()).toEqual([201, 409]);
  const refused = a.status === 409 ? a : b;
  expect(refused.body.error).toMatchObject({ code: 'LESSON_FULL' });
  expect(refused.body.error.message).toMatch(/All 1 seats of .* are taken or being paid for right now/);
  expect(s.fakes.payments!.sessions.size).toBe(1);
});

test('two payments for the last seat land at once: exactly one seat is sold, the other is refunded', async ({ live }) => {
  // No hold, so both checkouts open, as when holds ran out while both students were on the payment page.
  const s = await live.start({ seatHoldMs: 0 });
  const { lessonId, cookies } = await pricedLesson(s, ['Theo', 'Mina'], 1);
  const a = await checkout(s, cookies.Theo, lessonId);
  const b = await checkout(s, cookies.Mina, lessonId);
  expect([a.status, b.status]).toEqual([201, 201]);
  const ids = [...s.fakes.payments!.sessions.keys()];
  const results = await Promise.all(ids.map((id) => s.fakes.payments!.pay(id)));
  const outcomes = results.map((r) => JSON.parse(r.delivery!.body).outcome).sort();
  expect(outcomes).toEqual(['paid', 'refunded']);

  expect(await Enrollment.count({ where: { lessonId, status: 'paid' } })).toBe(1);
  expect(await Payment.count({ where: { status: 'paid' } })).toBe(1);
  const refunded = (await Payment.findOne({ where: { status: 'refunded' } }))!;
  expect(s.fakes.payments!.refunds).toEqual([expect.objectContaining({ payment_intent: refunded.paymentIntentId, amount: 1500 })]);
  const loser = (await User.findByPk(refunded.userId))!;
  const receipt = await request(s.url).get(`/api/payments/${refunded.id}`).set('Cookie', cookies[loser.displayName]);
  expect(receipt.body.receipt.status).toBe('refunded');
  expect(receipt.body.receipt.message).toMatch(/refunded you in full/);
  expect((await mailsTo(loser.email, 'refund'))[0].subject).toMatch(/Refund for/);
});

test('the checkout form and receipts: bad input, the wrong student, a free lesson', async ({ server: s }) => {
  const { ines, lessonId, cookies } = await pricedLesson(s, ['Theo'], 3);
  const sol = await account(s, 'Sol');
  expect((await request(s.url).post('/api/payments/checkout').set('Cookie', sol).send({})).body.error.fields.lessonId).toMatch(/Name the lesson/);
  expect((await request(s.url).post('/api/payments/checkout').set('Cookie', sol).send({ lessonId: 'one' })).status).toBe(400);
  expect((await checkout(s, sol, 999)).status).toBe(404);
  expect((await checkout(s, sol, lessonId)).body.error.code).toBe('NOT_IN_LESSON');
  const free = await request(s.url).post('/api/lessons').set('Cookie', ines).send(lessonBody());
  expect((await checkout(s, ines, free.body.lesson.id)).body.error.code).toBe('NOT_IN_LESSON');

  const started = await checkout(s, cookies.Theo, lessonId);
  expect((await request(s.url).get(`/api/payments/${started.body.paymentId}`).set('Cookie', sol)).status).toBe(403);
  expect((await request(s.url).get(`/api/payments/${started.body.paymentId}`).set('Cookie', ines)).body.receipt.status).toBe('pending');
  expect((await request(s.url).get('/api/payments/session/cs_test_nothing').set('Cookie', cookies.Theo)).status).toBe(404);
});
