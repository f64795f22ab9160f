/**
 * @-mentions in thread and reply text. A mention is `@` followed by a member's e-mail address or
 * the part of it before the `@` (`@ana.ruiz` or `@ana.ruiz@lab.example`), not preceded by a
 * letter or digit, so that an e-mail address written in the text is not a mention.
 */

// Local part, then an optional @domain; trailing dots belong to the sentence, not the address.
const MENTION = /(^|[^\p{L}\p{N}_.+-])@([\p{L}\p{N}_.+-]+(?:@[\p{L}\p{N}-]+(?:\.[\p{L}\p{N}-]+)+)?)/gu;

/** The handles mentioned in `text`, lower-cased, each once, in order of first appearance. */
export function parseMentions(text: string): string[] {
  const seen = new Set<string>();
  for (const m of text.matchAll(MENTION)) {
    const handle = m[2]!.replace(/\.+$/, '').toLowerCase();
    if (handle) seen.add(handle);
  }
  return [...seen];
}

export interface Mentionable {
  id: string;
  email: string;
}

/**
 * The ids of the people the handles name: a full address matches that address; a bare local
 * part matches only when exactly one member has it (an ambiguous handle names nobody).
 */
export function resolveMentions(handles: readonly string[], members: readonly Mentionable[]): string[] {
  const out = new Set<string>();
  for (const h of handles) {
    if (h.includes('@')) {
      const m = members.find((p) => p.email.toLowerCase() === h);
      if (m) out.add(m.id);
      continue;
    }
    const matches = members.filter((p) => p.email.toLowerCase().split('@')[0] === h);
    if (matches.length === 1) out.add(matches[0]!.id);
  }
  return [...out];
}
