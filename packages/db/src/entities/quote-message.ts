import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { Quote } from './quote';
import { QuoteRevision } from './quote-revision';
import { User } from './user';

const p = defineEntity.properties;

export const MESSAGE_AUTHORS = ['homeowner', 'staff'] as const;
export type MessageAuthor = (typeof MESSAGE_AUTHORS)[number];

/** The conversation on a quote: a homeowner's questions from the portal and the firm's replies. */
export const QuoteMessage = defineEntity({
  name: 'QuoteMessage',
  tableName: 'quote_messages',
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    quote: () => p.manyToOne(Quote).index().deleteRule('cascade'),
    revision: () => p.manyToOne(QuoteRevision).nullable(),
    from: p.string().$type<MessageAuthor>(),
    /** The staff member who replied; null for the homeowner. */
    author: () => p.manyToOne(User).nullable(),
    body: p.text(),
    at: p.datetime().onCreate(() => new Date()).index(),
  },
});
export type QuoteMessage = InferEntity<typeof QuoteMessage>;
