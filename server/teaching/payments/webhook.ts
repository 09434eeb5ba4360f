/**
 * The payment service's webhook: only an event whose signature the SDK accepts changes anything,
 * each event once however often it repeats, and a payment that finds no seat is refunded.
 */
import express, { Router } from 'express';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import Stripe from 'stripe';
import { formatMoney } from '../../../shared/lessons';
import { Enrollment, Lesson, Payment, PaymentEvent, User } from '../../db/models';
import type { RefundReason } from '../../db/models/payment';
import { HttpError } from '../../errors';
import { log } from '../../log';
import { publicBase } from '../../services/links';
import { alreadyPaidRefundMail, receiptMail, refundMail } from '../../services/mail/messages';
import { seatsTaken, seatTransaction } from '../lessons/seats';
import { expireSessions, paymentsOff, type PaymentDeps } from './service';

/**
 * `POST /api/payments/webhook`: mounted ahead of the JSON parser and the origin check, because the
 * signature covers the exact bytes sent and the sender is the payment service, not a browser.
 */
export function paymentsWebhookRouter({ config, sequelize, mailer, stripe }: PaymentDeps) {
  const router = Router();
  router.post('/', express.raw({ type: 'application/json', limit: '256kb' }), async (req, res) => {
    const signature = req.headers['stripe-signature'];
    if (!Buffer.isBuffer(req.body) || typeof signature !== 'string') {
      throw new HttpError(400, 'UNSIGNED_WEBHOOK', 'A webhook must carry a JSON body and a Stripe-Signature header.');
    }
    // With payments off, nothing here could be paid: no event is taken, whoever signed it.
    if (!stripe) throw paymentsOff();
    let event: Stripe.Event;
    try {
      // The SDK's check: the HMAC of "<timestamp>.<body>" under our secret, and a recent timestamp.
      event = Stripe.webhooks.constructEvent(req.body, signature, config.stripeWebhookSecret);
    } catch {
      log.warn({ signature: signature.slice(0, 20) }, 'Refused a webhook whose signature did not verify');
      throw new HttpError(400, 'BAD_SIGNATURE', 'The webhook signature does not match, so nothing was changed.');
    }
    const outcome = await handleEvent(event, { config, sequelize, mailer, stripe, base: publicBase(config) });
    res.json({ received: true, outcome });
  });
  return router;
}

type Outcome = 'ignored' | 'duplicate' | 'paid' | 'already-paid' | 'refunded' | 'refund-due' | 'expired' | 'mismatch' | 'unknown-session';

interface Handled {
  outcome: Outcome;
  refundReason?: RefundReason;
  /** This student's other open checkouts, to expire once a payment took the seat. */
  expire?: (string | null)[];
}

const PAYABLE = ['pending', 'expired'] as const;

async function handleEvent(event: Stripe.Event, deps: PaymentDeps & { base: string }): Promise<Outcome> {
  if (event.type !== 'checkout.session.completed' && event.type !== 'checkout.session.expired') {
    try {
      const [, created] = await PaymentEvent.findOrCreate({ where: { eventId: event.id }, defaults: { eventId: event.id, type: event.type, paymentId: null } });
      return created ? 'ignored' : 'duplicate';
    } catch (err) {
      if (err instanceof UniqueConstraintError) return 'duplicate';
      throw err;
    }
  }
  const session = event.data.object as Stripe.Checkout.Session;
  const found = await Payment.findOne({ where: { checkoutSessionId: session.id } });
  if (!found) {
    log.warn({ session: session.id }, 'A webhook named a checkout session we never created');
    return 'unknown-session';
  }
  const lesson = (await Lesson.findByPk(found.lessonId))!;
  let handled: Handled;
  try {
    handled = await seatTransaction(deps.sequelize, lesson.id, (transaction) => place(event, session, found.id, lesson, transaction));
  } catch (err) {
    // The same event taken at the same instant by another process: its unique id kept it to one.
    if (err instanceof UniqueConstraintError && (await PaymentEvent.findOne({ where: { eventId: event.id } }))) return 'duplicate';
    // Anything else (say, another process sold this seat at the same instant): nothing was stored,
    // and the failed answer makes the service send the event again, when it finds the seat taken.
    throw err;
  }

  const payment = (await Payment.findByPk(found.id))!;
  if (handled.outcome === 'paid') {
    const payer = await User.findByPk(payment.userId);
    if (payer) {
      const amount = formatMoney(payment.amountCents, payment.currency);
      const mail = receiptMail(lesson, payer.displayName, amount, payment.id, `${deps.base}/lessons/${lesson.id}/receipt?session_id=${payment.checkoutSessionId}`);
      await deps.mailer.send({ to: payer.email, ...mail, kind: 'receipt' }).catch((err) => log.error({ err }, 'The receipt mail could not be sent'));
    }
    await expireSessions(deps.stripe, handled.expire ?? []);
  }
  if (handled.outcome === 'refund-due') return (await refund(payment, deps)) ? 'refunded' : 'refund-due';
  return handled.outcome;
}

/**
 * One event, under the lesson's seat lock. The event's id is stored first (unique), so a repeat
 * changes nothing; every change of status is a conditional update from the status read, so a
 * payment is placed once whatever else runs; and the student's place goes to `paid` only from
 * another status, so of two payments for one seat exactly one takes it and the other is refunded.
 */
async function place(event: Stripe.Event, session: Stripe.Checkout.Session, paymentId: number, lesson: Lesson, transaction: Transaction): Promise<Handled> {
  if (await PaymentEvent.findOne({ where: { eventId: event.id }, transaction })) return { outcome: 'duplicate' };
  await PaymentEvent.create({ eventId: event.id, type: event.type, paymentId }, { transaction });
  const payment = (await Payment.findByPk(paymentId, { transaction }))!;
  const mine = { id: payment.id, status: { [Op.in]: [...PAYABLE] } };

  if (event.type === 'checkout.session.expired') {
    const [changed] = await Payment.update({ status: 'expired' }, { where: { id: payment.id, status: 'pending' }, transaction });
    return { outcome: changed ? 'expired' : 'ignored' };
  }
  if (payment.status === 'paid') return { outcome: 'already-paid' };
  if (!(PAYABLE as readonly string[]).includes(payment.status)) return { outcome: 'ignored' };
  if (session.payment_status !== 'paid') return { outcome: 'ignored' };
  const intent = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  if (session.amount_total !== payment.amountCents || session.currency !== payment.currency) {
    await Payment.update({ status: 'failed', paymentIntentId: intent, note: `Amount ${session.amount_total} ${session.currency} does not match.` }, { where: mine, transaction });
    return { outcome: 'mismatch' };
  }

  const where = { lessonId: lesson.id, userId: payment.userId };
  const seat = await Enrollment.findOne({ where, transaction });
  let reason: RefundReason | null = null;
  if (seat?.status === 'paid') reason = 'already-paid';
  // Every seat held now, this student's own checkouts aside: if none is left, refund.
  else if ((await seatsTaken(lesson, transaction, payment.userId)) >= lesson.seats) reason = 'lesson-full';
  else if (seat) {
    const [taken] = await Enrollment.update({ status: 'paid' }, { where: { ...where, status: { [Op.ne]: 'paid' } }, transaction });
    if (!taken) reason = 'already-paid';
  } else {
    await Enrollment.create({ ...where, status: 'paid' }, { transaction });
  }

  if (reason) {
    const note = reason === 'already-paid' ? 'The seat was already paid by another payment.' : 'The lesson filled before this payment arrived.';
    await Payment.update({ status: 'refund-due', refundReason: reason, paymentIntentId: intent, note }, { where: mine, transaction });
    return { outcome: 'refund-due', refundReason: reason };
  }
  const [paid] = await Payment.update({ status: 'paid', paymentIntentId: intent, paidAt: new Date() }, { where: mine, transaction });
  if (!paid) throw new Error(`Payment ${payment.id} changed while its seat was being placed`);
  // The student's other checkouts hold no seat any more, and their pages should take no more money.
  const others = await Payment.findAll({ where: { ...where, status: 'pending', id: { [Op.ne]: payment.id } }, transaction });
  if (others.length) {
    await Payment.update({ status: 'expired', note: 'The seat was paid through another checkout.' }, { where: { id: others.map((o) => o.id), status: 'pending' }, transaction });
  }
  return { outcome: 'paid', expire: others.map((o) => o.checkoutSessionId) };
}

/**
 * Gives the money back for a payment that found no seat, or found its seat already paid; a
 * failure leaves it `refund-due` for a person to see. The idempotency key makes a second attempt
 * for the same payment answer the first refund instead of refunding twice.
 */
async function refund(payment: Payment, deps: PaymentDeps): Promise<boolean> {
  if (!deps.stripe || !payment.paymentIntentId) return false;
  const reason: RefundReason = payment.refundReason ?? 'lesson-full';
  try {
    const done = await deps.stripe.refunds.create(
      { payment_intent: payment.paymentIntentId, metadata: { paymentId: String(payment.id), reason } },
      { idempotencyKey: `rackside-refund-${payment.id}` },
    );
    const [changed] = await Payment.update({ status: 'refunded', refundId: done.id, refundedAt: new Date() }, { where: { id: payment.id, status: 'refund-due' } });
    if (!changed) return true;
  } catch (err) {
    log.error({ err, payment: payment.id }, 'A refund failed; the payment stays refund-due');
    return false;
  }
  const lesson = (await Lesson.findByPk(payment.lessonId))!;
  const payer = await User.findByPk(payment.userId);
  if (payer) {
    const amount = formatMoney(payment.amountCents, payment.currency);
    const mail = reason === 'already-paid' ? alreadyPaidRefundMail(lesson, payer.displayName, amount) : refundMail(lesson, payer.displayName, amount);
    await deps.mailer.send({ to: payer.email, ...mail, kind: 'refund' }).catch((err) => log.error({ err }, 'The refund mail could not be sent'));
  }
  return true;
}
