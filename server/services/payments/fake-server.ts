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
import { createHmac } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import express from 'express';
import { fakeApi, newId, now, type FakeEvent, type FakeRefund, type FakeSession } from './fake-api';
import { fakeCheckoutPage } from './fake-checkout-page';

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

function signWebhook(payload: string, secret: string, timestamp = now()): string {
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

  // The API the SDK calls, and the checkout page a person sees.
  app.use('/v1', fakeApi(fake, { apiKey: options.apiKey, emit, sendLater, refundsByKey }));
  app.use(fakeCheckoutPage(fake, pay));

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
