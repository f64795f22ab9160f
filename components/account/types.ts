// A personal API token as the account page shows it (never the secret, which is shown once).
export type TokenRow = {
  id: string;
  name: string;
  groupName: string;
  groupSlug: string;
  createdAt: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
  /** The first characters, so a person can tell tokens apart (not secret). */
  prefix: string;
};
