import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Revision } from './revision';
import { Spectrum } from './spectrum';
import { User } from './user';

export const decisionVerdicts = ['approve', 'return', 'reject'] as const;
export type DecisionVerdictValue = (typeof decisionVerdicts)[number];

/**
 * A reviewer's decision on one revision. Approvals count toward the policy only for the
 * current revision and while `supersededAt` is null (a reopen after a rejection clears them).
 */
export const Decision = defineEntity({
  name: 'Decision',
  tableName: 'decision',
  properties: (p) => ({
    id: uuidPk(),
    spectrum: p.manyToOne(Spectrum).deleteRule('cascade'),
    revision: p.manyToOne(Revision).deleteRule('cascade'),
    reviewer: p.manyToOne(User).nullable().deleteRule('set null'),
    verdict: p.enum([...decisionVerdicts]),
    note: p.text(),
    supersededAt: p.datetime().nullable(),
    createdAt: createdAt(),
  }),
  indexes: [{ properties: ['spectrum', 'createdAt'] }, { properties: ['revision', 'verdict'] }],
});
export type Decision = InferEntity<typeof Decision>;
