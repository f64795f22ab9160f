import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';

// `user` is reserved in PostgreSQL.
export const User = defineEntity({
  name: 'User',
  tableName: 'app_user',
  properties: (p) => ({
    id: uuidPk(),
    email: p.string().length(320).unique(),
    name: p.string().length(200).nullable(),
    emailVerified: p.datetime().nullable(),
    // Lazy so that it is never loaded (or serialized) unless asked for by name.
    passwordHash: p.text().lazy(true, false).nullable(),
    createdAt: createdAt(),
  }),
});
export type User = InferEntity<typeof User>;
