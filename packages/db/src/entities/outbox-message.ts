import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';

const p = defineEntity.properties;

/** Where an outgoing e-mail is: waiting (or between retries), being handed over, delivered, given up. */
export const OUTBOX_STATES = ['pending', 'sending', 'sent', 'failed'] as const;
export type OutboxState = (typeof OUTBOX_STATES)[number];

/** An attachment as stored in the outbox: its bytes in base64. */
export interface OutboxAttachment {
  filename: string;
  contentType: string;
  contentBase64: string;
}

/**
 * An e-mail waiting to go out, or one that went. Rows are written in the same transaction as
 * the change that caused the mail, so a crash or a mail server that is down loses nothing:
 * the delivery worker sends due rows, retries failures with exponential back-off and marks a
 * row `failed` after its last attempt. `reference` ties a row to what it announces (a portal
 * link's id), so screens can say "queued" or "sent" honestly.
 */
export const OutboxMessage = defineEntity({
  name: 'OutboxMessage',
  tableName: 'outbox_messages',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).nullable().index(),
    /** What kind of mail (quote, reply, invite, password-reset...): for logs and support. */
    kind: p.string(),
    reference: p.string().nullable().index(),
    to: p.string(),
    /** The sender's display name (a firm's e-mail sender name); null shows the configured From as it is. */
    fromName: p.string().nullable(),
    subject: p.string(),
    text: p.text(),
    html: p.text().nullable(),
    attachments: p.json<OutboxAttachment[]>().onCreate(() => []),
    status: p.string().$type<OutboxState>().default('pending').index(),
    /** Hand-overs started so far (the one in progress included). */
    attempts: p.integer().default(0),
    /**
     * When the row is next due: the retry time while pending, the end of the current
     * hand-over's lease while sending (a process that died mid-send leaves it due again).
     */
    nextAttemptAt: p.datetime().index(),
    lastError: p.text().nullable(),
    sentAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type OutboxMessage = InferEntity<typeof OutboxMessage>;
