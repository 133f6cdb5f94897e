import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';
import { Organization } from './organization';
import { Quote } from './quote';

const p = defineEntity.properties;

/** A site photo or plan image attached to a quote, stored through the storage interface. */
export const Photo = defineEntity({
  name: 'Photo',
  tableName: 'photos',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    organization: () => p.manyToOne(Organization).index(),
    quote: () => p.manyToOne(Quote).index().deleteRule('cascade'),
    storageKey: p.string(),
    thumbnailKey: p.string(),
    contentType: p.string(),
    width: p.integer(),
    height: p.integer(),
    bytes: p.integer(),
    caption: p.string().default(''),
    position: p.integer().default(0),
    onQuote: p.boolean().onCreate(() => true),
    createdAt: p.datetime().onCreate(() => new Date()),
    version: p.integer().version(),
  },
});
export type Photo = InferEntity<typeof Photo>;
