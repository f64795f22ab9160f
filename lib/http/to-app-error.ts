import { randomUUID } from 'node:crypto';
import { NotFoundError, UniqueConstraintViolationException } from '@mikro-orm/core';
import { z } from 'zod';
import { AppError } from '@/lib/errors';

/** zod issues as `{ "field.path": ["message", …] }`; issues about the whole input under "_". */
export function fieldErrorsOf(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function invalidInput(error: z.ZodError, where: string): AppError {
  const fieldErrors = fieldErrorsOf(error);
  const fields = Object.keys(fieldErrors).filter((k) => k !== '_');
  const message = fields.length
    ? `Invalid ${where}: check ${fields.join(', ')}.`
    : `Invalid ${where}: ${error.issues[0]?.message ?? 'not accepted'}.`;
  return new AppError('invalid_input', message, { fieldErrors });
}

function isConnectionError(e: unknown): boolean {
  const code = (e as { code?: unknown })?.code;
  return code === 'ECONNREFUSED' || code === '57P03' || code === 'ETIMEDOUT' || (e as Error)?.name === 'ConnectionException';
}

/**
 * Any thrown value as an AppError. Unknown errors become a bare 'internal' (logged here with an
 * id the client can quote); their message never reaches the client.
 */
export function toAppError(e: unknown, where = 'request'): AppError {
  if (e instanceof AppError) return e;
  if (e instanceof z.ZodError) return invalidInput(e, where);
  if (e instanceof UniqueConstraintViolationException) {
    return new AppError('conflict', 'This already exists (someone may have just done the same).');
  }
  if (e instanceof NotFoundError) return new AppError('not_found');
  if (isConnectionError(e)) {
    console.error('[branchwise] database unavailable:', e);
    return new AppError('unavailable', 'The database is unavailable; try again shortly.');
  }
  const id = randomUUID();
  console.error(`[branchwise] internal error ${id} in ${where}:`, e);
  return new AppError('internal', undefined, { id });
}
