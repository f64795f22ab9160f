'use client';

import { useId, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent, type TextareaHTMLAttributes } from 'react';
import { TextArea } from '@/components/spectra/text-area';
import { cx } from '@/components/ui/cx';
import { useGroupMembers } from '@/lib/client/review/use-review';
import { insertMention, matchMembers, mentionHandle, mentionQueryAt, type MentionCandidate, type MentionQuery } from '@/lib/review/mentions';

export type MentionTextAreaProps = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'value' | 'onChange'> & {
  value: string;
  onValueChange: (value: string) => void;
  /** Whose members are offered. */
  groupSlug: string;
  /** The writer, left out: a mention of oneself notifies nobody. */
  selfId?: string;
};

type Offer = MentionCandidate & { handle: string };

/**
 * A text area in which `@` offers the group's members, filtered as one types, and inserts the
 * mention in the syntax the server reads (lib/review/mentions.ts). Keyboard: arrow keys choose,
 * Enter or Tab insert, Escape closes. A textarea may carry no role but textbox (HTML-ARIA), so it
 * keeps that role and points at the listbox with aria-controls and aria-activedescendant; a
 * status line tells screen readers that suggestions opened and how many there are.
 */
export function MentionTextArea({ value, onValueChange, groupSlug, selfId, onKeyDown, onBlur, onFocus, onSelect, ...rest }: MentionTextAreaProps) {
  const ref = useRef<HTMLTextAreaElement>(null);
  const listId = `mentions${useId().replace(/[^a-zA-Z0-9_-]/g, '')}`;
  const optionId = (i: number) => `${listId}-${i}`;
  // Members are asked for once someone writes here, not for every reader of the page.
  const [wanted, setWanted] = useState(false);
  const members = useGroupMembers(groupSlug, wanted);
  const [at, setAt] = useState<MentionQuery | null>(null);
  const [active, setActive] = useState(0);
  // The `@` whose suggestions were closed with Escape: they stay closed for that mention.
  const [dismissed, setDismissed] = useState<number | null>(null);
  const caretAfter = useRef<number | null>(null);

  const offers = useMemo<Offer[]>(() => {
    const people = (members.data?.items ?? []).map((m) => ({ id: m.userId, name: m.name, email: m.email }));
    return people.flatMap((p) => {
      const handle = p.id === selfId ? null : mentionHandle(p, people);
      return handle ? [{ ...p, handle }] : [];
    });
  }, [members.data, selfId]);
  const shown = useMemo(() => (at ? matchMembers(at.query, offers) : []), [at, offers]);

  const open = at !== null && at.start !== dismissed;
  const listed = open && shown.length > 0;
  const current = Math.min(active, Math.max(shown.length - 1, 0));

  // After an insertion, the caret goes right after the mention.
  useLayoutEffect(() => {
    const el = ref.current;
    if (el && caretAfter.current !== null) {
      el.setSelectionRange(caretAfter.current, caretAfter.current);
      caretAfter.current = null;
    }
  }, [value]);

  function follow(el: HTMLTextAreaElement) {
    const q = el.selectionStart === el.selectionEnd ? mentionQueryAt(el.value, el.selectionStart) : null;
    if (q?.start !== at?.start || q?.query !== at?.query) setActive(0);
    if (q?.start !== dismissed) setDismissed(null);
    setAt(q);
  }

  function pick(o: Offer) {
    if (!at) return;
    const r = insertMention(value, at, o.handle);
    caretAfter.current = r.caret;
    setAt(null);
    onValueChange(r.text);
  }

  function keys(e: KeyboardEvent<HTMLTextAreaElement>) {
    if (open && !e.nativeEvent.isComposing) {
      const n = shown.length;
      if (n > 0 && (e.key === 'ArrowDown' || e.key === 'ArrowUp')) {
        e.preventDefault();
        setActive((current + (e.key === 'ArrowDown' ? 1 : n - 1)) % n);
        return;
      }
      if (n > 0 && ((e.key === 'Enter' && !e.shiftKey) || (e.key === 'Tab' && !e.shiftKey))) {
        e.preventDefault();
        pick(shown[current]!);
        return;
      }
      if (e.key === 'Escape') {
        // Closes the suggestions only, not whatever the box sits in.
        e.preventDefault();
        e.stopPropagation();
        setDismissed(at.start);
        return;
      }
    }
    onKeyDown?.(e);
  }

  const status = !open
    ? ''
    : members.isError
      ? 'The group\'s members could not be loaded.'
      : !members.data
        ? 'Loading the group\'s members…'
        : shown.length === 0
          ? `No member matches “@${at.query}”.`
          : `${shown.length} ${shown.length === 1 ? 'member matches' : 'members match'}: arrow keys to choose, Enter to insert, Escape to close.`;

  return (
    <div className="relative">
      <TextArea
        {...rest}
        ref={ref}
        value={value}
        aria-autocomplete="list"
        aria-controls={listed ? listId : undefined}
        aria-activedescendant={listed ? optionId(current) : undefined}
        onChange={(e) => {
          onValueChange(e.target.value);
          follow(e.target);
        }}
        onSelect={(e) => {
          follow(e.currentTarget);
          onSelect?.(e);
        }}
        onKeyDown={keys}
        onFocus={(e) => {
          setWanted(true);
          onFocus?.(e);
        }}
        onBlur={(e) => {
          setAt(null);
          onBlur?.(e);
        }}
      />
      <p className="sr-only" role="status" aria-live="polite">
        {status}
      </p>
      {open && (
        <div className="absolute left-0 top-full z-20 mt-1 w-full max-w-sm rounded-md border border-paper-300 bg-paper-0 py-1 shadow-panel" data-testid="mention-popup">
          {listed ? (
            <ul role="listbox" id={listId} aria-label="Members to mention" data-testid="mention-options">
              {shown.map((o, i) => (
                <li
                  key={o.id}
                  id={optionId(i)}
                  role="option"
                  aria-selected={i === current}
                  data-testid="mention-option"
                  className={cx(
                    'flex cursor-pointer flex-col border-l-4 px-3 py-1.5 text-sm',
                    i === current ? 'border-ink-700 bg-ink-100' : 'border-transparent hover:bg-paper-100',
                  )}
                  // Keep the focus (and the caret) in the text while clicking.
                  onMouseDown={(e) => e.preventDefault()}
                  onMouseEnter={() => setActive(i)}
                  onClick={() => pick(o)}
                >
                  <span className="font-medium text-paper-900">{o.name || o.email}</span>
                  <span className="text-xs text-paper-700">{o.email}</span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="px-3 py-1.5 text-xs text-paper-700" data-testid="mention-empty">
              {status}
            </p>
          )}
        </div>
      )}
    </div>
  );
}
