import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';

export const Group = defineEntity({
  name: 'Group',
  tableName: 'lab_group',
  properties: (p) => ({
    id: uuidPk(),
    slug: p.string().length(64).unique(),
    name: p.string().length(200),
    createdAt: createdAt(),
  }),
});
export type Group = InferEntity<typeof Group>;
