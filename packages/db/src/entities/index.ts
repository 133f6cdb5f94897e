export { Organization } from './organization';
export { User, ROLES, type Role } from './user';
export { Session } from './session';
export { AuthToken, AUTH_TOKEN_PURPOSES, type AuthTokenPurpose } from './auth-token';
export { Customer } from './customer';
export { Site } from './site';
export { Product, PRODUCT_KINDS, type ProductKind } from './product';
export { ImportMapping } from './import-mapping';
export { ImportJob, IMPORT_JOB_STATES, type ImportJobState } from './import-job';
export { Quote, QUOTE_STATUSES, type QuoteStatus } from './quote';
export { QuoteRevision, REVISION_STATES, type RevisionState } from './quote-revision';
export { QuoteEvent } from './quote-event';
export { Photo } from './photo';
export { PortalToken } from './portal-token';
export { Circuit, CIRCUIT_KINDS, type CircuitKind } from './circuit';
export { QuoteApproval } from './quote-approval';
export { DepositPayment, DEPOSIT_PAYMENT_STATES, type DepositPaymentState } from './deposit-payment';
export { PaymentWebhookEvent } from './payment-webhook-event';
export { QuoteMessage, MESSAGE_AUTHORS, type MessageAuthor } from './quote-message';
export { FirmEvent } from './firm-event';
export { CircuitAsWired } from './circuit-as-wired';
export { CommissioningRecord } from './commissioning-record';
export { OutboxMessage, OUTBOX_STATES, type OutboxState, type OutboxAttachment } from './outbox-message';
export { RateLimitCounter } from './rate-limit-counter';

import { AuthToken } from './auth-token';
import { Circuit } from './circuit';
import { CircuitAsWired } from './circuit-as-wired';
import { CommissioningRecord } from './commissioning-record';
import { Customer } from './customer';
import { DepositPayment } from './deposit-payment';
import { FirmEvent } from './firm-event';
import { ImportJob } from './import-job';
import { ImportMapping } from './import-mapping';
import { Organization } from './organization';
import { OutboxMessage } from './outbox-message';
import { PaymentWebhookEvent } from './payment-webhook-event';
import { Photo } from './photo';
import { PortalToken } from './portal-token';
import { Product } from './product';
import { Quote } from './quote';
import { QuoteApproval } from './quote-approval';
import { QuoteEvent } from './quote-event';
import { QuoteMessage } from './quote-message';
import { QuoteRevision } from './quote-revision';
import { RateLimitCounter } from './rate-limit-counter';
import { Session } from './session';
import { Site } from './site';
import { User } from './user';

/** Every entity, for the ORM config. Add new entities here. */
export const entities = [
  Organization,
  User,
  Session,
  AuthToken,
  Customer,
  Site,
  Product,
  ImportMapping,
  ImportJob,
  Quote,
  QuoteRevision,
  QuoteEvent,
  Photo,
  PortalToken,
  Circuit,
  QuoteApproval,
  DepositPayment,
  PaymentWebhookEvent,
  QuoteMessage,
  FirmEvent,
  CircuitAsWired,
  CommissioningRecord,
  OutboxMessage,
  RateLimitCounter,
];
