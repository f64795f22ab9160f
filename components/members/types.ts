import type { Role } from '@/components/ui/badge';

// Plain rows the members page hands to its client components (dates as ISO strings).
export type MemberRow = {
  userId: string;
  name: string | null;
  email: string;
  role: Role;
  joinedAt: string | null;
};

export type InvitationRow = {
  id: string;
  email: string;
  role: Role;
  createdAt: string | null;
  expiresAt: string | null;
  expired: boolean;
  invitedBy: string | null;
};
