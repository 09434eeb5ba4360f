/**
 * Paid seats. A checkout holds a seat for a while; only a webhook whose signature the SDK accepts
 * marks it paid, once, however often the event repeats; a payment that arrives for a seat that
 * is no longer free, or for a student whose seat is already paid, is refunded at once. A new
 * checkout expires the one it replaces at the payment service, so its page takes no more money.
 * The card form lives on the payment service's own page.
 */
import express, { Router } from 'express';
import { Op, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import Stripe from 'stripe';
import { checkoutInputSchema, formatMoney, type ReceiptDto } from '../../shared/lessons';
import { requireUser } from '../auth/guards';
import type { Config } from '../config';
import { Enrollment, Lesson, Payment, PaymentEvent, User } from '../db/models';
import type { RefundReason } from '../db/models/payment';
import { badInput, HttpError } from '../errors';
import { log } from '../log';
import { lessonEnd } from '../services/lessons';
import { publicBase } from '../services/links';
import type { Mailer } from '../services/mail/mailer';
import { alreadyPaidRefundMail, receiptMail, refundMail } from '../services/mail/messages';
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

const ALREADY_PAID_WORDS: Partial<Record<ReceiptDto['status'], string>> = {
  'refund-due': 'Your seat was already paid by another payment, so this one goes back to you: your refund is on its way. Your seat stays yours.',
  refunded: 'Your seat was already paid by another payment, so we refunded this one in full. Your seat stays yours.',
};

function statusWords(payment: Payment): string {
  return (payment.refundReason === 'already-paid' && ALREADY_PAID_WORDS[payment.status]) || STATUS_WORDS[payment.status];
}

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
    message: statusWords(payment),
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
    const { payment, reused, replaced } = await seatTransaction(sequelize, lesson.id, async (transaction) => {
      const open = await Payment.findAll({ where: { lessonId: lesson.id, userId: user.id, status: 'pending' }, order: [['id', 'DESC']], transaction });
      const latest = open[0];
      if (latest && latest.holdUntil.getTime() > Date.now() && latest.checkoutUrl) return { payment: latest, reused: true, replaced: [] };
      // Read again under the lock: a payment may have landed since the first look.
      const place = await Enrollment.findOne({ where: { lessonId: lesson.id, userId: user.id }, transaction });
      if (place?.status === 'paid') throw new HttpError(409, 'ALREADY_PAID', 'Your seat in this lesson is already paid. There is nothing more to pay.');
      if ((await seatsTaken(lesson, transaction, user.id)) >= lesson.seats) {
        throw new HttpError(
          409,
          'LESSON_FULL',
          `All ${lesson.seats} seats of "${lesson.title}" are taken or being paid for right now. Try again in a few minutes, or ask the teacher to open another seat.`,
        );
      }
      if (open.length) {
        await Payment.update({ status: 'expired', note: 'Replaced by a newer checkout.' }, { where: { id: open.map((p) => p.id), status: 'pending' }, transaction });
      }
      const created = await Payment.create(
        { lessonId: lesson.id, userId: user.id, status: 'pending', amountCents: lesson.priceCents, currency: lesson.currency, holdUntil: new Date(Date.now() + config.seatHoldMs) },
        { transaction },
      );
      return { payment: created, reused: false, replaced: open.map((p) => p.checkoutSessionId) };
    });
    if (reused) return void res.json({ url: payment.checkoutUrl, paymentId: payment.id });
    // The replaced checkouts' pages must take no more money. Where the service cannot expire one
    // (already paid there, or out of reach), a payment through it is refunded when it arrives.
    await expireSessions(stripe, replaced);

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
    await payment.reload();
    if (payment.status !== 'pending') {
      // Another checkout for this seat (a second tab, a double click) replaced this one meanwhile.
      await expireSessions(stripe, [session.id]);
      throw new HttpError(409, 'CHECKOUT_REPLACED', 'You started another checkout for this seat a moment ago. Use that one, or reload the lesson page.');
    }
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

/** Expires checkout sessions at the payment service so their pages take no more money; a refusal is only logged. */
async function expireSessions(stripe: Stripe | null, sessionIds: (string | null)[]) {
  if (!stripe) return;
  for (const id of sessionIds) {
    if (!id) continue;
    try {
      await stripe.checkout.sessions.expire(id);
    } catch (err) {
      // Already paid there (its payment is refunded when it lands), already expired, or out of reach.
      log.warn({ err: (err as Error).message, session: id }, 'A replaced checkout session could not be expired');
    }
  }
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
