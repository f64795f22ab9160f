import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Thread } from './thread';
import { User } from './user';

export const Reply = defineEntity({
  name: 'Reply',
  tableName: 'thread_reply',
  properties: (p) => ({
    id: uuidPk(),
    thread: p.manyToOne(Thread).deleteRule('cascade'),
    author: p.manyToOne(User).nullable().deleteRule('set null'),
    body: p.text(),
    createdAt: createdAt(),
  }),
  indexes: [{ properties: ['thread', 'createdAt'] }],
});
export type Reply = InferEntity<typeof Reply>;
