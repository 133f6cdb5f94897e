export { startMailCatcher, type MailCatcher, type CaughtMessage, type MailCatcherOptions } from './mail-catcher';
export {
  startPaymentFake,
  DEFAULT_RETRY_DELAYS_MS,
  type PaymentFake,
  type PaymentFakeOptions,
  type DeliveryLogEntry,
} from './payments/payment-fake';
export { signatureHeader, signPayload } from './payments/signature';
export { TEST_CARDS } from './payments/test-cards';
