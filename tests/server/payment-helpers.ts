/** Helpers for payment tests against a live server and the local payment fake. */
import request from 'supertest';
import { expect } from 'vitest';
import { Payment, User } from '../../server/db/models';
import type { Delivery } from '../../server/services/payments/fake-server';
import type { Server } from './live';
import { lessonBody, linkIn, mailsTo } from './lesson-helpers';

/** Registers and signs in through the real server; returns the cookie. */
export async function account(s: Server, name: string, role: 'player' | 'teacher' = 'player') {
  const email = `${name.toLowerCase()}@harborlane.test`;
  await request(s.url).post('/api/auth/register').send({ email, password: 'tiles-and-tea', displayName: name });
  if (role !== 'player') await User.update({ role }, { where: { email } });
  const res = await request(s.url).post('/api/auth/login').send({ email, password: 'tiles-and-tea' });
  return (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('rackside.sid='))!.split(';')[0];
}

/** A priced lesson with `seats` seats, and each student invited by mail and accepted through the mailed link. */
export async function pricedLesson(s: Server, students: string[], seats: number) {
  const ines = await account(s, 'Ines', 'teacher');
  const created = await request(s.url).post('/api/lessons').set('Cookie', ines).send(lessonBody({ priceCents: 1500, currency: 'usd', seats }));
  expect(created.status).toBe(201);
  const lessonId = created.body.lesson.id as number;
  const cookies: Record<string, string> = {};
  for (const name of students) {
    const email = `${name.toLowerCase()}@harborlane.test`;
    cookies[name] = await account(s, name);
    expect((await request(s.url).post(`/api/lessons/${lessonId}/invitations`).set('Cookie', ines).send({ emails: [email] })).status).toBe(201);
    const token = new URL(linkIn((await mailsTo(email, 'invitation')).at(-1)!, '/invitations')).pathname.split('/').pop();
    const accepted = await request(s.url).post(`/api/invitations/${token}/accept`).set('Cookie', cookies[name]);
    expect(accepted.body.next).toBe('pay');
  }
  return { ines, lessonId, cookies };
}

export async function checkout(s: Server, cookie: string, lessonId: number) {
  return request(s.url).post('/api/payments/checkout').set('Cookie', cookie).send({ lessonId });
}

/** What Rackside answered a webhook delivery. */
export function outcome(delivery: Delivery | null): string {
  if (!delivery) throw new Error('The event was not delivered');
  expect(delivery.status, delivery.body).toBe(200);
  return (JSON.parse(delivery.body) as { outcome: string }).outcome;
}

/** Lets a checkout's seat hold run out, as if the student had left the payment page open for long. */
export async function endHold(paymentId: number) {
  await Payment.update({ holdUntil: new Date(Date.now() - 1000) }, { where: { id: paymentId } });
}

/** The checkout session behind a payment. */
export async function sessionOf(paymentId: number): Promise<string> {
  return (await Payment.findByPk(paymentId))!.checkoutSessionId!;
}

/** The lesson as the student sees it: their place and the seats taken. */
export async function lessonSeen(s: Server, cookie: string, lessonId: number) {
  const res = await request(s.url).get(`/api/lessons/${lessonId}`).set('Cookie', cookie);
  return res.body.lesson as { myStatus: string | null; seatsTaken: number };
}
