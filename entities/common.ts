import { randomUUID } from 'node:crypto';
import { p } from '@mikro-orm/core';

/** Primary keys are uuids made in the app, so an id is known before the row is flushed. */
export const uuidPk = () => p.uuid().primary().onCreate(() => randomUUID());
export const createdAt = () => p.datetime().onCreate(() => new Date());

export const roles = ['admin', 'reviewer', 'submitter', 'observer'] as const;
export type Role = (typeof roles)[number];
