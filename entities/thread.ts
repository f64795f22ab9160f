import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Finding } from './finding';
import { Revision } from './revision';
import { Spectrum } from './spectrum';
import { User } from './user';

export const threadAnchorKinds = ['point', 'finding', 'spectrum'] as const;
export type ThreadAnchorKind = (typeof threadAnchorKinds)[number];

/**
 * A discussion on a spectrum, anchored to a point of a revision (q-point index, branch and the
 * frequency there, kept so the thread still says what it was about), to a finding, or to the
 * spectrum as a whole. It stays across revisions; `revision` is the one it was opened on.
 */
export const Thread = defineEntity({
  name: 'Thread',
  tableName: 'thread',
  properties: (p) => ({
    id: uuidPk(),
    spectrum: p.manyToOne(Spectrum).deleteRule('cascade'),
    revision: p.manyToOne(Revision).deleteRule('cascade'),
    author: p.manyToOne(User).nullable().deleteRule('set null'),
    anchorKind: p.enum([...threadAnchorKinds]),
    anchorIndex: p.integer().nullable(),
    anchorBranch: p.integer().nullable(),
    /** THz, on `revision` at (anchorIndex, anchorBranch). */
    anchorFrequency: p.double().nullable(),
    finding: p.manyToOne(Finding).nullable().deleteRule('set null'),
    body: p.text(),
    blocking: p.boolean().default(false),
    resolved: p.boolean().default(false),
    resolvedAt: p.datetime().nullable(),
    resolvedBy: p.manyToOne(User).nullable().deleteRule('set null'),
    createdAt: createdAt(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  }),
  indexes: [{ properties: ['spectrum', 'createdAt'] }],
});
export type Thread = InferEntity<typeof Thread>;
