/**
 * Rackside's local stand-in for the payment service. It answers the few API calls Rackside makes
 * through the stripe SDK (create and read a checkout session, expire it, refund), serves its own
 * checkout page (so no card data ever reaches Rackside; this page asks for none either), and on
 * "pay" sends a webhook signed the way the service signs them: header
 * `Stripe-Signature: t=<unix time>,v1=<hex HMAC-SHA256 of "<t>.<body>" keyed by the webhook secret>`.
 * Expiring a session sends `checkout.session.expired` a moment later, as the service does; a
 * refund repeated with the same `Idempotency-Key` header answers the first refund again, and a
 * second refund of a payment already refunded in full is refused (`charge_already_refunded`).
 */
import { createHmac, randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import express, { type Request, type Response } from 'express';

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

interface FakeEvent {
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

export interface Delivery {
  eventId: string;
  status: number;
  body: string;
}

export interface FakePayments {
  port: number;
  /** What STRIPE_API_BASE would say to reach it. */
  url: string;
  /** Where webhooks go; set once Rackside listens. */
  webhookUrl: string | null;
  sessions: Map<string, FakeSession>;
  events: Map<string, FakeEvent>;
  refunds: FakeRefund[];
  deliveries: Delivery[];
  /** Tests: when true, no event is sent by itself; `held` lists them, and `deliver` sends one when asked. */
  holdDeliveries: boolean;
  held: string[];
  /** Tests: API calls that answer 500 as if the service were down ("expire", "refunds"). */
  outage: Set<'expire' | 'refunds'>;
  /**
   * Completes a session as if its page's "Pay" were pressed; returns the event and what the
   * webhook got back (null when `deliver: false` or deliveries are held: the event waits in `held`).
   */
  pay(sessionId: string, options?: { deliver?: boolean }): Promise<{ event: FakeEvent; delivery: Delivery | null }>;
  deliver(eventId: string): Promise<Delivery | null>;
  /** Resolves once every event sent in the background (after an expire) has had its answer. */
  idle(): Promise<void>;
  close(): Promise<void>;
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

const now = () => Math.floor(Date.now() / 1000);
const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The payment service's error shape, so the SDK raises its own error types. */
function fail(res: Response, status: number, type: string, message: string) {
  res.status(status).json({ error: { type, message } });
}

export function signWebhook(payload: string, secret: string, timestamp = now()): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`).digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

export async function startFakePayments(options: { apiKey: string; webhookSecret: string; webhookUrl?: string }): Promise<FakePayments> {
  const app = express();
  const server: Server = createServer(app);
  /** Deliveries under way in the background, and refunds already made by idempotency key. */
  const background = new Set<Promise<unknown>>();
  const refundsByKey = new Map<string, FakeRefund>();
  const idle = async () => {
    while (background.size) await Promise.all([...background]);
  };
  const fake: FakePayments = {
    port: 0,
    url: '',
    webhookUrl: options.webhookUrl ?? null,
    sessions: new Map(),
    events: new Map(),
    refunds: [],
    deliveries: [],
    holdDeliveries: false,
    held: [],
    outage: new Set(),
    pay,
    deliver,
    idle,
    close: async () => {
      await idle();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };

  function emit(type: string, object: unknown): FakeEvent {
    const event: FakeEvent = {
      id: newId('evt'),
      object: 'event',
      type,
      created: now(),
      api_version: null,
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      data: { object },
    };
    fake.events.set(event.id, event);
    return event;
  }

  async function deliver(eventId: string): Promise<Delivery | null> {
    const event = fake.events.get(eventId);
    if (!event || !fake.webhookUrl) return null;
    const payload = JSON.stringify(event);
    try {
      const res = await fetch(fake.webhookUrl, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'Stripe-Signature': signWebhook(payload, options.webhookSecret) },
        body: payload,
      });
      const delivery = { eventId, status: res.status, body: await res.text() };
      fake.deliveries.push(delivery);
      return delivery;
    } catch (err) {
      const delivery = { eventId, status: 0, body: String(err) };
      fake.deliveries.push(delivery);
      return delivery;
    }
  }

  async function pay(sessionId: string, options: { deliver?: boolean } = {}) {
    const session = fake.sessions.get(sessionId);
    if (!session) throw new Error(`No checkout session ${sessionId}`);
    if (session.status !== 'open') throw new Error(`Checkout session ${sessionId} is ${session.status}`);
    session.status = 'complete';
    session.payment_status = 'paid';
    session.payment_intent = newId('pi');
    const event = emit('checkout.session.completed', { ...session });
    if (fake.holdDeliveries || options.deliver === false) {
      fake.held.push(event.id);
      return { event, delivery: null };
    }
    return { event, delivery: await deliver(event.id) };
  }

  /** Sends an event without holding up the API answer that caused it, unless deliveries are held. */
  function sendLater(event: FakeEvent) {
    if (fake.holdDeliveries) return void fake.held.push(event.id);
    const sending: Promise<unknown> = new Promise((resolve) => setImmediate(resolve)).then(() => deliver(event.id));
    background.add(sending);
    void sending.finally(() => background.delete(sending));
  }

  // ───────────── the API the SDK calls ─────────────
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
  app.use('/v1', v1);

  // ───────────── the checkout page a person sees ─────────────
  app.get('/checkout/:id', (req, res) => {
    const session = fake.sessions.get(String(req.params.id));
    if (!session) return res.status(404).type('html').send('<h1>No such checkout</h1>');
    const amount = new Intl.NumberFormat('en', { style: 'currency', currency: session.currency.toUpperCase() }).format(session.amount_total / 100);
    const open = session.status === 'open';
    res.type('html').send(`<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Test checkout</title>
<style>body{font-family:sans-serif;font-size:20px;line-height:1.5;color:#1a1a1a;background:#f4f1ea;margin:0;padding:2rem}
main{max-width:34rem;margin:auto;background:#fff;border:2px solid #555;border-radius:12px;padding:1.5rem}
button,a.button{font-size:20px;min-height:48px;padding:.5rem 1.25rem;border-radius:8px;border:2px solid #3b3b98;cursor:pointer}
button{background:#3b3b98;color:#fff}a.button{background:#fff;color:#3b3b98;display:inline-flex;align-items:center;text-decoration:none}
:focus-visible{outline:3px solid #b35900;outline-offset:2px}.note{background:#fff6d6;border:2px solid #8a6d00;padding:.75rem;border-radius:8px}</style></head>
<body><main>
<p class="note"><strong>Local test checkout.</strong> This page stands in for the payment service while Rackside runs in development. Nothing is charged and no card is asked for.</p>
<h1>${escape(session.product_name)}</h1>
<p>Amount: <strong>${escape(amount)}</strong></p>
${session.customer_email ? `<p>Receipt to: ${escape(session.customer_email)}</p>` : ''}
${
  open
    ? `<form method="post" action="/checkout/${escape(session.id)}/pay"><button type="submit">Pay ${escape(amount)}</button></form>
${session.cancel_url ? `<p><a class="button" href="${escape(session.cancel_url)}">Cancel and go back</a></p>` : ''}`
    : `<p>This checkout is ${escape(session.status)}.</p><p><a class="button" href="${escape(session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id))}">Back to Rackside</a></p>`
}
</main></body></html>`);
  });

  app.post('/checkout/:id/pay', async (req, res) => {
    const session = fake.sessions.get(String(req.params.id));
    if (!session) return res.status(404).type('html').send('<h1>No such checkout</h1>');
    if (session.status === 'open') await pay(session.id);
    res.redirect(303, session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id));
  });

  // ───────────── controls for tests ─────────────
  const control = express.Router();
  control.use(express.json());
  control.post('/checkout/:id/pay', async (req, res) => {
    try {
      res.json(await pay(String(req.params.id)));
    } catch (err) {
      res.status(409).json({ error: String((err as Error).message) });
    }
  });
  control.post('/events/:id/resend', async (req, res) => {
    const delivery = await deliver(String(req.params.id));
    if (!delivery) return res.status(404).json({ error: 'No such event, or no webhook address yet.' });
    res.json({ delivery });
  });
  control.get('/refunds', (_req, res) => res.json({ refunds: fake.refunds }));
  app.use('/_fake', control);

  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  fake.port = (server.address() as AddressInfo).port;
  fake.url = `http://127.0.0.1:${fake.port}`;
  return fake;
}
