import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Group } from './group';
import { User } from './user';

export const deliveryModeValues = ['immediate', 'digest'] as const;
export const deliveryStatuses = ['pending', 'sent'] as const;
export type DeliveryStatus = (typeof deliveryStatuses)[number];

/**
 * One outbox event for one person: made once per (event, person) — the unique key makes the
 * fan-out idempotent — and marked `sent` under a row lock, so a retried job never mails twice.
 * The text is fixed when the event is fanned out (names and bodies as they were then).
 */
export const NotificationDelivery = defineEntity({
  name: 'NotificationDelivery',
  tableName: 'notification_delivery',
  properties: (p) => ({
    id: uuidPk(),
    /** The outbox row's id; not a foreign key, so pruning the outbox keeps the record of mail sent. */
    eventId: p.uuid(),
    user: p.manyToOne(User).deleteRule('cascade'),
    group: p.manyToOne(Group).deleteRule('cascade'),
    spectrumId: p.uuid(),
    spectrumTitle: p.string().length(200),
    kind: p.string().length(32),
    mode: p.enum([...deliveryModeValues]),
    subject: p.text(),
    summary: p.text(),
    detail: p.text().nullable(),
    link: p.text(),
    status: p.enum([...deliveryStatuses]).default('pending'),
    attempts: p.integer().default(0),
    lastError: p.text().nullable(),
    lastAttemptAt: p.datetime().nullable(),
    sentAt: p.datetime().nullable(),
    /** When the event happened (the outbox row's time), for digest order. */
    occurredAt: p.datetime(),
    createdAt: createdAt(),
  }),
  uniques: [{ properties: ['eventId', 'user'] }],
  indexes: [{ properties: ['status', 'mode', 'user'] }],
});
export type NotificationDelivery = InferEntity<typeof NotificationDelivery>;
