/**
 * The YAML format: the Branchwise dispersion schema `branchwise-dispersion/1` (band-files.md §2),
 * plus the `mesh:` form of docs/formats.md. The document is read with the `yaml` package and
 * walked node by node, so every error points at the line and column of the offending node.
 */
import { Document, isAlias, isMap, isScalar, isSeq, LineCounter, parseDocument, visit, type Node } from 'yaml';
import type { Coordinates, Dispersion, FrequencyUnit, Lattice, Segment } from '../dispersion/types';
import { det3, readLattice } from '../physics/lattice';
import { isGammaLabel } from '../physics/path';
import { parseUnit } from '../physics/units';
import { finish } from './assemble';
import { checkTextSize, stripBom } from './input';
import type { ParseOptions } from './options';
import { asParseError, ParseError, quote } from './parse-error';

export const YAML_FORMAT_ID = 'branchwise-dispersion/1';
/** Aliases may repeat small pieces; anything that expands further is refused: the nodes that all aliases of a document may add when expanded. */
export const MAX_ALIAS_NODES = 10_000;

export function parseYaml(text: string, opts?: ParseOptions): Dispersion {
  try {
    return parseYamlUnchecked(text, opts);
  } catch (e) {
    throw asParseError(e);
  }
}

type Where = { line: number; column: number | null };

class Reader {
  constructor(
    readonly doc: Document,
    readonly lc: LineCounter,
    readonly aliases: Map<unknown, Node | undefined>,
  ) {}

  where(node: unknown): Where {
    const r = (node as Node | null)?.range;
    if (!r) return { line: 1, column: null };
    const p = this.lc.linePos(r[0]);
    return { line: p.line, column: p.col };
  }

  fail(node: unknown, expected: string, found?: string): never {
    const w = this.where(node);
    throw new ParseError(w.line, w.column, expected, found ?? describe(this.resolve(node)));
  }

  resolve(node: unknown): unknown {
    return isAlias(node) ? this.aliases.get(node) : node;
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

function parseYamlUnchecked(input: string, opts: ParseOptions | undefined): Dispersion {
  checkTextSize(input, opts);
  const text = stripBom(input);
  const lc = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lc, prettyErrors: true, uniqueKeys: true });
  if (doc.errors.length > 0) {
    const e = doc.errors[0];
    const p = e.linePos?.[0] ?? lc.linePos(e.pos[0]);
    const first = e.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
    throw new ParseError(p.line, p.col, 'valid YAML', `a syntax error (${first})`);
  }
  const aliases = aliasTargets(doc);
  const r = new Reader(doc, lc, aliases);

  // Refuse alias expansion beyond a small limit before walking anything.
  const bomb = firstExcessiveAlias(doc, aliases);
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

  const acc = new Accumulator();
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
    const ws = r.seq(wNode, 'weights, one per q-point');
    if (ws.length !== nq) r.fail(wNode, `${nq} weights, one per q-point`, `${ws.length}`);
    for (const x of ws) w.push(r.number(x, 'a weight'));
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
function firstExcessiveAlias(doc: Document, targets: Map<unknown, Node | undefined>): Node | null {
  if (targets.size === 0) return null;
  const size = new Map<unknown, number>();
  const measure = (node: unknown): number => {
    if (isAlias(node)) return measure(targets.get(node));
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

/** Grows flat arrays as segments are read; the frequency width is fixed by the first row. */
class Accumulator {
  nq = 0;
  nb = -1;
  private f: number[] = [];
  private q: number[] = [];
  private d: number[] = [];
  private firstRow: Node | null = null;

  readFrequencies(r: Reader, node: Node): number {
    const rows = r.seq(node, 'frequency rows, one per q-point');
    for (const row of rows) {
      const xs = r.seq(row, 'a row of frequencies, one per branch');
      if (this.nb < 0) {
        if (xs.length === 0) r.fail(row, 'at least one frequency per row', 'an empty row');
        this.nb = xs.length;
        this.firstRow = row;
      } else if (xs.length !== this.nb) {
        const w = r.where(this.firstRow);
        r.fail(row, `${this.nb} frequencies per row, like line ${w.line}`, `${xs.length}`);
      }
      for (const x of xs) this.f.push(r.number(x, 'a frequency'));
    }
    this.nq += rows.length;
    return rows.length;
  }

  readQ(r: Reader, node: Node): number {
    const rows = r.seq(node, 'q-points, one [x, y, z] per point');
    for (const row of rows) {
      const xs = r.seq(row, 'a q-point [x, y, z]');
      if (xs.length !== 3) r.fail(row, 'three coordinates [x, y, z]', `${xs.length}`);
      for (const x of xs) this.q.push(r.number(x, 'a q coordinate'));
    }
    return rows.length;
  }

  readDistance(r: Reader, node: Node): number {
    const xs = r.seq(node, 'distances, one per point');
    for (const x of xs) this.d.push(r.number(x, 'a distance'));
    return xs.length;
  }

  frequencies(): Float64Array {
    return Float64Array.from(this.f);
  }
  qArray(): Float64Array | null {
    return this.q.length ? Float64Array.from(this.q) : null;
  }
  distanceArray(): Float64Array | null {
    return this.d.length ? Float64Array.from(this.d) : null;
  }
}
