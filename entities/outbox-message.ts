import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Group } from './group';

/**
 * A domain event (lib/review/events.ts) written in the same transaction as the change it
 * describes; a worker turns it into mail and marks it processed, so nothing is lost when the
 * mail server is down.
 */
export const OutboxMessage = defineEntity({
  name: 'OutboxMessage',
  tableName: 'outbox',
  properties: (p) => ({
    id: uuidPk(),
    type: p.string().length(64),
    group: p.manyToOne(Group).nullable().deleteRule('cascade'),
    payload: p.json<Record<string, unknown>>().columnType('jsonb'),
    createdAt: createdAt(),
    processedAt: p.datetime().nullable(),
    attempts: p.integer().default(0),
    lastError: p.text().nullable(),
  }),
  indexes: [{ properties: ['processedAt', 'createdAt'] }],
});
export type OutboxMessage = InferEntity<typeof OutboxMessage>;
