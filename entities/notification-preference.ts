import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { uuidPk } from './common';
import { User } from './user';

export const notificationModeValues = ['immediate', 'digest', 'off'] as const;

/**
 * A person's choice for one kind of notification (lib/notifications/kinds.ts). Kinds without a
 * row use the default, so adding a kind needs no migration of data.
 */
export const NotificationPreference = defineEntity({
  name: 'NotificationPreference',
  tableName: 'notification_preference',
  properties: (p) => ({
    id: uuidPk(),
    user: p.manyToOne(User).deleteRule('cascade'),
    kind: p.string().length(32),
    mode: p.enum([...notificationModeValues]),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  }),
  uniques: [{ properties: ['user', 'kind'] }],
});
export type NotificationPreference = InferEntity<typeof NotificationPreference>;
