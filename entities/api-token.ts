import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Group } from './group';
import { User } from './user';

export const ApiToken = defineEntity({
  name: 'ApiToken',
  tableName: 'api_token',
  properties: (p) => ({
    id: uuidPk(),
    user: p.manyToOne(User).deleteRule('cascade'),
    group: p.manyToOne(Group).deleteRule('cascade'),
    name: p.string().length(100),
    // sha256 of the token; the token is shown once and never stored.
    hash: p.string().length(64).unique(),
    // The first characters, so the owner can tell tokens apart.
    prefix: p.string().length(16),
    createdAt: createdAt(),
    lastUsedAt: p.datetime().nullable(),
    revokedAt: p.datetime().nullable(),
  }),
});
export type ApiToken = InferEntity<typeof ApiToken>;
