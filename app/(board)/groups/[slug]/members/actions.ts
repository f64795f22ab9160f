'use server';

import { revalidatePath } from 'next/cache';
import { action } from '@/lib/http/action';
import { inviteMember as invite, revokeInvitation as revoke } from '@/lib/services/invitations';
import { changeRole as setRole, removeMember as remove } from '@/lib/services/members';
import { changeRoleSchema, inviteMemberSchema, removeMemberSchema, revokeInvitationSchema } from './schema';

const membersPath = (slug: string) => `/groups/${slug}/members`;

export const inviteMember = action(inviteMemberSchema, async (input, { em, caller }) => {
  const sent = await invite(em, caller, input);
  revalidatePath(membersPath(input.group));
  return `Invitation sent to ${sent.email} as ${sent.role}.`;
});

export const changeRole = action(changeRoleSchema, async (input, { em, caller }) => {
  const member = await setRole(em, caller, input);
  revalidatePath(membersPath(input.group));
  return `${member.name ?? member.email} is now ${member.role}.`;
});

export const removeMember = action(removeMemberSchema, async (input, { em, caller }) => {
  await remove(em, caller, input);
  revalidatePath(membersPath(input.group));
  return 'Member removed.';
});

export const revokeInvitation = action(revokeInvitationSchema, async (input, { em, caller }) => {
  await revoke(em, caller, input);
  revalidatePath(membersPath(input.group));
  return 'Invitation withdrawn.';
});
