import type { Role } from '@/components/ui/badge';

// What each role may do, in words for people (the rules themselves live in lib/auth/permissions.ts).
export const ROLE_ABILITIES: Record<Role, string[]> = {
  admin: [
    'Invite and remove members, and set their roles',
    'Edit the review policy and check thresholds',
    'Assign reviewers, reopen rejected spectra, read the audit log',
    'Everything a reviewer and a submitter can do',
  ],
  reviewer: [
    'See every spectrum of the group',
    'Open threads anywhere, waive findings with a reason',
    'Approve, return or reject spectra submitted by others',
  ],
  submitter: ['Create spectra and upload revisions of your own', 'Reply in threads on your spectra', 'Withdraw your own spectra'],
  observer: ['Read everything in the group', 'Change nothing'],
};
