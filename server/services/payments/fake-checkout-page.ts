/** The fake payment service's checkout page, the one a person sees: no card asked for, "Pay" completes the session. */
import { Router } from 'express';
import type { FakePayments } from './fake-server';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function fakeCheckoutPage(fake: FakePayments, pay: FakePayments['pay']) {
  const router = Router();
  router.get('/checkout/:id', (req, res) => {
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

  router.post('/checkout/:id/pay', async (req, res) => {
    const session = fake.sessions.get(String(req.params.id));
    if (!session) return res.status(404).type('html').send('<h1>No such checkout</h1>');
    if (session.status === 'open') await pay(session.id);
    res.redirect(303, session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id));
  });
  return router;
}
