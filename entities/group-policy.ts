import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { Group } from './group';
import { User } from './user';

/**
 * A group's review policy (lib/review/review-policy.ts), one row per group that changed it; a
 * group without a row uses the defaults. `checks` holds the full screening thresholds as set.
 */
export const GroupPolicy = defineEntity({
  name: 'GroupPolicy',
  tableName: 'group_policy',
  properties: (p) => ({
    group: p.oneToOne(Group).primary().deleteRule('cascade'),
    requiredApprovals: p.integer().default(1),
    blockingSeverities: p.json<('info' | 'warn' | 'fail')[]>().columnType('jsonb'),
    checks: p.json<Record<string, unknown>>().columnType('jsonb'),
    updatedBy: p.manyToOne(User).nullable().deleteRule('set null'),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  }),
});
export type GroupPolicy = InferEntity<typeof GroupPolicy>;
