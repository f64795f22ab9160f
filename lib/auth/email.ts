/** E-mail addresses are stored trimmed and lower-cased; every lookup goes through this. */
export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}
