import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { createdAt, uuidPk } from './common';
import { Finding } from './finding';
import { User } from './user';

/** A finding waived with a written reason: it stays visible and stops counting (screening.md). */
export const Waiver = defineEntity({
  name: 'Waiver',
  tableName: 'waiver',
  properties: (p) => ({
    id: uuidPk(),
    finding: p.manyToOne(Finding).deleteRule('cascade').unique(),
    author: p.manyToOne(User).nullable().deleteRule('set null'),
    reason: p.text(),
    createdAt: createdAt(),
  }),
});
export type Waiver = InferEntity<typeof Waiver>;
