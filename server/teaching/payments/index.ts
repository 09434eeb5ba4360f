/** Paid seats in lessons: checkout, receipts and the payment service's webhook. What the rest of the server uses. */
export { paymentsRouter } from './routes';
export { paymentsWebhookRouter } from './webhook';
