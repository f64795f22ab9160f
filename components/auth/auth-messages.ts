import { LINK_LIMIT_ERROR, LINK_LIMITS } from '@/lib/auth/link-limits';

// next-auth reports failures as short codes in ?error=; these are the words we show for them.
const messages: Record<string, string> = {
  [LINK_LIMIT_ERROR]: `Too many sign-in links have been requested for this address, or from your network, in the last ${LINK_LIMITS.windowMinutes} minutes, so no e-mail was sent. Use a link you already have, wait a few minutes and ask again, or sign in with your password.`,
  Verification: 'This sign-in link has expired or was already used. Ask for a new one below.',
  EmailSignin: 'We could not send the sign-in e-mail. Try again in a moment, or use your password.',
  CredentialsSignin: 'E-mail or password is not right.',
  AccessDenied: 'That account cannot sign in here. If you were invited, use the link in the invitation first.',
  SessionRequired: 'Please sign in to see that page.',
  Configuration: 'Sign-in is not set up correctly on this server. Tell the person who runs it.',
};

export function authErrorMessage(code: string | undefined | null): string | null {
  if (!code) return null;
  return messages[code] ?? 'Sign-in did not work. Try again, or ask for a new link.';
}

/** Only same-site paths may be returned to after sign-in (no open redirect). */
export function safeCallbackUrl(raw: string | undefined | null, origin?: string): string {
  if (!raw) return '/';
  let path = raw;
  // next-auth hands back absolute URLs on our own origin.
  if (origin && raw.startsWith(origin)) path = raw.slice(origin.length) || '/';
  if (!path.startsWith('/') || path.startsWith('//') || path.startsWith('/\\')) return '/';
  if (path.startsWith('/sign-in')) return '/';
  return path;
}
