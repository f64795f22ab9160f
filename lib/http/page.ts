import 'server-only';
import { headers } from 'next/headers';
import { notFound, redirect } from 'next/navigation';
import { callerFromUser, type Caller, type SessionUser } from '@/lib/auth/caller';
import type { Role } from '@/lib/auth/permissions';
import { getSessionUser } from '@/lib/auth/session';
import { signInPath } from '@/lib/auth/sign-in-path';
import { getEm, type Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { groupAccess, type GroupRef } from '@/lib/services/access';

export interface PageContext {
  em: Em;
  user: SessionUser;
  caller: Caller;
}

export interface GroupPageContext extends PageContext {
  group: GroupRef;
  role: Role;
}

/** For server components behind sign-in: the person, or a redirect to /sign-in that comes back here. */
export async function pageContext(): Promise<PageContext> {
  const em = await getEm();
  const user = await getSessionUser(em);
  if (!user) redirect(signInPath((await headers()).get('x-branchwise-path')));
  return { em, user, caller: callerFromUser(user) };
}

/** The session's person, or null, for pages that signed-out visitors may see too. */
export async function optionalPageContext(): Promise<{ em: Em; user: SessionUser | null }> {
  const em = await getEm();
  return { em, user: await getSessionUser(em) };
}

/** For a group's pages: the group and the person's role, or the 404 page when they are not a member. */
export async function groupContext(slug: string): Promise<GroupPageContext> {
  const ctx = await pageContext();
  try {
    const { group, role } = await groupAccess(ctx.em, ctx.caller, { slug });
    return { ...ctx, group, role };
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') notFound();
    throw e;
  }
}
