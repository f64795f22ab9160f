/**
 * How many e-mail sign-in links may be asked for, and the sliding-window rule that decides it.
 * Pure, so the sign-in form can name the limit in its message. The store is link-requests.ts.
 */

/**
 * Per e-mail address and per client address, in any `windowMinutes`. A client address is often
 * a whole lab or campus behind one NAT, so it gets more than one person does.
 */
export const LINK_LIMITS = { windowMinutes: 15, perEmail: 5, perClient: 20 } as const;

/** The error code the sign-in page and form show the limit message for (next-auth's `?error=`). */
export const LINK_LIMIT_ERROR = 'TooManyLinkRequests';

export type WindowVerdict = { allowed: true } | { allowed: false; retryAt: Date };

/**
 * Whether one more request fits beside `earlier` (the times of requests already let through
 * under one key; any order, older ones ignored), and if not, when enough of them have left the
 * window for the next one to fit.
 */
export function windowVerdict(earlier: readonly Date[], now: Date, max: number, windowMs: number): WindowVerdict {
  const since = now.getTime() - windowMs;
  const inWindow = earlier.map((d) => d.getTime()).filter((t) => t > since).sort((a, b) => a - b);
  if (inWindow.length < max) return { allowed: true };
  return { allowed: false, retryAt: new Date(inWindow[inWindow.length - max]! + windowMs) };
}
