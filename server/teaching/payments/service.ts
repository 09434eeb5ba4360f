/** What the payment routes and the webhook share: their dependencies, the answer when payments are off, expiring checkouts. */
import type { Sequelize } from 'sequelize';
import type Stripe from 'stripe';
import type { Config } from '../../config';
import { HttpError } from '../../errors';
import { log } from '../../log';
import type { Mailer } from '../../services/mail/mailer';

export interface PaymentDeps {
  config: Config;
  sequelize: Sequelize;
  mailer: Mailer;
  stripe: Stripe | null;
}

export function paymentsOff(): HttpError {
  return new HttpError(503, 'PAYMENTS_OFF', 'Payments are not set up on this server yet. Ask an organiser to configure them.');
}

export /** Expires checkout sessions at the payment service so their pages take no more money; a refusal is only logged. */
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
