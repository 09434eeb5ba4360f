/** The fake payment service's API: the few calls Rackside makes through the stripe SDK (see fake-server.ts). */
import { randomBytes } from 'node:crypto';
import express, { type Request, type Response } from 'express';
import type { FakePayments } from './fake-server';

export interface FakeSession {
  id: string;
  object: 'checkout.session';
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  customer_email: string | null;
  metadata: Record<string, string>;
  payment_intent: string | null;
  success_url: string;
  cancel_url: string | null;
  url: string;
  created: number;
  expires_at: number;
  livemode: false;
  /** Shown on the fake's checkout page. */
  product_name: string;
}

export interface FakeEvent {
  id: string;
  object: 'event';
  type: string;
  created: number;
  api_version: string | null;
  livemode: false;
  pending_webhooks: number;
  request: { id: null; idempotency_key: null };
  data: { object: unknown };
}

export interface FakeRefund {
  id: string;
  object: 'refund';
  payment_intent: string;
  amount: number;
  currency: string;
  status: 'succeeded';
  metadata: Record<string, string>;
}

export const now = () => Math.floor(Date.now() / 1000);
export const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;

/** The payment service's error shape, so the SDK raises its own error types. */
function fail(res: Response, status: number, type: string, message: string) {
  res.status(status).json({ error: { type, message } });
}

/** The `/v1` routes; `emit` records an event, `sendLater` delivers one without holding up the answer. */
export function fakeApi(
  fake: FakePayments,
  options: { apiKey: string; emit: (type: string, object: unknown) => FakeEvent; sendLater: (event: FakeEvent) => void; refundsByKey: Map<string, FakeRefund> },
) {
  const { emit, sendLater, refundsByKey } = options;
  const v1 = express.Router();
  // The SDK sends form-encoded bodies with bracketed keys (line_items[0][price_data][currency]).
  v1.use(express.urlencoded({ extended: true, limit: '100kb' }));
  v1.use((req, res, next) => {
    if (req.headers.authorization !== `Bearer ${options.apiKey}`) return fail(res, 401, 'invalid_request_error', 'Invalid API Key provided.');
    next();
  });

  v1.post('/checkout/sessions', (req: Request, res: Response) => {
    const body = req.body as Record<string, unknown>;
    const items = body.line_items as { price_data?: { currency?: string; unit_amount?: string; product_data?: { name?: string } }; quantity?: string }[] | undefined;
    const item = items?.[0];
    const amount = Number(item?.price_data?.unit_amount) * Number(item?.quantity ?? 1);
    if (body.mode !== 'payment' || !item?.price_data?.currency || !Number.isInteger(amount) || amount <= 0) {
      return fail(res, 400, 'invalid_request_error', 'This fake takes mode=payment with one line item carrying price_data.');
    }
    if (typeof body.success_url !== 'string') return fail(res, 400, 'invalid_request_error', 'Missing required param: success_url.');
    const id = newId('cs_test');
    const session: FakeSession = {
      id,
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: amount,
      currency: item.price_data.currency,
      client_reference_id: typeof body.client_reference_id === 'string' ? body.client_reference_id : null,
      customer_email: typeof body.customer_email === 'string' ? body.customer_email : null,
      metadata: (body.metadata as Record<string, string>) ?? {},
      payment_intent: null,
      success_url: body.success_url,
      cancel_url: typeof body.cancel_url === 'string' ? body.cancel_url : null,
      url: `${fake.url}/checkout/${id}`,
      created: now(),
      expires_at: Number(body.expires_at) || now() + 24 * 3600,
      livemode: false,
      product_name: item.price_data.product_data?.name ?? 'Payment',
    };
    fake.sessions.set(id, session);
    res.json(session);
  });

  v1.get('/checkout/sessions/:id', (req, res) => {
    const session = fake.sessions.get(String(req.params.id));
    if (!session) return fail(res, 404, 'invalid_request_error', `No such checkout.session: '${req.params.id}'`);
    res.json(session);
  });

  v1.post('/checkout/sessions/:id/expire', (req, res) => {
    if (fake.outage.has('expire')) return fail(res, 500, 'api_error', 'The fake is down for expire (a test asked for it).');
    const session = fake.sessions.get(String(req.params.id));
    if (!session) return fail(res, 404, 'invalid_request_error', `No such checkout.session: '${req.params.id}'`);
    if (session.status !== 'open') return fail(res, 400, 'invalid_request_error', 'Only Checkout Sessions with a status of open can be expired.');
    session.status = 'expired';
    sendLater(emit('checkout.session.expired', { ...session }));
    res.json(session);
  });

  v1.post('/refunds', (req, res) => {
    if (fake.outage.has('refunds')) return fail(res, 500, 'api_error', 'The fake is down for refunds (a test asked for it).');
    const key = req.headers['idempotency-key'];
    const earlier = typeof key === 'string' ? refundsByKey.get(key) : undefined;
    if (earlier) return res.json(earlier);
    const body = req.body as Record<string, unknown>;
    const intent = body.payment_intent;
    const session = [...fake.sessions.values()].find((s) => s.payment_intent === intent);
    if (!session) return fail(res, 404, 'invalid_request_error', `No such payment_intent: '${String(intent)}'`);
    if (fake.refunds.some((r) => r.payment_intent === intent)) {
      return res.status(400).json({ error: { type: 'invalid_request_error', code: 'charge_already_refunded', message: `Charge for ${String(intent)} has already been refunded.` } });
    }
    const refund: FakeRefund = {
      id: newId('re'),
      object: 'refund',
      payment_intent: String(intent),
      amount: session.amount_total,
      currency: session.currency,
      status: 'succeeded',
      metadata: (body.metadata as Record<string, string>) ?? {},
    };
    fake.refunds.push(refund);
    if (typeof key === 'string') refundsByKey.set(key, refund);
    res.json(refund);
  });
  return v1;
}
