/**
 * The columns format (band-files.md §1). This is the hot path: one pass over the raw UTF-8
 * bytes (numbers and separators are ASCII), numbers read in place, frequencies written straight
 * into one Float64Array sized from the first row. Only `#` header lines, and a line with an
 * error, are ever decoded to text; the file is never held as a JS string (a `Γ` in a header would
 * make V8 store the whole text at two bytes per character).
 */
import type { Dispersion } from '../dispersion/types';
import { BREAK, buildSegments, CONTINUE, finish, JOIN } from './assemble';
import { emptyHeader, readDirective, type ColumnsHeader } from './columns-header';
import { charColumn, checkByteSize, checkTextSize, checkUtf8, decodeLoose, skipBom, stripBom } from './input';
import type { ParseOptions } from './options';
import { asParseError, ParseError, quote } from './parse-error';

const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));
const NUMBER_TOKEN = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NON_FINITE_TOKEN = /^[+-]?(nan|inf|infinity)$/i;

const SP = 32;
const TAB = 9;
const CR = 13;
const LF = 10;
const COMMA = 44;
const SEMI = 59;
const HASH = 35;

function isTerminator(c: number): boolean {
  return c === SP || c === TAB || c === CR || c === LF || c === COMMA || c === SEMI || c === HASH;
}

/** Text is encoded once (tests, the command line); uploads pass their bytes as they are. */
export function parseColumns(input: string | Uint8Array, opts?: ParseOptions): Dispersion {
  try {
    let bytes: Uint8Array;
    if (typeof input === 'string') {
      checkTextSize(input, opts);
      bytes = new TextEncoder().encode(stripBom(input));
    } else {
      checkByteSize(input, opts);
      bytes = skipBom(input);
    }
    return parseColumnsBytes(bytes, opts);
  } catch (e) {
    throw asParseError(e);
  }
}

/** What the scan hands to `assemble`: lead columns (distance, q, weight) apart from the frequencies. */
interface Scan {
  /** `split` lead values per row. */
  lead: Float64Array;
  split: number;
  /** `width - split` values per row, exactly `nrows * (width - split)` long. */
  freq: Float64Array;
  width: number;
  nrows: number;
  rowLine: Int32Array;
  breaksBefore: number[];
  firstRowLine: number;
}

function leadCount(h: ColumnsHeader): number {
  return (h.hasDistance ? 1 : 0) + (h.hasQ ? 3 : 0) + (h.weights ? 1 : 0);
}

function grow(a: Float64Array, size: number): Float64Array {
  const b = new Float64Array(size);
  b.set(a);
  return b;
}

function parseColumnsBytes(input: Uint8Array, opts: ParseOptions | undefined): Dispersion {
  // A plain Uint8Array view (a Buffer is a subclass): one shape for the hot loop.
  let b = new Uint8Array(input.buffer, input.byteOffset, input.byteLength);
  let n = b.length;
  const header = emptyHeader();
  // Every line ends with LF, so the scan never reads past the end: a last line without one is
  // copied (small) with an LF added when the scan reaches it.
  let tailStart = n;
  if (n > 0 && b[n - 1] !== LF) tailStart = b.lastIndexOf(LF) + 1;

  let rowBuf: Float64Array = new Float64Array(256); // the first row, before its width is known
  let lead: Float64Array = new Float64Array(0);
  let freq: Float64Array = new Float64Array(0);
  let split = 0;
  let nb = 0;
  let rowLine = new Int32Array(256);
  let nrows = 0;
  const breaksBefore: number[] = [];
  let pendingBreak = false;
  let dataStarted = false;
  let width = -1;
  let firstRowLine = 0;
  let firstRowStart = 0;

  let pos = 0;
  let line = 1;
  let ls = 0;
  const total = n;
  let consumed = 0; // bytes before `b` when `b` is the copied last line

  while (pos < n) {
    if (pos === tailStart) {
      const t = new Uint8Array(n - pos + 1);
      t.set(b.subarray(pos));
      t[n - pos] = LF;
      consumed = pos;
      b = t;
      n = t.length;
      pos = 0;
      tailStart = n;
    }
    ls = pos;
    let c = b[pos];
    while (c === SP || c === TAB || c === CR) c = b[++pos];
    if (c === LF) {
      if (nrows > 0) pendingBreak = true;
      pos++;
      line++;
      continue;
    }
    if (c === HASH) {
      const le = b.indexOf(LF, pos);
      checkUtf8(b, pos + 1, le, line, ls);
      if (!dataStarted) {
        let be = le;
        if (be > pos && b[be - 1] === CR) be--;
        readDirective(header, decodeLoose(b, pos + 1, be), line, charColumn(b, ls, pos + 1));
      }
      pos = le + 1;
      line++;
      continue;
    }

    // A data line.
    if (!dataStarted) {
      dataStarted = true;
      firstRowLine = line;
      firstRowStart = ls;
    }
    if (pendingBreak) {
      breaksBefore.push(nrows);
      pendingBreak = false;
    }
    if (nrows === rowLine.length) {
      const grown = new Int32Array(rowLine.length * 2);
      grown.set(rowLine);
      rowLine = grown;
    }
    rowLine[nrows] = line;
    if (width >= 0) {
      if ((nrows + 1) * nb > freq.length) freq = grow(freq, nextCapacity(freq.length, nb, nrows, consumed + pos - firstRowStart, total - firstRowStart));
      if ((nrows + 1) * split > lead.length) lead = grow(lead, Math.max(16, lead.length * 2));
    }
    const leadBase = nrows * split;
    const freqBase = nrows * nb - split;

    let count = 0;
    for (;;) {
      // At the start of a token: c is not blank and not the line end.
      const ts = pos;
      if (c === COMMA || c === SEMI) fail(b, ls, line, ts, 'a number', 'an empty field');
      if (count === width) fail(b, ls, line, ts, `${width} numbers per line, like line ${firstRowLine}`, 'more');
      let neg = false;
      if (c === 45) {
        neg = true;
        c = b[++pos];
      } else if (c === 43) {
        c = b[++pos];
      }
      // Digits counted by position; leading zeros count too, which only sends a rare
      // long-zero-prefixed token to the exact slow path.
      let mant = 0;
      const ds = pos;
      while (c >= 48 && c <= 57) {
        mant = mant * 10 + (c - 48);
        c = b[++pos];
      }
      let nd = pos - ds;
      let scale = 0;
      if (c === 46) {
        const fs = ++pos;
        c = b[pos];
        while (c >= 48 && c <= 57) {
          mant = mant * 10 + (c - 48);
          c = b[++pos];
        }
        scale = pos - fs;
        nd += scale;
      }
      let exp = 0;
      let fast = nd > 0;
      if (fast && (c === 101 || c === 69)) {
        c = b[++pos];
        let eneg = false;
        if (c === 45) {
          eneg = true;
          c = b[++pos];
        } else if (c === 43) {
          c = b[++pos];
        }
        let edigits = false;
        while (c >= 48 && c <= 57) {
          edigits = true;
          if (exp < 100000) exp = exp * 10 + (c - 48);
          c = b[++pos];
        }
        if (!edigits) fast = false;
        if (eneg) exp = -exp;
      }
      let v = 0;
      const e10 = exp - scale;
      // At most 15 significant digits and a power of ten that is exact: one correctly rounded
      // operation, the same double as Number().
      if (fast && isTerminator(c) && nd <= 15 && (mant === 0 || (e10 >= -22 && e10 <= 22))) {
        v = mant === 0 ? 0 : e10 < 0 ? mant / POW10[-e10] : mant * POW10[e10];
        if (neg) v = -v;
      } else {
        // Unusual token: find its end and let Number() decide, after a strict shape check.
        let te = pos;
        while (!isTerminator(b[te])) te++;
        const tok = decodeLoose(b, ts, te);
        if (!NUMBER_TOKEN.test(tok)) {
          const nonFinite = NON_FINITE_TOKEN.test(tok);
          fail(b, ls, line, ts, nonFinite ? 'a finite number' : 'a number', quote(tok));
        }
        v = Number(tok);
        if (!Number.isFinite(v)) fail(b, ls, line, ts, 'a finite number', quote(tok));
        pos = te;
        c = b[pos];
      }
      if (width < 0) {
        if (count === rowBuf.length) rowBuf = grow(rowBuf, rowBuf.length * 2);
        rowBuf[count] = v;
      } else if (count < split) lead[leadBase + count] = v;
      else freq[freqBase + count] = v;
      count++;

      // Separator: blanks, or one comma/semicolon with blanks around it.
      while (c === SP || c === TAB || c === CR) c = b[++pos];
      if (c === COMMA || c === SEMI) {
        c = b[++pos];
        while (c === SP || c === TAB || c === CR) c = b[++pos];
        if (c === COMMA || c === SEMI) fail(b, ls, line, pos, 'a number', 'an empty field');
      }
      if (c === LF) break;
      if (c === HASH) {
        // A comment after the numbers runs to the end of the line.
        const le = b.indexOf(LF, pos);
        checkUtf8(b, pos + 1, le, line, ls);
        pos = le;
        break;
      }
    }
    if (width < 0) {
      width = count;
      // Lead columns apart; when the header asks for more than the line holds, `assemble` says so.
      const want = leadCount(header);
      split = width > want ? want : 0;
      nb = width - split;
      freq = new Float64Array(firstCapacity(nb, pos + 1 - ls, n - ls));
      lead = new Float64Array(Math.max(16, split * 64));
      lead.set(rowBuf.subarray(0, split));
      freq.set(rowBuf.subarray(split, width));
    } else if (count !== width) {
      fail(b, ls, line, pos, `${width} numbers per line, like line ${firstRowLine}`, `${count}`);
    }
    nrows++;
    pos++;
    line++;
  }

  if (nrows === 0) {
    throw new ParseError(Math.max(1, line - 1), null, 'at least one data line (numbers after the `#` header)', 'no data');
  }
  // One copy at most: a view when the estimate was close, else a right-sized array.
  const used = nrows * nb;
  if (freq.length !== used) freq = freq.length - used <= freq.length >> 4 ? freq.subarray(0, used) : freq.slice(0, used);
  const scan: Scan = { lead, split, freq, width, nrows, rowLine, breaksBefore, firstRowLine };
  return assemble(header, scan, opts);
}

/** Errors on a data line: an invalid UTF-8 byte on that line is named first, as decoding would. */
function fail(b: Uint8Array, ls: number, line: number, at: number, expected: string, found: string | null): never {
  checkUtf8(b, ls, b.indexOf(LF, ls), line, ls);
  throw new ParseError(line, charColumn(b, ls, at), expected, found);
}

/**
 * Room for the frequencies from the first row's length in bytes: rows of one file have nearly
 * the same length. Never more than one value per two bytes left (a digit and a separator).
 */
function firstCapacity(nb: number, rowBytes: number, bytesLeft: number): number {
  const rows = Math.ceil((bytesLeft / Math.max(1, rowBytes)) * 1.02) + 1;
  return Math.max(nb, Math.min(rows * nb, Math.ceil(bytesLeft / 2) + nb));
}

/** The estimate fell short: re-estimate from the average row so far (rarely needed twice). */
function nextCapacity(current: number, nb: number, rows: number, bytesSoFar: number, bytesAll: number): number {
  const perRow = bytesSoFar / Math.max(1, rows);
  const estRows = Math.ceil(((bytesAll - bytesSoFar) / perRow) * 1.05) + rows + 1;
  return Math.max(current + nb, Math.ceil(current * 1.25), estRows * nb);
}

function assemble(h: ColumnsHeader, scan: Scan, opts: ParseOptions | undefined): Dispersion {
  const { lead: leadValues, split, freq, width, nrows, rowLine, breaksBefore, firstRowLine } = scan;
  const mesh = h.weights;
  if (mesh && (!h.hasQ || h.hasDistance)) {
    throw new ParseError(h.weightsLine, null, '`# columns: q` with `# weights: yes` (a mesh has q, a weight, then frequencies)');
  }
  const blocks =
    h.layout === 'blocks' || (h.layout === null && !mesh && !h.hasQ && width === 2 && breaksBefore.length >= 1);
  if (blocks && (h.hasQ || mesh)) {
    throw new ParseError(h.layoutLine || h.columnsLine || 1, null, 'the blocks layout to hold distance and frequency only (no q, no weights)');
  }

  let nq: number;
  let nb: number;
  let frequencies: Float64Array;
  let distance: Float64Array | null = null;
  let q: Float64Array | null = null;
  let weights: Float64Array | null = null;

  if (blocks) {
    if (width !== 2) {
      throw new ParseError(firstRowLine, null, '2 numbers per line (distance, frequency) in the blocks layout', `${width}`);
    }
    const starts = [0, ...breaksBefore, nrows];
    nb = starts.length - 1;
    nq = starts[1] - starts[0];
    for (let k = 1; k < nb; k++) {
      const len = starts[k + 1] - starts[k];
      if (len !== nq) {
        throw new ParseError(
          rowLine[starts[k]],
          null,
          `${nq} lines in every block (one per q-point, like the block at line ${rowLine[0]})`,
          `${len} in the block starting here`,
        );
      }
    }
    // Two numbers per line, so the scan put the distance in `lead` and the frequency in `freq`.
    distance = new Float64Array(nq);
    frequencies = new Float64Array(nq * nb);
    for (let i = 0; i < nq; i++) distance[i] = leadValues[i];
    for (let k = 0; k < nb; k++) {
      const s = starts[k];
      for (let i = 0; i < nq; i++) {
        const r = s + i;
        const d = leadValues[r];
        if (Math.abs(d - distance[i]) > 1e-6 * Math.max(1, Math.abs(distance[i]))) {
          throw new ParseError(
            rowLine[r],
            null,
            `the distance ${distance[i]} (the same distances in every block, as at line ${rowLine[i]})`,
            `${d}`,
          );
        }
        frequencies[i * nb + k] = freq[r];
      }
    }
  } else {
    const lead = (h.hasDistance ? 1 : 0) + (h.hasQ ? 3 : 0) + (mesh ? 1 : 0);
    if (width <= lead) {
      const what = [h.hasDistance && 'distance', h.hasQ && 'q (3 numbers)', mesh && 'weight'].filter(Boolean).join(', ');
      throw new ParseError(firstRowLine, null, `at least ${lead + 1} numbers per line (${what}, then one frequency per branch)`, `${width}`);
    }
    nq = nrows;
    nb = width - lead;
    // The scan already wrote the frequencies into their own array; only the lead columns move.
    frequencies = freq;
    if (h.hasDistance) distance = new Float64Array(nq);
    if (h.hasQ) q = new Float64Array(nq * 3);
    if (mesh) weights = new Float64Array(nq);
    for (let i = 0; i < nq; i++) {
      let o = i * split;
      if (distance) distance[i] = leadValues[o++];
      if (q) {
        q[i * 3] = leadValues[o++];
        q[i * 3 + 1] = leadValues[o++];
        q[i * 3 + 2] = leadValues[o++];
      }
      if (weights) weights[i] = leadValues[o++];
    }
  }

  if (h.acoustic !== null && h.acoustic > nb) {
    throw new ParseError(h.acousticLine, null, `at most ${nb} acoustic branches (the file has ${nb} branches)`, `${h.acoustic}`);
  }

  // Labels, and the X|K path breaks they may carry.
  const labels = new Map<number, string>();
  const relation = new Uint8Array(nq);
  const afterBreak: [number, string][] = [];
  for (const { index, label, column } of h.labels) {
    if (index >= nq) {
      throw new ParseError(h.labelsLine, column, `a q-point index from 0 to ${nq - 1}`, `${index}`);
    }
    const parts = label.split('|');
    if (parts.length === 1 || mesh) {
      labels.set(index, label);
      continue;
    }
    if (parts.length !== 2 || parts[0] === '' || parts[1] === '') {
      throw new ParseError(h.labelsLine, column, 'a label, or two labels joined by `|` at a path break (e.g. `80=K|U`)', quote(label));
    }
    if (index + 1 >= nq) {
      throw new ParseError(h.labelsLine, column, `a point after index ${index} to start the path after the break \`${label}\``, 'the last point');
    }
    labels.set(index, parts[0]);
    relation[index + 1] = BREAK;
    afterBreak.push([index + 1, parts[1]]);
  }
  for (const [i, l] of afterBreak) if (!labels.has(i)) labels.set(i, l);

  let segments: Dispersion['segments'] = [];
  if (!mesh) {
    for (const b of breaksBefore) if (!blocks) relation[b] = BREAK;
    for (let i = 1; i < nq; i++) {
      if (relation[i] !== CONTINUE) continue;
      if (q) {
        const same =
          Math.abs(q[i * 3] - q[i * 3 - 3]) <= 1e-9 &&
          Math.abs(q[i * 3 + 1] - q[i * 3 - 2]) <= 1e-9 &&
          Math.abs(q[i * 3 + 2] - q[i * 3 - 1]) <= 1e-9;
        if (same) relation[i] = JOIN;
        else if (distance && distance[i] === distance[i - 1]) relation[i] = BREAK; // same place on the axis, another q: a jump
      } else if (distance && Math.abs(distance[i] - distance[i - 1]) <= 1e-9 * Math.max(1, Math.abs(distance[i]))) {
        relation[i] = JOIN;
      }
    }
    segments = buildSegments(nq, relation, labels);
  }

  return finish(
    {
      format: 'columns',
      kind: mesh ? 'mesh' : 'path',
      title: h.title,
      nq,
      nb,
      frequencies,
      q,
      coordinates: h.coordinates,
      distance,
      weights,
      lattice: h.lattice,
      units: h.units,
      labels,
      segments,
      atoms: h.atoms,
      polar: h.polar,
      acoustic: h.acoustic,
      metadata: h.metadata,
    },
    opts?.overrides,
  );
}
