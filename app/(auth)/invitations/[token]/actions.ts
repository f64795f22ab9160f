'use server';

import { redirect } from 'next/navigation';
import { publicAction, type FormAction } from '@/lib/http/action';
import { AppError } from '@/lib/errors';
import { acceptInvitationAsMember, acceptInvitationAsNewUser } from '@/lib/services/invitations';
import { acceptExistingSchema, acceptNewSchema } from './schema';

const acceptNew = publicAction(acceptNewSchema, async (input, { em }) => {
  await acceptInvitationAsNewUser(em, input);
  redirect('/sign-in?accepted=1');
});

const acceptExisting = publicAction(acceptExistingSchema, async (input, { em, user }) => {
  if (!user) throw new AppError('unauthenticated', 'Sign in with the invited address first, then open the link again.');
  const { groupSlug } = await acceptInvitationAsMember(em, user, input);
  redirect(`/groups/${groupSlug}`);
});

/**
 * One action for both forms: with a `password` field it creates the account, without it it adds
 * the signed-in person to the group.
 */
export const acceptInvitation: FormAction<undefined> = async (prev, formData) =>
  formData.has('password') ? acceptNew(prev, formData) : acceptExisting(prev, formData);

