import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, roles, uuidPk } from './common';
import { Group } from './group';
import { User } from './user';

export const Invitation = defineEntity({
  name: 'Invitation',
  tableName: 'invitation',
  properties: (p) => ({
    id: uuidPk(),
    group: p.manyToOne(Group).deleteRule('cascade'),
    email: p.string().length(320),
    role: p.enum([...roles]),
    // sha256 of the token in the link; the token itself is only ever in the e-mail.
    tokenHash: p.string().length(64).unique(),
    invitedBy: p.manyToOne(User).nullable().deleteRule('set null'),
    createdAt: createdAt(),
    expiresAt: p.datetime(),
    acceptedAt: p.datetime().nullable(),
    revokedAt: p.datetime().nullable(),
  }),
  indexes: [{ properties: ['group', 'email'] }],
});
export type Invitation = InferEntity<typeof Invitation>;
