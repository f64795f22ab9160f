/**
 * The columns format (band-files.md §1). This is the hot path: one pass over the string with
 * charCodeAt, numbers read in place (no substring per token unless the token is unusual),
 * values appended to a growing Float64Array.
 */
import type { Dispersion } from '../dispersion/types';
import { BREAK, buildSegments, CONTINUE, finish, JOIN } from './assemble';
import { emptyHeader, readDirective, type ColumnsHeader } from './columns-header';
import { checkTextSize, stripBom } from './input';
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
  // NaN (past the end) counts as a terminator.
  return !(c === c) || c === SP || c === TAB || c === CR || c === LF || c === COMMA || c === SEMI || c === HASH;
}

export function parseColumns(text: string, opts?: ParseOptions): Dispersion {
  try {
    return parseColumnsUnchecked(text, opts);
  } catch (e) {
    throw asParseError(e);
  }
}

function parseColumnsUnchecked(input: string, opts: ParseOptions | undefined): Dispersion {
  checkTextSize(input, opts);
  const text = stripBom(input);
  const n = text.length;
  const header = emptyHeader();

  let values = new Float64Array(Math.max(1024, n >> 3));
  let nv = 0;
  let rowLine = new Int32Array(256);
  let nrows = 0;
  const breaksBefore: number[] = [];
  let pendingBreak = false;
  let dataStarted = false;
  let width = -1;
  let firstRowLine = 0;

  let pos = 0;
  let line = 1;
  while (pos < n) {
    const ls = pos;
    let c = text.charCodeAt(pos);
    while (c === SP || c === TAB || c === CR) c = text.charCodeAt(++pos);
    if (pos >= n || c === LF) {
      if (nrows > 0) pendingBreak = true;
      pos++;
      line++;
      continue;
    }
    if (c === HASH) {
      let le = text.indexOf('\n', pos);
      if (le < 0) le = n;
      if (!dataStarted) {
        let be = le;
        if (be > pos && text.charCodeAt(be - 1) === CR) be--;
        readDirective(header, text.slice(pos + 1, be), line, pos + 1 - ls + 1);
      }
      pos = le + 1;
      line++;
      continue;
    }

    // A data line.
    if (!dataStarted) {
      dataStarted = true;
      firstRowLine = line;
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

    let count = 0;
    for (;;) {
      // At the start of a token: c is not blank and not the line end.
      const ts = pos;
      if (c === COMMA || c === SEMI) {
        throw new ParseError(line, ts - ls + 1, 'a number', 'an empty field');
      }
      if (count === width) {
        throw new ParseError(line, ts - ls + 1, `${width} numbers per line, like line ${firstRowLine}`, 'more');
      }
      let neg = false;
      if (c === 45) {
        neg = true;
        c = text.charCodeAt(++pos);
      } else if (c === 43) {
        c = text.charCodeAt(++pos);
      }
      let mant = 0;
      let nd = 0;
      let scale = 0;
      let digits = false;
      while (c >= 48 && c <= 57) {
        digits = true;
        if (mant !== 0 || c !== 48) nd++;
        mant = mant * 10 + (c - 48);
        c = text.charCodeAt(++pos);
      }
      if (c === 46) {
        c = text.charCodeAt(++pos);
        while (c >= 48 && c <= 57) {
          digits = true;
          if (mant !== 0 || c !== 48) nd++;
          mant = mant * 10 + (c - 48);
          scale++;
          c = text.charCodeAt(++pos);
        }
      }
      let exp = 0;
      let fast = digits;
      if (fast && (c === 101 || c === 69)) {
        c = text.charCodeAt(++pos);
        let eneg = false;
        if (c === 45) {
          eneg = true;
          c = text.charCodeAt(++pos);
        } else if (c === 43) {
          c = text.charCodeAt(++pos);
        }
        let edigits = false;
        while (c >= 48 && c <= 57) {
          edigits = true;
          if (exp < 100000) exp = exp * 10 + (c - 48);
          c = text.charCodeAt(++pos);
        }
        if (!edigits) fast = false;
        if (eneg) exp = -exp;
      }
      let v = 0;
      const e10 = exp - scale;
      if (fast && isTerminator(c) && nd <= 15 && (mant === 0 || (e10 >= -22 && e10 <= 22))) {
        v = mant === 0 ? 0 : e10 < 0 ? mant / POW10[-e10] : mant * POW10[e10];
        if (neg) v = -v;
      } else {
        // Unusual token: find its end and let Number() decide, after a strict shape check.
        let te = pos;
        while (!isTerminator(text.charCodeAt(te))) te++;
        const tok = text.slice(ts, te);
        if (!NUMBER_TOKEN.test(tok)) {
          const nonFinite = NON_FINITE_TOKEN.test(tok);
          throw new ParseError(line, ts - ls + 1, nonFinite ? 'a finite number' : 'a number', quote(tok));
        }
        v = Number(tok);
        if (!Number.isFinite(v)) throw new ParseError(line, ts - ls + 1, 'a finite number', quote(tok));
        pos = te;
        c = text.charCodeAt(pos);
      }
      if (nv === values.length) {
        const grown = new Float64Array(values.length * 2);
        grown.set(values);
        values = grown;
      }
      values[nv++] = v;
      count++;

      // Separator: blanks, or one comma/semicolon with blanks around it.
      while (c === SP || c === TAB || c === CR) c = text.charCodeAt(++pos);
      if (c === COMMA || c === SEMI) {
        c = text.charCodeAt(++pos);
        while (c === SP || c === TAB || c === CR) c = text.charCodeAt(++pos);
        if (c === COMMA || c === SEMI) throw new ParseError(line, pos - ls + 1, 'a number', 'an empty field');
      }
      if (pos >= n || c === LF) break;
      if (c === HASH) {
        // A comment after the numbers runs to the end of the line.
        pos = text.indexOf('\n', pos);
        if (pos < 0) pos = n;
        break;
      }
    }
    if (width < 0) width = count;
    else if (count !== width) {
      throw new ParseError(line, pos - ls + 1, `${width} numbers per line, like line ${firstRowLine}`, `${count}`);
    }
    nrows++;
    pos++;
    line++;
  }

  if (nrows === 0) {
    throw new ParseError(Math.max(1, line - 1), null, 'at least one data line (numbers after the `#` header)', 'no data');
  }
  return assemble(header, values, width, nrows, rowLine, breaksBefore, firstRowLine, opts);
}

function assemble(
  h: ColumnsHeader,
  values: Float64Array,
  width: number,
  nrows: number,
  rowLine: Int32Array,
  breaksBefore: number[],
  firstRowLine: number,
  opts: ParseOptions | undefined,
): Dispersion {
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
    distance = new Float64Array(nq);
    frequencies = new Float64Array(nq * nb);
    for (let i = 0; i < nq; i++) distance[i] = values[i * 2];
    for (let k = 0; k < nb; k++) {
      const s = starts[k];
      for (let i = 0; i < nq; i++) {
        const r = s + i;
        const d = values[r * 2];
        if (Math.abs(d - distance[i]) > 1e-6 * Math.max(1, Math.abs(distance[i]))) {
          throw new ParseError(
            rowLine[r],
            null,
            `the distance ${distance[i]} (the same distances in every block, as at line ${rowLine[i]})`,
            `${d}`,
          );
        }
        frequencies[i * nb + k] = values[r * 2 + 1];
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
    frequencies = new Float64Array(nq * nb);
    if (h.hasDistance) distance = new Float64Array(nq);
    if (h.hasQ) q = new Float64Array(nq * 3);
    if (mesh) weights = new Float64Array(nq);
    for (let i = 0; i < nq; i++) {
      let o = i * width;
      if (distance) distance[i] = values[o++];
      if (q) {
        q[i * 3] = values[o++];
        q[i * 3 + 1] = values[o++];
        q[i * 3 + 2] = values[o++];
      }
      if (weights) weights[i] = values[o++];
      const f = i * nb;
      for (let k = 0; k < nb; k++) frequencies[f + k] = values[o + k];
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
