/**
 * The big number lists of a YAML band file (`q`, `frequencies`, `distance`, `weights`), read
 * straight into a Float64Array without the yaml package, which builds a node per number and
 * takes seconds for a few hundred thousand values.
 *
 * Only lists of a plain, unambiguous shape are taken: the value of a `key:` that starts a line
 * (after indentation and `- ` markers), written either as a flow list (`[1, 2]`, `[[1, 2], [3, 4]]`)
 * or as a block list whose items are a number or a one-line flow row (`- [1, 2]`); numbers are
 * the YAML 1.2 core-schema decimals; no tabs, comments, anchors, tags or aliases inside. Each one
 * is cut out of the text and replaced by `[]`; the yaml package reads the small remainder, and
 * yaml.ts checks that every `[]` landed as the value of its key (else the whole text is read the
 * slow way, so a look-alike inside a string or a block scalar never changes the result).
 * Anything else stays in the text for the yaml package, with its usual errors.
 */

export type ArrayKey = 'q' | 'frequencies' | 'distance' | 'weights';

export interface NumberList {
  key: ArrayKey;
  /** A block list (`- …` lines) rather than a flow list (`[…]`). */
  block: boolean;
  /** Offset of the key in the original text. */
  keyOffset: number;
  /** Offset of the list node in the original text: its `[`, or its first `-`. */
  nodeOffset: number;
  /** 1: a list of numbers; 2: a list of rows of numbers. */
  depth: 1 | 2;
  /** Original offset of each item (the number, or the row's `[`). */
  itemOffsets: Int32Array;
  /** depth 2: numbers in each row. */
  rowLengths: Int32Array | null;
  /** Every number of the list, in order. */
  values: Float64Array;
  /** Nodes the yaml package would have made for it (the alias limit counts them). */
  nodes: number;
  /** The cut: original [start, end) replaced by `placeholder`. */
  start: number;
  end: number;
  placeholder: string;
  /** Offset of the placeholder's `[` in the reduced text. */
  reducedOffset: number;
}

export interface Reduced {
  /** The text with every list cut out. */
  text: string;
  lists: NumberList[];
  /** Original offset of an offset in the reduced text. */
  toOriginal(offset: number): number;
}

const KEYS: ArrayKey[] = ['q', 'frequencies', 'distance', 'weights'];
// The YAML 1.2 core schema's int and float forms (not .inf/.nan, not hex or octal).
const CORE_DECIMAL = /^[-+]?(?:\.[0-9]+|[0-9]+(?:\.[0-9]*)?)(?:[eE][-+]?[0-9]+)?$/;

const SP = 32;
const LF = 10;
const CR = 13;
const TAB = 9;
const HASH = 35;
const DASH = 45;
const COLON = 58;
const COMMA = 44;
const LBRACKET = 91;
const RBRACKET = 93;
const RBRACE = 125;

class Growing {
  a: Float64Array;
  n = 0;
  constructor(size: number) {
    this.a = new Float64Array(size);
  }
  push(v: number): void {
    if (this.n === this.a.length) {
      const b = new Float64Array(this.a.length * 2);
      b.set(this.a);
      this.a = b;
    }
    this.a[this.n++] = v;
  }
}

class GrowingInt {
  a = new Int32Array(64);
  n = 0;
  push(v: number): void {
    if (this.n === this.a.length) {
      const b = new Int32Array(this.a.length * 2);
      b.set(this.a);
      this.a = b;
    }
    this.a[this.n++] = v;
  }
  take(): Int32Array {
    return this.a.slice(0, this.n);
  }
}

/** A list being read; thrown away when it turns out not to be of the simple shape. */
class Draft {
  depth: 0 | 1 | 2 = 0;
  items = new GrowingInt();
  rows = new GrowingInt();
  /** Shared by the drafts of one text (one list is read at a time): no buffer per list. */
  constructor(readonly values: Growing) {
    values.n = 0;
  }
}

const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));

function endsToken(c: number): boolean {
  return c === COMMA || c === RBRACKET || c === SP || c === LF || c === CR || c === TAB || !(c === c);
}

/** Reads one number token at p; returns its end, or -1 when it is not a core-schema decimal. */
function readNumber(text: string, p: number, d: Draft): number {
  // The common short decimal read in place: at most 15 digits and an exact power of ten make
  // one correctly rounded division, the same double as parseFloat.
  const start = p;
  let c = text.charCodeAt(p);
  const neg = c === DASH;
  if (neg || c === 43) c = text.charCodeAt(++p);
  const ds = p;
  let mant = 0;
  while (c >= 48 && c <= 57) {
    mant = mant * 10 + (c - 48);
    c = text.charCodeAt(++p);
  }
  let nd = p - ds;
  let scale = 0;
  if (c === 46) {
    const fs = ++p;
    c = text.charCodeAt(p);
    while (c >= 48 && c <= 57) {
      mant = mant * 10 + (c - 48);
      c = text.charCodeAt(++p);
    }
    scale = p - fs;
    nd += scale;
  }
  if (nd > 0 && nd <= 15 && scale <= 22 && endsToken(c)) {
    const v = scale ? mant / POW10[scale] : mant;
    d.values.push(neg ? -v : v);
    return p;
  }
  // Anything else (an exponent, many digits, not a number at all): the exact way.
  let e = start;
  while (!endsToken(text.charCodeAt(e))) e++;
  if (e === start) return -1;
  const tok = text.slice(start, e);
  if (!CORE_DECIMAL.test(tok)) return -1;
  const v = Number(tok);
  if (!Number.isFinite(v)) return -1;
  d.values.push(v);
  return e;
}

/**
 * Skips spaces, and line breaks when `minIndent` >= 0 (a flow list over several lines: every
 * continued line must be indented by more than the key). Returns -1 on a tab or a comment.
 */
function skipBlank(text: string, p: number, minIndent: number): number {
  for (;;) {
    const c = text.charCodeAt(p);
    if (c === SP) p++;
    else if ((c === LF || c === CR) && minIndent >= 0) {
      if (c === CR) {
        if (text.charCodeAt(p + 1) !== LF) return -1;
        p++;
      }
      p++;
      const ls = p;
      while (text.charCodeAt(p) === SP) p++;
      const next = text.charCodeAt(p);
      if (next === TAB || next === HASH) return -1;
      if (next !== LF && next !== CR && p - ls <= minIndent) return -1;
    } else if (c === TAB || c === HASH) return -1;
    else return p;
  }
}

/** A flow row `[n, n, …]` at p (depth 2 item); returns the offset after `]` or -1. */
function readRow(text: string, p: number, d: Draft, minIndent: number): number {
  p++;
  let len = 0;
  p = skipBlank(text, p, minIndent);
  if (p < 0) return -1;
  if (text.charCodeAt(p) !== RBRACKET) {
    for (;;) {
      p = readNumber(text, p, d);
      if (p < 0) return -1;
      len++;
      p = skipBlank(text, p, minIndent);
      if (p < 0) return -1;
      const c = text.charCodeAt(p);
      if (c === RBRACKET) break;
      if (c !== COMMA) return -1;
      p = skipBlank(text, p + 1, minIndent);
      if (p < 0) return -1;
    }
  }
  d.rows.push(len);
  return p + 1;
}

/** One item (a number or a row) of the list, fixing the list's depth on the first. */
function readItem(text: string, p: number, d: Draft, minIndent: number): number {
  d.items.push(p);
  if (text.charCodeAt(p) === LBRACKET) {
    if (d.depth === 1) return -1;
    d.depth = 2;
    return readRow(text, p, d, minIndent);
  }
  if (d.depth === 2) return -1;
  d.depth = 1;
  return readNumber(text, p, d);
}

/** A flow list `[…]` at p; returns the offset after its `]`, or -1. An empty list is left alone. */
function readFlowList(text: string, p: number, d: Draft, minIndent: number): number {
  p = skipBlank(text, p + 1, minIndent);
  if (p < 0 || text.charCodeAt(p) === RBRACKET) return -1;
  for (;;) {
    p = readItem(text, p, d, minIndent);
    if (p < 0) return -1;
    p = skipBlank(text, p, minIndent);
    if (p < 0) return -1;
    const c = text.charCodeAt(p);
    if (c === RBRACKET) return p + 1;
    if (c !== COMMA) return -1;
    p = skipBlank(text, p + 1, minIndent);
    if (p < 0 || text.charCodeAt(p) === RBRACKET) return -1; // a trailing comma: leave it to yaml
  }
}

/** End of the line at p (the offset of its CR LF or LF, or the text's end). */
function lineEnd(text: string, p: number): number {
  let e = text.indexOf('\n', p);
  if (e < 0) e = text.length;
  if (e > p && text.charCodeAt(e - 1) === CR) e--;
  return e;
}

/** Spaces at p; -1 when the indentation holds a tab. */
function indentAt(text: string, p: number): number {
  let i = p;
  while (text.charCodeAt(i) === SP) i++;
  return text.charCodeAt(i) === TAB ? -1 : i - p;
}

function isBlankLine(text: string, ls: number): boolean {
  let i = ls;
  while (text.charCodeAt(i) === SP) i++;
  const c = text.charCodeAt(i);
  return c === LF || (c === CR && text.charCodeAt(i + 1) === LF) || i >= text.length;
}

/**
 * A block list starting on the line after `key:` (at `from`, a line start). Returns the end of
 * its last item line, or -1. `keyColumn` is the key's column.
 */
function readBlockList(text: string, from: number, keyColumn: number, d: Draft): { end: number; node: number } | null {
  let ls = from;
  while (ls < text.length && isBlankLine(text, ls)) ls = lineEnd(text, ls) + (text.charCodeAt(lineEnd(text, ls)) === CR ? 2 : 1);
  if (ls >= text.length) return null;
  const seqIndent = indentAt(text, ls);
  if (seqIndent < keyColumn) return null;
  const node = ls + seqIndent;
  let end = -1;
  for (;;) {
    const ind = indentAt(text, ls);
    const p0 = ls + ind;
    if (ind !== seqIndent || text.charCodeAt(p0) !== DASH) break;
    if (text.charCodeAt(p0 + 1) !== SP) return null;
    let p = p0 + 2;
    while (text.charCodeAt(p) === SP) p++;
    // One item per line; a row stays on its line.
    p = readItem(text, p, d, -1);
    if (p < 0) return null;
    while (text.charCodeAt(p) === SP) p++;
    const le = lineEnd(text, p);
    if (p !== le) return null;
    end = le;
    // Next line, skipping blank ones (they belong to the list only if an item follows).
    let next = le < text.length ? le + (text.charCodeAt(le) === CR ? 2 : 1) : le;
    while (next < text.length && isBlankLine(text, next)) {
      const e = lineEnd(text, next);
      next = e + (text.charCodeAt(e) === CR ? 2 : 1);
    }
    if (next >= text.length) return { end, node };
    ls = next;
  }
  // The first line after the list that is not blank or a comment must close it: back at the
  // key's indentation or less, and not another `-` of the same list.
  for (;;) {
    const ind = indentAt(text, ls);
    if (ind < 0) return null;
    const c = text.charCodeAt(ls + ind);
    if (c === HASH) {
      const e = lineEnd(text, ls);
      if (e >= text.length) break;
      ls = e + (text.charCodeAt(e) === CR ? 2 : 1);
      while (ls < text.length && isBlankLine(text, ls)) {
        const e2 = lineEnd(text, ls);
        ls = e2 + (text.charCodeAt(e2) === CR ? 2 : 1);
      }
      if (ls >= text.length) break;
      continue;
    }
    if (ind > keyColumn || (ind === seqIndent && c === DASH)) return null;
    break;
  }
  return end < 0 ? null : { end, node };
}

/** The key that starts the line at ls, after indentation and `- ` markers, if it is one of ours. */
function keyAt(text: string, ls: number): { key: ArrayKey; at: number; after: number } | null {
  let p = ls;
  for (;;) {
    while (text.charCodeAt(p) === SP) p++;
    if (text.charCodeAt(p) === DASH && text.charCodeAt(p + 1) === SP) p += 2;
    else break;
  }
  const c0 = text.charCodeAt(p);
  // q, frequencies, distance, weights
  if (c0 !== 113 && c0 !== 102 && c0 !== 100 && c0 !== 119) return null;
  for (const key of KEYS) {
    if (text.startsWith(key, p) && text.charCodeAt(p + key.length) === COLON) {
      const after = text.charCodeAt(p + key.length + 1);
      if (after === SP || after === LF || after === CR || !(after === after)) return { key, at: p, after: p + key.length + 1 };
    }
  }
  return null;
}

/**
 * Cuts the simple number lists out of `text`. Returns null when there is nothing to cut, or
 * when the text has a directive (`%YAML 1.1` would read numbers differently).
 */
export function reduceNumberLists(text: string): Reduced | null {
  if (/^%/m.test(text)) return null;
  const lists: NumberList[] = [];
  const scratch = new Growing(1024);
  let ls = 0;
  const n = text.length;
  while (ls < n) {
    let le = text.indexOf('\n', ls);
    if (le < 0) le = n;
    const k = keyAt(text, ls);
    if (k) {
      const keyColumn = k.at - ls;
      let p = k.after;
      while (text.charCodeAt(p) === SP) p++;
      const c = text.charCodeAt(p);
      const d = new Draft(scratch);
      if (c === LBRACKET) {
        const end = readFlowList(text, p, d, keyColumn);
        if (end >= 0) {
          // What follows must end the value as it would have ended the list.
          let q = end;
          while (text.charCodeAt(q) === SP) q++;
          const f = text.charCodeAt(q);
          const closes = f === LF || f === CR || f === COMMA || f === RBRACE || f === RBRACKET || !(f === f) || (f === HASH && q > end);
          if (closes) {
            lists.push(finishList(k.key, false, k.at, p, d, p, end, '[]'));
            le = text.indexOf('\n', end);
            if (le < 0) le = n;
          }
        }
      } else if (c === LF || c === CR || !(c === c)) {
        const lineEndAt = lineEnd(text, p);
        if (lineEndAt === p && le < n) {
          const r = readBlockList(text, le + 1, keyColumn, d);
          if (r) {
            lists.push(finishList(k.key, true, k.at, r.node, d, k.after, r.end, ' []'));
            le = text.indexOf('\n', r.end);
            if (le < 0) le = n;
          }
        }
      }
    }
    ls = le + 1;
  }
  if (lists.length === 0) return null;

  const parts: string[] = [];
  let prev = 0;
  let reducedAt = 0;
  for (const l of lists) {
    parts.push(text.slice(prev, l.start));
    reducedAt += l.start - prev;
    l.reducedOffset = reducedAt + l.placeholder.indexOf('[');
    parts.push(l.placeholder);
    reducedAt += l.placeholder.length;
    prev = l.end;
  }
  parts.push(text.slice(prev));
  const reducedStarts = lists.map((l) => l.reducedOffset - l.placeholder.indexOf('['));
  return {
    text: parts.join(''),
    lists,
    toOriginal(offset: number): number {
      let i = lists.length - 1;
      while (i >= 0 && reducedStarts[i] > offset) i--;
      if (i < 0) return offset;
      const l = lists[i];
      const inside = offset - reducedStarts[i];
      if (inside < l.placeholder.length) return inside < l.placeholder.indexOf('[') ? l.start + inside : l.nodeOffset;
      return l.end + (inside - l.placeholder.length);
    },
  };
}

function finishList(
  key: ArrayKey,
  block: boolean,
  keyOffset: number,
  nodeOffset: number,
  d: Draft,
  start: number,
  end: number,
  placeholder: string,
): NumberList {
  const items = d.items.take();
  const values = d.values.a.slice(0, d.values.n);
  const rowLengths = d.depth === 2 ? d.rows.take() : null;
  return {
    key,
    block,
    keyOffset,
    nodeOffset,
    depth: d.depth === 2 ? 2 : 1,
    itemOffsets: items,
    rowLengths,
    values,
    nodes: 1 + items.length + (d.depth === 2 ? values.length : 0),
    start,
    end,
    placeholder,
    reducedOffset: -1,
  };
}
