import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { roles, uuidPk } from './common';
import { Group } from './group';
import { User } from './user';

export const Membership = defineEntity({
  name: 'Membership',
  tableName: 'membership',
  properties: (p) => ({
    id: uuidPk(),
    user: p.manyToOne(User).deleteRule('cascade'),
    group: p.manyToOne(Group).deleteRule('cascade'),
    role: p.enum([...roles]),
    joinedAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['user', 'group'] }],
});
export type Membership = InferEntity<typeof Membership>;
