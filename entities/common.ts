import { randomUUID } from 'node:crypto';
import { p } from '@mikro-orm/core';

/**
 * Primary keys are uuids made in the app. onCreate fills them at flush time; code that needs the
 * id before the flush (an audit target, an answer) passes `id: newId()` to em.create.
 */
export const uuidPk = () => p.uuid().primary().onCreate(() => randomUUID());
export const newId = (): string => randomUUID();
export const createdAt = () => p.datetime().onCreate(() => new Date());

export const roles = ['admin', 'reviewer', 'submitter', 'observer'] as const;
export type Role = (typeof roles)[number];
