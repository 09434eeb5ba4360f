/** Starts the local mail and payment fakes for whatever is not configured for real. */
import { LOCAL_STRIPE_KEY, type Config } from '../config';
import { log } from '../log';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';
import { startFakePayments, type FakePayments } from './payments/fake-server';

export interface LocalFakes {
  smtp: FakeSmtp | null;
  payments: FakePayments | null;
  /** Tells the payment fake where Rackside listens, once it does. */
  listening(port: number): void;
  close(): Promise<void>;
}

export async function startLocalFakes(config: Config): Promise<{ config: Config; fakes: LocalFakes }> {
  const wanted = config.localFakes;
  const smtp = wanted && !config.smtpUrl ? await startFakeSmtp() : null;
  const payments =
    wanted && !config.stripeApiBase && config.stripeSecretKey === LOCAL_STRIPE_KEY
      ? await startFakePayments({ apiKey: config.stripeSecretKey, webhookSecret: config.stripeWebhookSecret })
      : null;
  if (smtp) log.info(`Mail goes to the local fake on ${smtp.url}; read it on the Mail page.`);
  if (payments) log.info(`Payments go to the local fake on ${payments.url}.`);
  return {
    config: { ...config, smtpUrl: smtp?.url ?? config.smtpUrl, stripeApiBase: payments?.url ?? config.stripeApiBase },
    fakes: {
      smtp,
      payments,
      listening(port) {
        if (payments) payments.webhookUrl = `http://127.0.0.1:${port}/api/payments/webhook`;
      },
      async close() {
        await smtp?.close();
        await payments?.close();
      },
    },
  };
}
