/**
 * /sign-in, with the page to come back to after signing in (the path proxy.ts passes on). Only a
 * path of this app is kept, never another site (`//host`, `/\host`), so no open redirect starts here.
 */
export function signInPath(from: string | null | undefined): string {
  if (!from || !from.startsWith('/') || from.startsWith('//') || from.startsWith('/\\') || from === '/' || from.startsWith('/sign-in')) return '/sign-in';
  return `/sign-in?callbackUrl=${encodeURIComponent(from)}`;
}
