import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Group } from './group';
import { User } from './user';

export const spectrumStatuses = ['screening', 'in-review', 'returned', 'approved', 'rejected', 'withdrawn'] as const;
export type SpectrumStatus = (typeof spectrumStatuses)[number];

export const verdicts = ['pass', 'warn', 'fail'] as const;
export type VerdictValue = (typeof verdicts)[number];

export const Spectrum = defineEntity({
  name: 'Spectrum',
  tableName: 'spectrum',
  properties: (p) => ({
    id: uuidPk(),
    group: p.manyToOne(Group).deleteRule('cascade'),
    // Kept when the person leaves: the spectrum belongs to the group.
    submitter: p.manyToOne(User).nullable().deleteRule('set null'),
    title: p.string().length(200),
    material: p.string().length(200),
    formula: p.string().length(100).nullable(),
    method: p.string().length(200).nullable(),
    /** The computing code and its version, as free text ("code 7.2, PBEsol"). */
    code: p.string().length(200).nullable(),
    supercell: p.string().length(100).nullable(),
    qmesh: p.string().length(100).nullable(),
    notes: p.text().nullable(),
    status: p.enum([...spectrumStatuses]).default('screening'),
    /** Assigned reviewers (user ids); a join table can replace this when assignment grows rules. */
    reviewerIds: p.json<string[]>().columnType('jsonb').default('[]'),
    /**
     * The current revision's id and verdict, copied here so that the queue can filter and sort
     * on them without a join. Plain columns, not a relation: Revision points back at Spectrum.
     */
    currentRevisionId: p.uuid().nullable(),
    verdict: p.enum([...verdicts]).nullable(),
    /** How many revisions were ever made: the next one gets revisionCount + 1 (under a row lock). */
    revisionCount: p.integer().default(0),
    version: p.integer().version(),
    createdAt: createdAt(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  }),
  indexes: [{ properties: ['group', 'status'] }, { properties: ['group', 'updatedAt'] }],
});
export type Spectrum = InferEntity<typeof Spectrum>;
