/**
 * The YAML format: the Branchwise dispersion schema `branchwise-dispersion/1` (band-files.md §2),
 * plus the `mesh:` form of docs/formats.md. The big number lists are read straight into typed
 * arrays (yaml-arrays.ts); the rest of the document is read with the `yaml` package and walked
 * node by node, so every error points at the line and column of the offending node or number.
 */
import { Document, isAlias, isMap, isScalar, isSeq, parseDocument, visit, type Node } from 'yaml';
import type { Coordinates, Dispersion, FrequencyUnit, Lattice, Segment } from '../dispersion/types';
import { det3, readLattice } from '../physics/lattice';
import { isGammaLabel } from '../physics/path';
import { parseUnit } from '../physics/units';
import { finish } from './assemble';
import { checkTextSize, stripBom } from './input';
import type { ParseOptions } from './options';
import { asParseError, ParseError, quote } from './parse-error';
import { reduceNumberLists, type NumberList, type Reduced } from './yaml-arrays';

export const YAML_FORMAT_ID = 'branchwise-dispersion/1';
/** Aliases may repeat small pieces; anything that expands further is refused: the nodes that all aliases of a document may add when expanded. */
export const MAX_ALIAS_NODES = 10_000;

export function parseYaml(text: string, opts?: ParseOptions): Dispersion {
  try {
    return parseYamlUnchecked(text, opts, true);
  } catch (e) {
    throw asParseError(e);
  }
}

/**
 * The same reader with every number going through the yaml package (no lists read apart):
 * the reference the fast lists are tested against. Seconds on a large file.
 */
export function parseYamlNodeByNode(text: string, opts?: ParseOptions): Dispersion {
  try {
    return parseYamlUnchecked(text, opts, false);
  } catch (e) {
    throw asParseError(e);
  }
}

type Where = { line: number; column: number | null };

/** Line and column (1-based, UTF-16 units as the yaml package counts) of offsets in the original text. */
class Positions {
  private starts: Int32Array | null = null;
  constructor(
    private readonly text: string,
    private readonly reduced: Reduced | null,
  ) {}

  /** Offset in the original text of an offset in the text the yaml package read. */
  original(offset: number): number {
    return this.reduced ? this.reduced.toOriginal(offset) : offset;
  }

  at(offset: number): { line: number; column: number } {
    if (!this.starts) {
      const s = [0];
      for (let i = this.text.indexOf('\n'); i >= 0; i = this.text.indexOf('\n', i + 1)) s.push(i + 1);
      this.starts = Int32Array.from(s);
    }
    const st = this.starts;
    let lo = 0;
    let hi = st.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (st[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: offset - st[lo] + 1 };
  }
}

class Reader {
  constructor(
    readonly doc: Document,
    readonly positions: Positions,
    readonly aliases: Map<unknown, Node | undefined>,
    /** The number lists read apart, by the offset of their `[]` in the text the yaml package read. */
    readonly lists: Map<number, NumberList>,
  ) {}

  offsetOf(node: unknown): number | null {
    const r = (node as Node | null)?.range;
    return r ? this.positions.original(r[0]) : null;
  }

  where(node: unknown): Where {
    const o = this.offsetOf(node);
    if (o === null) return { line: 1, column: null };
    const p = this.positions.at(o);
    return { line: p.line, column: p.column };
  }

  fail(node: unknown, expected: string, found?: string): never {
    const w = this.where(node);
    throw new ParseError(w.line, w.column, expected, found ?? describe(this.resolve(node)));
  }

  /** An error at an item of a number list (an offset in the original text). */
  failAt(offset: number, expected: string, found: string): never {
    const p = this.positions.at(offset);
    throw new ParseError(p.line, p.column, expected, found);
  }

  resolve(node: unknown): unknown {
    return isAlias(node) ? this.aliases.get(node) : node;
  }

  /** The number list a node stands for, when it was read apart. */
  list(node: unknown): NumberList | undefined {
    const n = this.resolve(node);
    if (this.lists.size === 0 || !isSeq(n) || n.items.length !== 0 || !n.range) return undefined;
    return this.lists.get(n.range[0]);
  }

  number(node: unknown, what: string): number {
    const n = this.resolve(node);
    if (isScalar(n) && typeof n.value === 'number') {
      if (!Number.isFinite(n.value)) this.fail(node, `a finite number (${what})`);
      return n.value;
    }
    return this.fail(node, `a number (${what})`);
  }

  seq(node: unknown, what: string): Node[] {
    const n = this.resolve(node);
    if (!isSeq(n)) return this.fail(node, `a list (${what})`);
    return n.items as Node[];
  }

  string(node: unknown, what: string): string {
    const n = this.resolve(node);
    if (isScalar(n) && (typeof n.value === 'string' || typeof n.value === 'number') && String(n.value).trim() !== '') {
      return String(n.value).trim();
    }
    return this.fail(node, what);
  }

  /** Map entries as [key, key node, value node], with duplicate keys already refused by the parser. */
  entries(node: unknown, what: string): [string, Node, Node | null][] {
    const n = this.resolve(node);
    if (!isMap(n)) return this.fail(node, what);
    return n.items.map((p) => {
      const k = this.resolve(p.key);
      const key = isScalar(k) ? String(k.value) : '';
      return [key, p.key as Node, (p.value as Node | null) ?? null];
    });
  }

  /** Plain value of a free-form node (metadata). Expansion was bounded by firstExcessiveAlias. */
  js(node: unknown): unknown {
    const l = this.list(node);
    if (l) return listToJs(l);
    const n = this.resolve(node);
    if (isScalar(n)) return n.value;
    if (isSeq(n)) return n.items.map((it) => this.js(it));
    if (isMap(n)) {
      const o: Record<string, unknown> = {};
      for (const p of n.items) o[String(this.js(p.key))] = this.js(p.value);
      return o;
    }
    return null;
  }
}

function listToJs(l: NumberList): unknown[] {
  if (!l.rowLengths) return Array.from(l.values);
  const rows: number[][] = [];
  let o = 0;
  for (const len of l.rowLengths) {
    rows.push(Array.from(l.values.subarray(o, o + len)));
    o += len;
  }
  return rows;
}

/**
 * Every `[]` left by reduceNumberLists must be the value of its own key (in a block mapping for
 * a block list), else the cut was not what it seemed (a look-alike inside a string, say).
 */
function listsInPlace(doc: Document, reduced: Reduced): Map<number, NumberList> | null {
  const byOffset = new Map(reduced.lists.map((l) => [l.reducedOffset, l]));
  const found = new Map<number, NumberList>();
  visit(doc, {
    Pair(_, pair, path) {
      const v = pair.value;
      if (!isSeq(v) || v.items.length !== 0 || !v.range || v.anchor || v.tag) return;
      const l = byOffset.get(v.range[0]);
      const k = pair.key;
      if (!l || !isScalar(k) || k.type !== 'PLAIN' || k.value !== l.key || !k.range) return;
      if (reduced.toOriginal(k.range[0]) !== l.keyOffset) return;
      const parent = path[path.length - 1];
      if (l.block && (!isMap(parent) || parent.flow)) return;
      found.set(l.reducedOffset, l);
    },
  });
  return found.size === reduced.lists.length ? found : null;
}

/** The yaml package's document of the text (reduced when the number lists were cut out). */
function compose(text: string, reduced: Reduced | null): Reader | null {
  const positions = new Positions(text, reduced);
  const doc = parseDocument(reduced ? reduced.text : text, { prettyErrors: false, uniqueKeys: true });
  let lists = new Map<number, NumberList>();
  if (reduced) {
    const inPlace = listsInPlace(doc, reduced);
    if (!inPlace) return null;
    lists = inPlace;
  }
  if (doc.errors.length > 0) {
    const e = doc.errors[0];
    const p = positions.at(positions.original(e.pos[0]));
    const first = e.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
    throw new ParseError(p.line, p.column, 'valid YAML', `a syntax error (${first})`);
  }
  return new Reader(doc, positions, aliasTargets(doc), lists);
}

function describe(node: unknown): string {
  if (node === null || node === undefined) return 'nothing';
  if (isScalar(node)) {
    if (node.value === null) return 'nothing';
    if (typeof node.value === 'string') return quote(node.value);
    return String(node.value);
  }
  if (isSeq(node)) return 'a list';
  if (isMap(node)) return 'a mapping';
  return 'something else';
}

function parseYamlUnchecked(input: string, opts: ParseOptions | undefined, fastLists: boolean): Dispersion {
  checkTextSize(input, opts);
  const text = stripBom(input);
  const reduced = fastLists ? reduceNumberLists(text) : null;
  const r = (reduced && compose(text, reduced)) || compose(text, null)!;
  const doc = r.doc;

  // Refuse alias expansion beyond a small limit before walking anything.
  const bomb = firstExcessiveAlias(doc, r.aliases, (n) => r.list(n));
  if (bomb) {
    const w = r.where(bomb);
    throw new ParseError(w.line, w.column, `aliases that add at most ${MAX_ALIAS_NODES} nodes in all`, 'more');
  }

  const root = doc.contents;
  if (!isMap(root)) {
    throw new ParseError(r.where(root).line, r.where(root).column, `a mapping that starts with \`format: ${YAML_FORMAT_ID}\``, describe(root));
  }

  let format: Node | null = null;
  let segmentsNode: Node | null = null;
  let meshNode: Node | null = null;
  let meshKey: Node | null = null;
  let title: string | undefined;
  let units: FrequencyUnit = 'THz';
  let coordinates: Coordinates = 'fractional';
  let lattice: Lattice | null = null;
  let atoms: number | null = null;
  let polar = false;
  let acoustic: number | null = null;
  let acousticNode: Node | null = null;
  const metadata: Record<string, unknown> = {};

  for (const [key, keyNode, value] of r.entries(root, 'a mapping')) {
    switch (key) {
      case 'format':
        format = value ?? keyNode;
        break;
      case 'title':
        if (value && isScalar(r.resolve(value)) && (r.resolve(value) as { value: unknown }).value !== null) {
          title = String((r.resolve(value) as { value: unknown }).value);
        }
        break;
      case 'units': {
        const s = r.string(value ?? keyNode, 'a unit: THz, cm-1 or meV');
        const u = parseUnit(s);
        if (!u) r.fail(value, 'a unit: THz, cm-1 or meV');
        units = u!;
        break;
      }
      case 'coordinates': {
        const s = r.string(value ?? keyNode, '`fractional` or `cartesian`').toLowerCase();
        if (s !== 'fractional' && s !== 'cartesian') r.fail(value, '`fractional` or `cartesian`');
        coordinates = s as Coordinates;
        break;
      }
      case 'lattice':
        lattice = readYamlLattice(r, value ?? keyNode);
        break;
      case 'atoms': {
        const v = r.number(value ?? keyNode, 'atoms in the primitive cell');
        if (!Number.isInteger(v) || v < 1) r.fail(value, 'a whole number of atoms (1 or more)');
        atoms = v;
        break;
      }
      case 'polar': {
        const n = r.resolve(value);
        const v = isScalar(n) ? n.value : undefined;
        if (v === true || v === 'yes' || v === 'Yes' || v === 'YES') polar = true;
        else if (v === false || v === 'no' || v === 'No' || v === 'NO') polar = false;
        else r.fail(value ?? keyNode, '`true` or `false`');
        break;
      }
      case 'acoustic': {
        const v = r.number(value ?? keyNode, 'number of acoustic branches');
        if (!Number.isInteger(v) || v < 0) r.fail(value, 'a whole number of acoustic branches');
        acoustic = v;
        acousticNode = value;
        break;
      }
      case 'metadata': {
        if (value && !(isScalar(r.resolve(value)) && (r.resolve(value) as { value: unknown }).value === null)) {
          r.entries(value, 'a mapping of free-form metadata');
          Object.assign(metadata, r.js(value) as Record<string, unknown>);
        }
        break;
      }
      case 'segments':
        segmentsNode = value ?? keyNode;
        break;
      case 'mesh':
        meshNode = value ?? keyNode;
        meshKey = keyNode;
        break;
      default:
        metadata[key] = r.js(value);
    }
  }

  if (!format) throw new ParseError(1, null, `a \`format: ${YAML_FORMAT_ID}\` line`, 'no `format`');
  {
    const n = r.resolve(format);
    if (!isScalar(n) || n.value !== YAML_FORMAT_ID) r.fail(format, `\`${YAML_FORMAT_ID}\``);
  }
  if (segmentsNode && meshNode) r.fail(meshKey, 'either `segments` (a path) or `mesh` (a q-point mesh), not both', '`mesh` as well');
  if (!segmentsNode && !meshNode) {
    throw new ParseError(1, null, 'a `segments` list (or a `mesh` section)', 'neither');
  }

  const acc = new Accumulator(r.lists.values());
  let segments: Segment[] = [];
  let labels = new Map<number, string>();
  let kind: 'path' | 'mesh' = 'path';
  let weights: Float64Array | null = null;

  if (meshNode) {
    kind = 'mesh';
    const w: number[] = [];
    let qNode: Node | null = null;
    let fNode: Node | null = null;
    let wNode: Node | null = null;
    for (const [key, , value] of r.entries(meshNode, 'a mapping with `q`, `weights` and `frequencies`')) {
      if (key === 'q') qNode = value;
      else if (key === 'weights') wNode = value;
      else if (key === 'frequencies') fNode = value;
    }
    if (!qNode) r.fail(meshNode, 'a `q` list in the mesh', 'no `q`');
    if (!wNode) r.fail(meshNode, 'a `weights` list in the mesh', 'no `weights`');
    if (!fNode) r.fail(meshNode, 'a `frequencies` list in the mesh', 'no `frequencies`');
    const nq = acc.readQ(r, qNode!);
    const nf = acc.readFrequencies(r, fNode!);
    if (nf !== nq) r.fail(fNode, `${nq} rows of frequencies, one per q-point`, `${nf}`);
    const wl = r.list(wNode);
    if (wl) {
      if (wl.itemOffsets.length !== nq) r.fail(wNode, `${nq} weights, one per q-point`, `${wl.itemOffsets.length}`);
      if (wl.depth === 2) r.failAt(wl.itemOffsets[0], 'a number (a weight)', 'a list');
      for (const x of wl.values) w.push(x);
    } else {
      const ws = r.seq(wNode, 'weights, one per q-point');
      if (ws.length !== nq) r.fail(wNode, `${nq} weights, one per q-point`, `${ws.length}`);
      for (const x of ws) w.push(r.number(x, 'a weight'));
    }
    if (nq === 0) r.fail(qNode, 'at least one q-point', 'none');
    weights = Float64Array.from(w);
  } else {
    const list = r.seq(segmentsNode, 'segments');
    if (list.length === 0) r.fail(segmentsNode, 'at least one segment', 'an empty list');
    let withQ: boolean | null = null;
    let withDistance: boolean | null = null;
    for (let s = 0; s < list.length; s++) {
      const segNode = list[s];
      let from: string | undefined;
      let to: string | undefined;
      let qNode: Node | null = null;
      let dNode: Node | null = null;
      let fNode: Node | null = null;
      for (const [key, , value] of r.entries(segNode, 'a segment: a mapping with `from`, `to`, `q`, `frequencies`')) {
        if (key === 'from') from = r.string(value, 'a label for `from`');
        else if (key === 'to') to = r.string(value, 'a label for `to`');
        else if (key === 'q') qNode = value;
        else if (key === 'distance') dNode = value;
        else if (key === 'frequencies') fNode = value;
      }
      if (!fNode) r.fail(segNode, 'a `frequencies` list in the segment', 'no `frequencies`');
      if (!qNode && !dNode) r.fail(segNode, '`q` (one [x, y, z] per point) or `distance` (one number per point)', 'neither');
      if (withQ !== null && withQ !== !!qNode) {
        r.fail(segNode, withQ ? '`q` in every segment, like the first one' : 'no `q` in any segment, like the first one');
      }
      if (withDistance !== null && withDistance !== !!dNode) {
        r.fail(segNode, withDistance ? '`distance` in every segment, like the first one' : 'no `distance` in any segment, like the first one');
      }
      withQ = !!qNode;
      withDistance = !!dNode;

      const start = acc.nq;
      const nf = acc.readFrequencies(r, fNode!);
      if (nf === 0) r.fail(fNode, 'at least one point in the segment', 'none');
      if (qNode) {
        const nqs = acc.readQ(r, qNode);
        if (nqs !== nf) r.fail(qNode, `as many q-points as frequency rows (${nf})`, `${nqs}`);
      }
      if (dNode) {
        const nds = acc.readDistance(r, dNode);
        if (nds !== nf) r.fail(dNode, `as many distances as frequency rows (${nf})`, `${nds}`);
      }
      const end = start + nf - 1;
      const seg: Segment = { start, end, connectedToNext: false };
      if (from !== undefined) {
        seg.from = from;
        labels.set(start, from);
      }
      if (to !== undefined) {
        seg.to = to;
        labels.set(end, to);
      }
      const prev = segments[segments.length - 1];
      if (prev && prev.to !== undefined && from !== undefined && sameLabel(prev.to, from)) prev.connectedToNext = true;
      segments.push(seg);
    }
  }

  const nq = acc.nq;
  const nb = acc.nb;
  if (acoustic !== null && acoustic > nb) r.fail(acousticNode, `at most ${nb} acoustic branches (the file has ${nb} branches)`, `${acoustic}`);
  if (kind === 'mesh') labels = new Map();

  return finish(
    {
      format: 'yaml',
      kind,
      title,
      nq,
      nb,
      frequencies: acc.frequencies(),
      q: acc.qArray(),
      coordinates,
      distance: acc.distanceArray(),
      weights,
      lattice,
      units,
      labels,
      segments,
      atoms,
      polar,
      acoustic,
      metadata,
    },
    opts?.overrides,
  );
}

/**
 * Each alias and the node it stands for: the last node before it (document order) with that
 * anchor. One pass; the yaml package's own Alias#resolve walks the whole document per call.
 */
function aliasTargets(doc: Document): Map<unknown, Node | undefined> {
  const anchors = new Map<string, Node>();
  const targets = new Map<unknown, Node | undefined>();
  visit(doc, {
    Node(_, node) {
      if (isAlias(node)) targets.set(node, anchors.get(node.source));
      else if (node.anchor) anchors.set(node.anchor, node as Node);
    },
  });
  return targets;
}

/**
 * The alias at which the expanded document first grows by more than MAX_ALIAS_NODES nodes
 * (document order), or null. Sizes are memoised per node, so an exponential "billion laughs"
 * document is measured in linear time; a node that contains an alias to itself is infinite.
 */
function firstExcessiveAlias(
  doc: Document,
  targets: Map<unknown, Node | undefined>,
  listOf: (node: unknown) => NumberList | undefined,
): Node | null {
  if (targets.size === 0) return null;
  const size = new Map<unknown, number>();
  const measure = (node: unknown): number => {
    if (isAlias(node)) return measure(targets.get(node));
    // A list read apart counts the nodes it would have been.
    const list = listOf(node);
    if (list) return list.nodes;
    const known = size.get(node);
    if (known !== undefined) return known;
    if (isScalar(node) || node === null || node === undefined) return 1;
    size.set(node, Infinity); // in progress: a cycle is infinite
    let n = 1;
    if (isSeq(node)) for (const it of node.items) n += measure(it);
    else if (isMap(node)) for (const p of node.items) n += measure(p.key) + measure(p.value);
    size.set(node, n);
    return n;
  };
  let added = 0;
  for (const alias of targets.keys()) {
    added += measure(alias);
    if (added > MAX_ALIAS_NODES) return alias as Node;
  }
  return null;
}

function sameLabel(a: string, b: string): boolean {
  return a === b || (isGammaLabel(a) && isGammaLabel(b));
}

function readYamlLattice(r: Reader, node: Node): Lattice {
  const n = r.resolve(node);
  if (isScalar(n) && typeof n.value === 'string') {
    const lat = readLattice(n.value);
    if (!Array.isArray(lat)) r.fail(node, lat.message.replace(/^expected /, ''), quote(n.value));
    return lat as Lattice;
  }
  const rows = r.seq(node, 'the lattice: three rows [x, y, z] in Å');
  if (rows.length !== 3) r.fail(node, 'three lattice vectors (rows [x, y, z] in Å)', `${rows.length}`);
  const lat = rows.map((row) => {
    const xs = r.seq(row, 'a lattice vector [x, y, z]');
    if (xs.length !== 3) r.fail(row, 'three numbers in a lattice vector', `${xs.length}`);
    return xs.map((x) => r.number(x, 'a lattice component in Å'));
  }) as Lattice;
  const scale = lat.reduce((p, v) => p * Math.hypot(v[0], v[1], v[2]), 1);
  if (!(Math.abs(det3(lat)) > 1e-9 * scale)) r.fail(node, 'three independent lattice vectors', 'a cell with no volume');
  return lat;
}

/** A Float64Array that grows as values are appended; sized up front from the lists read apart. */
class Values {
  private a: Float64Array;
  n = 0;
  constructor(size: number) {
    this.a = new Float64Array(Math.max(256, size));
  }
  private room(k: number): void {
    if (this.n + k <= this.a.length) return;
    const b = new Float64Array(Math.max(this.a.length * 2, this.n + k));
    b.set(this.a.subarray(0, this.n));
    this.a = b;
  }
  push(v: number): void {
    this.room(1);
    this.a[this.n++] = v;
  }
  append(vs: Float64Array): void {
    this.room(vs.length);
    this.a.set(vs, this.n);
    this.n += vs.length;
  }
  take(): Float64Array {
    return this.n === this.a.length ? this.a : this.a.slice(0, this.n);
  }
}

/** Grows flat arrays as segments are read; the frequency width is fixed by the first row. */
class Accumulator {
  nq = 0;
  nb = -1;
  private f: Values;
  private q: Values;
  private d: Values;

  constructor(lists: Iterable<NumberList>) {
    const size = { q: 0, frequencies: 0, distance: 0, weights: 0 };
    for (const l of lists) size[l.key] += l.values.length;
    this.f = new Values(size.frequencies);
    this.q = new Values(size.q);
    this.d = new Values(size.distance);
  }
  /** Offset of the first frequency row in the original text. */
  private firstRow = 0;

  private widthError(r: Reader): string {
    return `${this.nb} frequencies per row, like line ${r.positions.at(this.firstRow).line}`;
  }

  readFrequencies(r: Reader, node: Node): number {
    const l = r.list(node);
    if (l) {
      if (!l.rowLengths) return r.failAt(l.itemOffsets[0], 'a list (a row of frequencies, one per branch)', String(l.values[0]));
      const lens = l.rowLengths;
      for (let i = 0; i < lens.length; i++) {
        const len = lens[i];
        if (this.nb < 0) {
          if (len === 0) r.failAt(l.itemOffsets[i], 'at least one frequency per row', 'an empty row');
          this.nb = len;
          this.firstRow = l.itemOffsets[i];
        } else if (len !== this.nb) r.failAt(l.itemOffsets[i], this.widthError(r), `${len}`);
      }
      this.f.append(l.values);
      this.nq += lens.length;
      return lens.length;
    }
    const rows = r.seq(node, 'frequency rows, one per q-point');
    for (const row of rows) {
      const xs = r.seq(row, 'a row of frequencies, one per branch');
      if (this.nb < 0) {
        if (xs.length === 0) r.fail(row, 'at least one frequency per row', 'an empty row');
        this.nb = xs.length;
        this.firstRow = r.offsetOf(row) ?? 0;
      } else if (xs.length !== this.nb) {
        r.fail(row, this.widthError(r), `${xs.length}`);
      }
      for (const x of xs) this.f.push(r.number(x, 'a frequency'));
    }
    this.nq += rows.length;
    return rows.length;
  }

  readQ(r: Reader, node: Node): number {
    const l = r.list(node);
    if (l) {
      if (!l.rowLengths) return r.failAt(l.itemOffsets[0], 'a list (a q-point [x, y, z])', String(l.values[0]));
      const lens = l.rowLengths;
      for (let i = 0; i < lens.length; i++) {
        if (lens[i] !== 3) r.failAt(l.itemOffsets[i], 'three coordinates [x, y, z]', `${lens[i]}`);
      }
      this.q.append(l.values);
      return lens.length;
    }
    const rows = r.seq(node, 'q-points, one [x, y, z] per point');
    for (const row of rows) {
      const xs = r.seq(row, 'a q-point [x, y, z]');
      if (xs.length !== 3) r.fail(row, 'three coordinates [x, y, z]', `${xs.length}`);
      for (const x of xs) this.q.push(r.number(x, 'a q coordinate'));
    }
    return rows.length;
  }

  readDistance(r: Reader, node: Node): number {
    const l = r.list(node);
    if (l) {
      if (l.rowLengths) return r.failAt(l.itemOffsets[0], 'a number (a distance)', 'a list');
      this.d.append(l.values);
      return l.values.length;
    }
    const xs = r.seq(node, 'distances, one per point');
    for (const x of xs) this.d.push(r.number(x, 'a distance'));
    return xs.length;
  }

  frequencies(): Float64Array {
    return this.f.take();
  }
  qArray(): Float64Array | null {
    return this.q.n ? this.q.take() : null;
  }
  distanceArray(): Float64Array | null {
    return this.d.n ? this.d.take() : null;
  }
}
