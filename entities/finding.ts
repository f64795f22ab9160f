import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { uuidPk } from './common';
import { Revision } from './revision';

export const findingSeverities = ['info', 'warn', 'fail'] as const;

/** One screening finding (screening.md). Waivers come with the review issue. */
export const Finding = defineEntity({
  name: 'Finding',
  tableName: 'finding',
  properties: (p) => ({
    id: uuidPk(),
    revision: p.manyToOne(Revision).deleteRule('cascade'),
    /** Position in the screening result, so the API returns findings in the engine's order. */
    ordinal: p.integer(),
    check: p.string().length(32),
    severity: p.enum([...findingSeverities]),
    segment: p.integer().nullable(),
    index: p.integer().nullable(),
    branch: p.integer().nullable(),
    q: p.json<number[]>().columnType('jsonb').nullable(),
    value: p.double().nullable(),
    limit: p.double().nullable(),
    message: p.text(),
  }),
  indexes: [{ properties: ['revision', 'ordinal'] }],
});
export type Finding = InferEntity<typeof Finding>;
