/**
 * The e-mail that carries a quote. Plain text: names and firm names are user content and
 * need no escaping here.
 */
export function quoteMail(p: {
  customerName: string;
  firmName: string;
  senderName: string;
  reference: string;
  total: string;
  validUntil: string;
  link: string;
  message?: string;
}) {
  return {
    subject: `Your garden lighting quotation ${p.reference} from ${p.firmName}`,
    text: [
      `Dear ${p.customerName},`,
      '',
      ...(p.message ? [p.message, ''] : []),
      `Please find attached our quotation ${p.reference} for ${p.total} including VAT. It is valid until ${p.validUntil}.`,
      '',
      'You can read it online, choose any options and accept it here:',
      '',
      p.link,
      '',
      'The link is personal to you: please do not forward it.',
      '',
      'Kind regards,',
      p.senderName,
      p.firmName,
    ].join('\n'),
  };
}

/** The attachment's file name: no user text, so nothing to sanitise. */
export const quotePdfFileName = (reference: string, revision: number): string => `Quotation ${reference} rev ${revision}.pdf`;
