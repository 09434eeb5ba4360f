/** Checkout and receipts: `POST /api/payments/checkout` holds a seat and opens the payment service's page; `GET /session/:id` and `/:id` answer a receipt. */
import { Router } from 'express';
import type Stripe from 'stripe';
import { checkoutInputSchema } from '../../../shared/lessons';
import { requireUser } from '../../auth/guards';
import { Enrollment, Lesson, Payment } from '../../db/models';
import { badInput, HttpError } from '../../errors';
import { log } from '../../log';
import { publicBase } from '../../services/links';
import { lessonEnd } from '../lessons/service';
import { seatsTaken, seatTransaction } from '../lessons/seats';
import { receipt } from './receipt';
import { expireSessions, paymentsOff, type PaymentDeps } from './service';

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
