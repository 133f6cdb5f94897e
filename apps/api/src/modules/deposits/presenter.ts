import type { DepositPaymentView } from '@gloaming/contracts';
import { PAID_DEPOSIT_STATES } from '@gloaming/contracts';
import type { DepositPayment } from '@gloaming/db';

export function refundableMinor(payment: DepositPayment): number {
  return PAID_DEPOSIT_STATES.includes(payment.state) ? Math.max(0, payment.amountMinor - payment.refundedMinor) : 0;
}

export function presentDepositPayment(payment: DepositPayment): DepositPaymentView {
  return {
    id: payment.id,
    state: payment.state,
    amountMinor: payment.amountMinor,
    currency: payment.currency,
    refundedMinor: payment.refundedMinor,
    refundableMinor: refundableMinor(payment),
    failureCode: payment.failureCode ?? null,
    checkoutSessionId: payment.checkoutSessionId,
    paymentIntentId: payment.paymentIntentId ?? null,
    createdAt: payment.createdAt.toISOString(),
    paidAt: payment.paidAt?.toISOString() ?? null,
    version: payment.version,
  };
}
