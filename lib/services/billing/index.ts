import 'server-only';
// Billing: reads for the pages (no side effects), the changes a billing member makes, the
// explicit invoice refresh, and the payment service's webhooks.
export { getBillingOverview, getInvoice } from './overview';
export { refreshInvoices } from './invoice-refresh';
export {
  cancelAtPeriodEnd,
  changeSeats,
  previewSeatChange,
  resumeSubscription,
  startCheckout,
  startTrial,
} from './subscription-changes';
export { receiveWebhook, type WebhookOutcome } from './webhooks';
