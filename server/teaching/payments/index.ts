/**
 * Paid seats in lessons: checkout, receipts and the payment service's webhook. A checkout holds
 * a seat for a while; only a webhook whose signature the SDK accepts marks it paid, once, however
 * often the event repeats; a payment that arrives for a seat that is no longer free, or for a
 * student whose seat is already paid, is refunded at once. A new checkout expires the one it
 * replaces at the payment service, so its page takes no more money. The card form lives on the
 * payment service's own page. What the rest of the server uses:
 */
export { paymentsRouter } from './routes';
export { paymentsWebhookRouter } from './webhook';
