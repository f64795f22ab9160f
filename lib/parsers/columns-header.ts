/** The `# key: value` directives of a columns file, read and checked where they stand. */
import type { Coordinates, FrequencyUnit, Lattice } from '../dispersion/types';
import { readLattice } from '../physics/lattice';
import { parseUnit } from '../physics/units';
import { ParseError, quote } from './parse-error';

export interface LabelEntry {
  index: number;
  label: string;
  /** 1-based column of the `index=label` pair. */
  column: number;
}

export interface ColumnsHeader {
  title?: string;
  units: FrequencyUnit;
  hasDistance: boolean;
  hasQ: boolean;
  columnsLine: number;
  coordinates: Coordinates;
  lattice: Lattice | null;
  labels: LabelEntry[];
  labelsLine: number;
  atoms: number | null;
  polar: boolean;
  acoustic: number | null;
  acousticLine: number;
  layout: 'rows' | 'blocks' | null;
  layoutLine: number;
  weights: boolean;
  weightsLine: number;
  metadata: Record<string, unknown>;
}

export function emptyHeader(): ColumnsHeader {
  return {
    units: 'THz',
    hasDistance: true,
    hasQ: false,
    columnsLine: 0,
    coordinates: 'fractional',
    lattice: null,
    labels: [],
    labelsLine: 0,
    atoms: null,
    polar: false,
    acoustic: null,
    acousticLine: 0,
    layout: null,
    layoutLine: 0,
    weights: false,
    weightsLine: 0,
    metadata: {},
  };
}

const DIRECTIVE = /^\s*([A-Za-z][A-Za-z0-9_.-]*)\s*:(.*)$/;

function yesNo(v: string): boolean | null {
  const t = v.toLowerCase();
  if (t === 'yes' || t === 'true' || t === '1' || t === 'y') return true;
  if (t === 'no' || t === 'false' || t === '0' || t === 'n') return false;
  return null;
}

function nonNegativeInteger(v: string): number | null {
  return /^\d{1,9}$/.test(v) ? Number(v) : null;
}

/**
 * Reads one comment line before the first data row. `body` is the text after '#', and
 * `bodyColumn` the 1-based column of its first character. Lines that are not `key: value`
 * are plain comments.
 */
export function readDirective(h: ColumnsHeader, body: string, line: number, bodyColumn: number): void {
  const m = DIRECTIVE.exec(body);
  if (!m) return;
  const rawKey = m[1];
  const key = rawKey.toLowerCase();
  const afterColon = body.length - m[2].length;
  const lead = m[2].length - m[2].trimStart().length;
  const value = m[2].trim();
  const col = bodyColumn + afterColon + lead; // column of the value's first character
  const fail = (expected: string, found: string | null = value === '' ? 'nothing' : quote(value), c = col): never => {
    throw new ParseError(line, c, expected, found);
  };
  switch (key) {
    case 'units': {
      const u = parseUnit(value);
      if (!u) fail('a unit: THz, cm-1 or meV');
      h.units = u!;
      return;
    }
    case 'columns': {
      const parts = value.toLowerCase().split(/[\s,;]+/).filter(Boolean);
      const s = parts.join(' ');
      if (s === 'distance') Object.assign(h, { hasDistance: true, hasQ: false });
      else if (s === 'q') Object.assign(h, { hasDistance: false, hasQ: true });
      else if (s === 'distance q') Object.assign(h, { hasDistance: true, hasQ: true });
      else fail('`distance`, `q` or `distance q`');
      h.columnsLine = line;
      return;
    }
    case 'coords':
    case 'coordinates': {
      const t = value.toLowerCase();
      if (t !== 'fractional' && t !== 'cartesian') fail('`fractional` or `cartesian`');
      h.coordinates = t as Coordinates;
      return;
    }
    case 'lattice': {
      const r = readLattice(value);
      if (!Array.isArray(r)) throw new ParseError(line, col + Math.min(r.offset, value.length), r.message.replace(/^expected /, ''));
      h.lattice = r;
      return;
    }
    case 'labels': {
      h.labels = [];
      h.labelsLine = line;
      const re = /\S+/g;
      let t: RegExpExecArray | null;
      while ((t = re.exec(value)) !== null) {
        const pair = /^(\d{1,9})=(.+)$/.exec(t[0]);
        if (!pair) fail('`index=label` pairs separated by spaces, e.g. `0=Γ 40=X`', quote(t[0]), col + t.index);
        h.labels.push({ index: Number(pair![1]), label: pair![2], column: col + t.index });
      }
      return;
    }
    case 'atoms': {
      const v = nonNegativeInteger(value);
      if (v === null || v === 0) fail('a whole number of atoms (1 or more)');
      h.atoms = v;
      return;
    }
    case 'polar': {
      const v = yesNo(value);
      if (v === null) fail('`yes` or `no`');
      h.polar = v!;
      return;
    }
    case 'acoustic': {
      const v = nonNegativeInteger(value);
      if (v === null) fail('a whole number of acoustic branches');
      h.acoustic = v;
      h.acousticLine = line;
      return;
    }
    case 'layout': {
      const t = value.toLowerCase();
      if (t !== 'rows' && t !== 'blocks') fail('`rows` or `blocks`');
      h.layout = t as 'rows' | 'blocks';
      h.layoutLine = line;
      return;
    }
    case 'weights': {
      const v = yesNo(value);
      if (v === null) fail('`yes` or `no`');
      h.weights = v!;
      h.weightsLine = line;
      return;
    }
    case 'title':
      h.title = value;
      return;
    default:
      h.metadata[rawKey] = value;
  }
}
