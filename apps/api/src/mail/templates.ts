/**
 * Plain-text e-mails. Names and firm names are user content: in text mail they need no
 * escaping; any HTML version added later must escape them.
 */
export function inviteMail(p: { name: string; firmName: string; inviterName: string; link: string; role: string }) {
  return {
    subject: `${p.inviterName} invited you to ${p.firmName} on Gloaming`,
    text: [
      `Hello ${p.name},`,
      '',
      `${p.inviterName} has invited you to join ${p.firmName} on Gloaming as ${p.role}.`,
      'Choose a password to accept the invitation:',
      '',
      p.link,
      '',
      'The link works once and expires in 7 days. If you were not expecting this, you can ignore this e-mail.',
    ].join('\n'),
  };
}

export function passwordResetMail(p: { name: string; link: string }) {
  return {
    subject: 'Reset your Gloaming password',
    text: [
      `Hello ${p.name},`,
      '',
      'Someone (hopefully you) asked to reset the password for your Gloaming account. Choose a new one here:',
      '',
      p.link,
      '',
      'The link works once and expires in 1 hour. If you did not ask for this, ignore this e-mail; your password is unchanged.',
    ].join('\n'),
  };
}
