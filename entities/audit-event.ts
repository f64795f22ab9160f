import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Group } from './group';
import { User } from './user';

export const AuditEvent = defineEntity({
  name: 'AuditEvent',
  tableName: 'audit_event',
  properties: (p) => ({
    id: uuidPk(),
    // Kept when the group or the person goes: the trail outlives them.
    group: p.manyToOne(Group).nullable().deleteRule('set null'),
    actor: p.manyToOne(User).nullable().deleteRule('set null'),
    action: p.string().length(64),
    target: p.string().length(200).nullable(),
    data: p.json<Record<string, unknown>>().columnType('jsonb').default('{}'),
    createdAt: createdAt(),
  }),
  indexes: [{ properties: ['group', 'createdAt'] }, { properties: ['action'] }],
});
export type AuditEvent = InferEntity<typeof AuditEvent>;
