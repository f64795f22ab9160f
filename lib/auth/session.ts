import { getServerSession } from 'next-auth';
import { getToken } from 'next-auth/jwt';
import { NextRequest } from 'next/server';
import { User } from '@/entities';
import { env } from '@/lib/config/env';
import type { Em } from '@/lib/db/orm';
import type { SessionUser } from './caller';
import { getAuthOptions } from './options';

/** Confirms the session's person still exists, and reads name and e-mail fresh from the database. */
async function loadUser(em: Em, id: unknown): Promise<SessionUser | null> {
  if (typeof id !== 'string' || !/^[0-9a-f-]{36}$/i.test(id)) return null;
  const u = await em.findOne(User, { id });
  return u ? { id: u.id, email: u.email, name: u.name ?? null } : null;
}

/** Pages and server actions: the signed-in person from the request's session cookie, or null. */
export async function getSessionUser(em: Em): Promise<SessionUser | null> {
  const session = await getServerSession(getAuthOptions());
  return loadUser(em, session?.user?.id);
}

/**
 * Route handlers: the session cookie of this request, or null. Reads the JWT from the Request
 * itself, so handlers also work when called directly (tests) outside Next's request scope.
 */
export async function getRequestUser(em: Em, req: Request): Promise<SessionUser | null> {
  // Only the URL and headers: building a request from `req` itself would take its body.
  const nextReq = req instanceof NextRequest ? req : new NextRequest(req.url, { headers: req.headers });
  const token = await getToken({ req: nextReq, secret: env().NEXTAUTH_SECRET });
  return loadUser(em, token?.sub);
}
