/**
 * The e-mails a recorded deposit sends: a receipt to the homeowner and a short note to the
 * estimator. Plain text; names are user content and need no escaping in text mail.
 */
export function depositReceiptMail(p: {
  customerName: string;
  firmName: string;
  reference: string;
  amount: string;
  paidOn: string;
  paymentReference: string;
  portalLink: string | null;
}) {
  return {
    subject: `Deposit received for quotation ${p.reference} - ${p.firmName}`,
    text: [
      `Dear ${p.customerName},`,
      '',
      `Thank you. ${p.firmName} has received your deposit of ${p.amount} for quotation ${p.reference}, paid by card on ${p.paidOn}.`,
      '',
      `Payment reference: ${p.paymentReference}`,
      '',
      'Keep this e-mail as your receipt. The balance is settled with the firm as the terms of your quotation say.',
      ...(p.portalLink ? ['', 'You can look at your quotation at any time here:', p.portalLink] : []),
      '',
      p.firmName,
    ].join('\n'),
  };
}

export function estimatorDepositNote(p: {
  estimatorName: string;
  customerName: string;
  reference: string;
  amount: string;
  quoteLink: string;
}) {
  return {
    subject: `Deposit paid: ${p.reference} (${p.customerName})`,
    text: [
      `Hello ${p.estimatorName},`,
      '',
      `${p.customerName} has paid the deposit of ${p.amount} for quotation ${p.reference}. The payment is confirmed by the card payment service.`,
      '',
      p.quoteLink,
    ].join('\n'),
  };
}
