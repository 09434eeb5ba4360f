/**
 * Paid seats. A checkout holds a seat for a while; only a webhook whose signature the SDK accepts
 * marks it paid, once, however often the event repeats; a payment that arrives for a seat that
 * is no longer free is refunded at once. The card form lives on the payment service's own page.
 */
import express, { Router } from 'express';
import type { Sequelize } from 'sequelize';
import Stripe from 'stripe';
import { checkoutInputSchema, formatMoney, type ReceiptDto } from '../../shared/lessons';
import { requireUser } from '../auth/guards';
import type { Config } from '../config';
import { Enrollment, Lesson, Payment, PaymentEvent, User } from '../db/models';
import { badInput, HttpError } from '../errors';
import { log } from '../log';
import { lessonEnd } from '../services/lessons';
import { publicBase } from '../services/links';
import type { Mailer } from '../services/mail/mailer';
import { receiptMail, refundMail } from '../services/mail/messages';
import { seatsTaken, seatTransaction } from '../services/seats';

export interface PaymentDeps {
  config: Config;
  sequelize: Sequelize;
  mailer: Mailer;
  stripe: Stripe | null;
}

function paymentsOff(): HttpError {
  return new HttpError(503, 'PAYMENTS_OFF', 'Payments are not set up on this server yet. Ask an organiser to configure them.');
}

const STATUS_WORDS: Record<ReceiptDto['status'], string> = {
  pending: 'We are waiting for the payment service to confirm your payment. This page updates by itself.',
  paid: 'Paid. Your seat is yours.',
  'refund-due': 'The last seat went to someone else a moment before your payment arrived. Your refund is on its way.',
  refunded: 'The last seat went to someone else a moment before your payment arrived, so we refunded you in full.',
  expired: 'This checkout ran out of time before it was paid. Nothing was charged; you can start again from the lesson page.',
  failed: 'This payment could not be matched to the lesson, so no seat was given. Ask your teacher for help.',
};

async function receipt(payment: Payment): Promise<ReceiptDto> {
  const lesson = (await Lesson.findByPk(payment.lessonId))!;
  const teacher = await User.findByPk(lesson.teacherId);
  const payer = await User.findByPk(payment.userId);
  return {
    id: payment.id,
    status: payment.status,
    amountCents: payment.amountCents,
    currency: payment.currency,
    lesson: { id: lesson.id, title: lesson.title, teacherName: teacher?.displayName ?? '', startsAt: lesson.startsAt.toISOString(), timeZone: lesson.timeZone },
    payerName: payer?.displayName ?? '',
    paidAt: payment.paidAt ? payment.paidAt.toISOString() : null,
    refundedAt: payment.refundedAt ? payment.refundedAt.toISOString() : null,
    checkoutSessionId: payment.checkoutSessionId,
    message: STATUS_WORDS[payment.status],
  };
}

export function paymentsRouter({ config, sequelize, stripe }: PaymentDeps) {
  const router = Router();
  router.use(requireUser);

  router.post('/checkout', async (req, res) => {
    const parsed = checkoutInputSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const user = req.user!;
    const lesson = await Lesson.findByPk(parsed.data.lessonId);
    if (!lesson) throw new HttpError(404, 'NOT_FOUND', 'There is no lesson with that id.');
    const enrollment = await Enrollment.findOne({ where: { lessonId: lesson.id, userId: user.id } });
    if (!enrollment) throw new HttpError(403, 'NOT_IN_LESSON', 'Accept an invitation to this lesson before paying for a seat.');
    if (enrollment.status === 'invited') throw new HttpError(409, 'NOT_ACCEPTED', 'Accept the invitation first (the link in your e-mail), then pay for your seat.');
    if (enrollment.status === 'paid') throw new HttpError(409, 'ALREADY_PAID', 'Your seat in this lesson is already paid. There is nothing more to pay.');
    if (!lesson.priceCents) throw new HttpError(409, 'FREE_LESSON', 'This lesson is free: your seat is already yours.');
    if (lessonEnd(lesson).getTime() <= Date.now()) throw new HttpError(409, 'LESSON_OVER', 'This lesson has ended, so its seats are no longer for sale.');
    if (!stripe) throw paymentsOff();

    // Hold a seat first, under the lesson's lock, so two checkouts cannot both take the last one.
    const { payment, reused } = await seatTransaction(sequelize, lesson.id, async (transaction) => {
      const open = await Payment.findOne({ where: { lessonId: lesson.id, userId: user.id, status: 'pending' }, order: [['id', 'DESC']], transaction });
      if (open && open.holdUntil.getTime() > Date.now() && open.checkoutUrl) return { payment: open, reused: true };
      if ((await seatsTaken(lesson, transaction)) >= lesson.seats) {
        throw new HttpError(
          409,
          'LESSON_FULL',
          `All ${lesson.seats} seats of "${lesson.title}" are taken or being paid for right now. Try again in a few minutes, or ask the teacher to open another seat.`,
        );
      }
      if (open) await open.update({ status: 'expired' }, { transaction });
      const created = await Payment.create(
        { lessonId: lesson.id, userId: user.id, status: 'pending', amountCents: lesson.priceCents, currency: lesson.currency, holdUntil: new Date(Date.now() + config.seatHoldMs) },
        { transaction },
      );
      return { payment: created, reused: false };
    });
    if (reused) return void res.json({ url: payment.checkoutUrl, paymentId: payment.id });

    const base = publicBase(config, req);
    let session: Stripe.Checkout.Session;
    try {
      session = await stripe.checkout.sessions.create({
        mode: 'payment',
        line_items: [{ quantity: 1, price_data: { currency: lesson.currency, unit_amount: lesson.priceCents, product_data: { name: `Seat in "${lesson.title}"` } } }],
        customer_email: user.email,
        client_reference_id: String(payment.id),
        metadata: { paymentId: String(payment.id), lessonId: String(lesson.id), userId: String(user.id) },
        success_url: `${base}/lessons/${lesson.id}/receipt?session_id={CHECKOUT_SESSION_ID}`,
        cancel_url: `${base}/lessons/${lesson.id}?checkout=cancelled`,
        // The service's shortest allowed session (from memory: 30 minutes); our hold is the same or shorter.
        expires_at: Math.floor(Date.now() / 1000) + Math.max(30 * 60, Math.ceil(config.seatHoldMs / 1000)),
      });
    } catch (err) {
      log.error({ err }, 'Creating a checkout session failed');
      await payment.update({ status: 'failed', note: 'The payment service refused or did not answer.' });
      throw new HttpError(502, 'PAYMENT_SERVICE', 'The payment service did not answer. Nothing was charged; please try again in a minute.');
    }
    await payment.update({ checkoutSessionId: session.id, checkoutUrl: session.url });
    res.status(201).json({ url: session.url, paymentId: payment.id });
  });

  async function visible(payment: Payment | null, userId: number, isAdmin: boolean): Promise<Payment> {
    if (!payment) throw new HttpError(404, 'NOT_FOUND', 'There is no payment with that id.');
    if (payment.userId === userId || isAdmin) return payment;
    const lesson = await Lesson.findByPk(payment.lessonId);
    if (lesson?.teacherId === userId) return payment;
    throw new HttpError(403, 'NOT_YOUR_PAYMENT', 'This receipt belongs to someone else.');
  }

  router.get('/session/:sessionId', async (req, res) => {
    const payment = await Payment.findOne({ where: { checkoutSessionId: String(req.params.sessionId) } });
    res.json({ receipt: await receipt(await visible(payment, req.user!.id, req.user!.role === 'admin')) });
  });

  router.get('/:id', async (req, res) => {
    const id = Number(req.params.id);
    const payment = Number.isInteger(id) && id > 0 ? await Payment.findByPk(id) : null;
    res.json({ receipt: await receipt(await visible(payment, req.user!.id, req.user!.role === 'admin')) });
  });

  return router;
}

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

async function handleEvent(event: Stripe.Event, deps: PaymentDeps & { base: string }): Promise<Outcome> {
  if (event.type !== 'checkout.session.completed' && event.type !== 'checkout.session.expired') {
    await PaymentEvent.findOrCreate({ where: { eventId: event.id }, defaults: { eventId: event.id, type: event.type, paymentId: null } });
    return 'ignored';
  }
  const session = event.data.object as Stripe.Checkout.Session;
  const found = await Payment.findOne({ where: { checkoutSessionId: session.id } });
  if (!found) {
    log.warn({ session: session.id }, 'A webhook named a checkout session we never created');
    return 'unknown-session';
  }
  const lesson = (await Lesson.findByPk(found.lessonId))!;
  const result = await seatTransaction(deps.sequelize, lesson.id, async (transaction): Promise<Outcome> => {
    if (await PaymentEvent.findOne({ where: { eventId: event.id }, transaction })) return 'duplicate';
    await PaymentEvent.create({ eventId: event.id, type: event.type, paymentId: found.id }, { transaction });
    const payment = (await Payment.findByPk(found.id, { transaction }))!;
    if (event.type === 'checkout.session.expired') {
      if (payment.status !== 'pending') return 'ignored';
      await payment.update({ status: 'expired' }, { transaction });
      return 'expired';
    }
    if (payment.status === 'paid') return 'already-paid';
    if (payment.status !== 'pending' && payment.status !== 'expired') return 'ignored';
    if (session.payment_status !== 'paid') return 'ignored';
    const intent = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
    if (session.amount_total !== payment.amountCents || session.currency !== payment.currency) {
      await payment.update({ status: 'failed', paymentIntentId: intent, note: `Amount ${session.amount_total} ${session.currency} does not match.` }, { transaction });
      return 'mismatch';
    }
    // Every other seat held now, this payment's own hold aside: if none is left, refund.
    if ((await seatsTaken(lesson, transaction, payment.id)) >= lesson.seats) {
      await payment.update({ status: 'refund-due', paymentIntentId: intent, note: 'The lesson filled before this payment arrived.' }, { transaction });
      return 'refund-due';
    }
    await payment.update({ status: 'paid', paymentIntentId: intent, paidAt: new Date() }, { transaction });
    const [enrollment] = await Enrollment.findOrCreate({ where: { lessonId: lesson.id, userId: payment.userId }, defaults: { lessonId: lesson.id, userId: payment.userId, status: 'paid' }, transaction });
    if (enrollment.status !== 'paid') await enrollment.update({ status: 'paid' }, { transaction });
    return 'paid';
  });

  const payment = (await Payment.findByPk(found.id))!;
  const payer = await User.findByPk(payment.userId);
  const amount = formatMoney(payment.amountCents, payment.currency);
  if (result === 'paid' && payer) {
    const mail = receiptMail(lesson, payer.displayName, amount, payment.id, `${deps.base}/lessons/${lesson.id}/receipt?session_id=${payment.checkoutSessionId}`);
    await deps.mailer.send({ to: payer.email, ...mail, kind: 'receipt' }).catch((err) => log.error({ err }, 'The receipt mail could not be sent'));
  }
  if (result === 'refund-due') return (await refund(payment, deps)) ? 'refunded' : 'refund-due';
  return result;
}

/** Gives the money back for a payment that found no seat; a failure leaves it `refund-due` for a person to see. */
async function refund(payment: Payment, deps: PaymentDeps): Promise<boolean> {
  if (!deps.stripe || !payment.paymentIntentId) return false;
  try {
    const done = await deps.stripe.refunds.create({ payment_intent: payment.paymentIntentId, metadata: { paymentId: String(payment.id), reason: 'lesson-full' } });
    await payment.update({ status: 'refunded', refundId: done.id, refundedAt: new Date() });
  } catch (err) {
    log.error({ err, payment: payment.id }, 'A refund for a lesson that filled up failed; it stays refund-due');
    return false;
  }
  const lesson = (await Lesson.findByPk(payment.lessonId))!;
  const payer = await User.findByPk(payment.userId);
  if (payer) {
    await deps.mailer
      .send({ to: payer.email, ...refundMail(lesson, payer.displayName, formatMoney(payment.amountCents, payment.currency)), kind: 'refund' })
      .catch((err) => log.error({ err }, 'The refund mail could not be sent'));
  }
  return true;
}
