import type { Organization } from '@gloaming/db';

/**
 * The display name a firm's mail to its customers goes out under: its e-mail sender name, or
 * its name when that is blank. The address stays the configured From (config.mail.from).
 */
export function senderNameOf(firm: Pick<Organization, 'name' | 'emailSenderName'>): string {
  return firm.emailSenderName.trim() || firm.name;
}
