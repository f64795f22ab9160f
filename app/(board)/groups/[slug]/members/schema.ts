import { z } from 'zod';
import { emailField, roleField, slugField, uuidField } from '@/lib/http/fields';

export const inviteMemberSchema = z.object({ group: slugField, email: emailField, role: roleField });
export const changeRoleSchema = z.object({ group: slugField, userId: uuidField, role: roleField });
export const removeMemberSchema = z.object({ group: slugField, userId: uuidField });
export const revokeInvitationSchema = z.object({ group: slugField, invitationId: uuidField });

export type InviteMemberInput = z.infer<typeof inviteMemberSchema>;
export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;
