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

// What a handle may hold, and what may not stand right before its `@` (as in MENTION above).
const HANDLE_CHAR = /[\p{L}\p{N}_.+@-]/u;

/** The mention being typed: `text.slice(start, end)` is `@` + `query` (+ the rest of the word after the caret). */
export interface MentionQuery {
  start: number;
  end: number;
  query: string;
}

/**
 * The mention the caret is in, for autocomplete: an `@` where MENTION would start one (at the
 * start or after a character that cannot belong to an address), then what was typed up to the
 * caret. Null when the caret is not in such a word, e.g. inside `ana@lab.example`.
 */
export function mentionQueryAt(text: string, caret: number): MentionQuery | null {
  if (caret < 0 || caret > text.length) return null;
  let start = caret;
  while (start > 0 && HANDLE_CHAR.test(text[start - 1]!)) start--;
  if (text[start] !== '@' || start === caret) return null;
  const query = text.slice(start + 1, caret);
  // `@@x` or a second `@` right after the first: the server would not read that as a mention.
  if (query.startsWith('@') || (query.match(/@/g)?.length ?? 0) > 1) return null;
  let end = caret;
  while (end < text.length && HANDLE_CHAR.test(text[end]!)) end++;
  return { start, end, query };
}

export interface MentionCandidate {
  id: string;
  name: string | null;
  email: string;
}

/**
 * Members whose e-mail or name matches what was typed after `@` (case-insensitive): the start
 * of the address first, then the start of a word of the name, then anywhere in the name or the
 * address's local part; by name within each. An empty query lists everyone.
 */
export function matchMembers<M extends MentionCandidate>(query: string, members: readonly M[], limit = 8): M[] {
  const q = query.toLowerCase();
  const rank = (m: M): number => {
    const email = m.email.toLowerCase();
    const name = (m.name ?? '').toLowerCase();
    if (email.startsWith(q)) return 0;
    if (name.split(/[\s-]+/).some((w) => w.startsWith(q)) || name.startsWith(q)) return 1;
    // Not the domain: every member of a lab usually shares it.
    if (email.split('@')[0]!.includes(q) || name.includes(q)) return 2;
    return -1;
  };
  return members
    .map((m) => ({ m, r: rank(m) }))
    .filter((x) => x.r >= 0)
    .sort((a, b) => a.r - b.r || (a.m.name ?? a.m.email).localeCompare(b.m.name ?? b.m.email) || a.m.email.localeCompare(b.m.email))
    .slice(0, limit)
    .map((x) => x.m);
}

/**
 * What to write after `@` so that the server's parseMentions + resolveMentions name exactly this
 * member: the local part when no other member shares it, else the full address. Null for an
 * address the mention syntax cannot carry (characters outside it).
 */
export function mentionHandle(member: Mentionable, members: readonly Mentionable[]): string | null {
  const email = member.email.toLowerCase();
  const local = email.split('@')[0]!;
  for (const h of [local, email]) {
    const found = resolveMentions(parseMentions(`@${h}`), members);
    if (found.length === 1 && found[0] === member.id) return h;
  }
  return null;
}

/** `text` with the typed mention replaced by `@handle` and a space; the caret goes after it. */
export function insertMention(text: string, at: MentionQuery, handle: string): { text: string; caret: number } {
  const after = text.slice(at.end);
  const gap = /^\s/.test(after) ? '' : ' ';
  const inserted = `@${handle}${gap}`;
  return { text: text.slice(0, at.start) + inserted + after, caret: at.start + inserted.length + (gap ? 0 : 1) };
}
