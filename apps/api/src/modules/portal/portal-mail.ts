/**
 * The portal's plain-text e-mails: to the estimator when a homeowner opens, asks, approves or
 * declines, and to the homeowner when they approve or the firm replies. Names and messages are
 * user content; in plain text they need no escaping.
 */
interface QuoteRef {
  reference: string;
  customerName: string;
  firmName: string;
}

export function firstViewMail(p: QuoteRef & { estimatorName: string; workbenchLink: string }) {
  return {
    subject: `${p.customerName} opened quotation ${p.reference}`,
    text: [
      `Hello ${p.estimatorName},`,
      '',
      `${p.customerName} has opened quotation ${p.reference} from the link you sent.`,
      '',
      'See the quote and its history here:',
      p.workbenchLink,
    ].join('\n'),
  };
}

export function questionMail(p: QuoteRef & { estimatorName: string; question: string; workbenchLink: string }) {
  return {
    subject: `Question from ${p.customerName} about quotation ${p.reference}`,
    text: [
      `Hello ${p.estimatorName},`,
      '',
      `${p.customerName} asked about quotation ${p.reference}:`,
      '',
      ...p.question.split(/\r?\n/).map((l) => `> ${l}`),
      '',
      'Reply from the quote page, and they will get your answer by e-mail with their link:',
      p.workbenchLink,
    ].join('\n'),
  };
}

export function replyMail(p: QuoteRef & { senderName: string; reply: string; link: string }) {
  return {
    subject: `Reply about your quotation ${p.reference} from ${p.firmName}`,
    text: [
      `Dear ${p.customerName},`,
      '',
      p.reply,
      '',
      'You can read the quotation and the whole conversation, and ask anything else, here:',
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

export function approvalConfirmationMail(
  p: QuoteRef & {
    signedName: string;
    total: string;
    deposit: string | null;
    approvedAt: string;
    choices: string[];
    link: string;
  },
) {
  return {
    subject: `You approved quotation ${p.reference} from ${p.firmName}`,
    text: [
      `Dear ${p.customerName},`,
      '',
      `Thank you. Quotation ${p.reference} was approved by ${p.signedName} on ${p.approvedAt}, for ${p.total} including VAT.`,
      ...(p.choices.length ? ['', 'Your choices:', ...p.choices.map((c) => `  - ${c}`)] : []),
      ...(p.deposit
        ? ['', `The deposit of ${p.deposit} can be paid from your quote page:`, p.link]
        : ['', 'Your quote page:', p.link]),
      '',
      `${p.firmName} will be in touch to arrange the work.`,
    ].join('\n'),
  };
}

export function approvedNoticeMail(
  p: QuoteRef & { estimatorName: string; signedName: string; total: string; deposit: string | null; workbenchLink: string },
) {
  return {
    subject: `${p.customerName} approved quotation ${p.reference}`,
    text: [
      `Hello ${p.estimatorName},`,
      '',
      `${p.signedName} approved quotation ${p.reference} for ${p.total} including VAT.` +
        (p.deposit ? ` The deposit asked is ${p.deposit}.` : ''),
      '',
      p.workbenchLink,
    ].join('\n'),
  };
}

export function declinedNoticeMail(p: QuoteRef & { estimatorName: string; reason: string | null; workbenchLink: string }) {
  return {
    subject: `${p.customerName} declined quotation ${p.reference}`,
    text: [
      `Hello ${p.estimatorName},`,
      '',
      `${p.customerName} declined quotation ${p.reference}.`,
      ...(p.reason ? ['', 'Their reason:', ...p.reason.split(/\r?\n/).map((l) => `> ${l}`)] : ['', 'They gave no reason.']),
      '',
      p.workbenchLink,
    ].join('\n'),
  };
}
