/** A seat held by a checkout still open is shown apart from paid seats, with when the hold ends. */
import { expect } from 'vitest';
import { Enrollment, Payment, User } from '../../server/db/models';
import { signedIn } from './helpers';
import { createLesson, inviteToken, lessonTest } from './lesson-helpers';

const test = lessonTest([['ines@harborlane.test', 'teacher'], ['theo@harborlane.test'], ['mina@harborlane.test'], ['ruth@harborlane.test']]);

const minutes = (n: number) => new Date(Date.now() + n * 60_000);

test('paid seats, held seats and the end of the last hold are told apart; a student with two open checkouts holds one seat', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines, { priceCents: 1500, currency: 'usd', seats: 4 });
  const ids: Record<string, number> = {};
  for (const name of ['theo', 'mina', 'ruth']) {
    const { token } = await inviteToken(ines, lesson.id, `${name}@harborlane.test`);
    const student = await signedIn(t.app, `${name}@harborlane.test`);
    expect((await student.post(`/api/invitations/${token}/accept`)).status).toBe(200);
    ids[name] = (await User.findOne({ where: { email: `${name}@harborlane.test` } }))!.id;
  }
  const payment = { lessonId: lesson.id, amountCents: 1500, currency: 'usd' as const };
  // Mina paid; Theo left two checkouts open (the later one ends last); Ruth's hold has run out.
  await Payment.create({ ...payment, userId: ids.mina, status: 'paid', holdUntil: minutes(-30), paidAt: new Date() });
  await Enrollment.update({ status: 'paid' }, { where: { lessonId: lesson.id, userId: ids.mina } });
  const theoEnds = minutes(25);
  await Payment.create({ ...payment, userId: ids.theo, status: 'pending', holdUntil: minutes(10) });
  await Payment.create({ ...payment, userId: ids.theo, status: 'pending', holdUntil: theoEnds });
  await Payment.create({ ...payment, userId: ids.ruth, status: 'pending', holdUntil: minutes(-1) });

  const seen = (await ines.get(`/api/lessons/${lesson.id}`)).body.lesson;
  expect(seen).toMatchObject({ seats: 4, seatsTaken: 2, seatsHeld: 1, holdEndsAt: theoEnds.toISOString() });

  // Students see the same counts, in the list and on the lesson.
  const ruth = await signedIn(t.app, 'ruth@harborlane.test');
  expect((await ruth.get(`/api/lessons/${lesson.id}`)).body.lesson).toMatchObject({ seatsTaken: 2, seatsHeld: 1, holdEndsAt: theoEnds.toISOString() });
  expect((await ruth.get('/api/lessons')).body.attending[0]).toMatchObject({ seatsTaken: 2, seatsHeld: 1 });

  // Theo's holds run out: nothing is held any more.
  await Payment.update({ holdUntil: minutes(-1) }, { where: { userId: ids.theo } });
  expect((await ines.get(`/api/lessons/${lesson.id}`)).body.lesson).toMatchObject({ seatsTaken: 1, seatsHeld: 0, holdEndsAt: null });
});

test('a free lesson holds nothing', async ({ t }) => {
  const ines = await signedIn(t.app, 'ines@harborlane.test');
  const lesson = await createLesson(ines, { seats: 4 });
  expect((await ines.get(`/api/lessons/${lesson.id}`)).body.lesson).toMatchObject({ seatsTaken: 0, seatsHeld: 0, holdEndsAt: null });
});
