/** The stripe SDK, pointed at the real service or, by STRIPE_API_BASE, at our local fake. */
import Stripe from 'stripe';
import { LOCAL_STRIPE_KEY, type Config } from '../../config';

export function createPaymentClient(config: Config): Stripe | null {
  // The fake's key against the real service would only fail: payments stay off instead.
  if (!config.stripeApiBase && config.stripeSecretKey === LOCAL_STRIPE_KEY) return null;
  if (!config.stripeApiBase) {
    return new Stripe(config.stripeSecretKey, { maxNetworkRetries: 2, telemetry: false });
  }
  const base = new URL(config.stripeApiBase);
  return new Stripe(config.stripeSecretKey, {
    host: base.hostname,
    port: Number(base.port) || (base.protocol === 'https:' ? 443 : 80),
    protocol: base.protocol === 'http:' ? 'http' : 'https',
    maxNetworkRetries: 0,
    telemetry: false,
  });
}
