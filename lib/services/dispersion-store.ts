/**
 * A Dispersion to and from its database form: the number arrays as little-endian Float64 bytes
 * (bytea), everything else as a small JSON (StoredDispersionMeta).
 */
import type { StoredDispersionMeta } from '@/entities';
import type { Em } from '@/lib/db/orm';
import type { Dispersion } from '@/lib/dispersion/types';

const littleEndian = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

function toBytes(a: Float64Array): Buffer {
  if (!littleEndian) {
    const b = Buffer.alloc(a.length * 8);
    for (let i = 0; i < a.length; i++) b.writeDoubleLE(a[i], i * 8);
    return b;
  }
  // A view, not a copy: the driver sends it as it is.
  return Buffer.from(a.buffer, a.byteOffset, a.byteLength);
}

function fromBytes(b: Uint8Array, expected: number, what: string): Float64Array {
  if (b.byteLength !== expected * 8) {
    throw new Error(`stored dispersion: ${what} has ${b.byteLength} bytes, expected ${expected} × 8`);
  }
  if (!littleEndian) {
    const view = new DataView(b.buffer, b.byteOffset, b.byteLength);
    return Float64Array.from({ length: expected }, (_, i) => view.getFloat64(i * 8, true));
  }
  // A buffer of its own (base64 decoding makes one) is used as it is; slices of the driver's
  // or Node's shared pools are not 8-byte aligned: copy once into an aligned buffer.
  if (b.byteOffset % 8 === 0 && b.buffer.byteLength >= b.byteOffset + b.byteLength) return new Float64Array(b.buffer, b.byteOffset, expected);
  const copy = new Uint8Array(b.byteLength);
  copy.set(b);
  return new Float64Array(copy.buffer);
}

export interface StoredColumns {
  meta: StoredDispersionMeta;
  frequencies: Buffer;
  q: Buffer | null;
  distances: Buffer | null;
  weights: Buffer | null;
  byteSize: number;
}

export function toStoredColumns(d: Dispersion): StoredColumns {
  const meta: StoredDispersionMeta = {
    format: d.format,
    kind: d.kind,
    title: d.title ?? null,
    nq: d.nq,
    nb: d.nb,
    coordinates: d.coordinates,
    lattice: d.lattice,
    units: d.units,
    labels: [...d.labels.entries()].sort((a, b) => a[0] - b[0]),
    segments: d.segments.map((s) => ({ ...s })),
    atoms: d.atoms,
    polar: d.polar,
    acoustic: d.acoustic,
    metadata: d.metadata,
    encoding: 'f64le',
  };
  const frequencies = toBytes(d.frequencies);
  const q = d.q ? toBytes(d.q) : null;
  const distances = d.distance ? toBytes(d.distance) : null;
  const weights = d.weights ? toBytes(d.weights) : null;
  const byteSize = [frequencies, q, distances, weights].reduce((n, b) => n + (b?.byteLength ?? 0), 0);
  return { meta, frequencies, q, distances, weights, byteSize };
}

export function fromStoredColumns(row: {
  meta: StoredDispersionMeta;
  frequencies: Uint8Array;
  q?: Uint8Array | null;
  distances?: Uint8Array | null;
  weights?: Uint8Array | null;
}): Dispersion {
  const m = row.meta;
  if (m.encoding !== 'f64le') throw new Error(`stored dispersion: unknown encoding ${JSON.stringify(m.encoding)}`);
  return {
    format: m.format,
    kind: m.kind,
    ...(m.title === null ? {} : { title: m.title }),
    nq: m.nq,
    nb: m.nb,
    frequencies: fromBytes(row.frequencies, m.nq * m.nb, 'frequencies'),
    q: row.q ? fromBytes(row.q, 3 * m.nq, 'q') : null,
    coordinates: m.coordinates,
    distance: row.distances ? fromBytes(row.distances, m.nq, 'distances') : null,
    weights: row.weights ? fromBytes(row.weights, m.nq, 'weights') : null,
    lattice: m.lattice,
    units: m.units,
    labels: new Map(m.labels),
    segments: m.segments.map((s) => ({ ...s })),
    atoms: m.atoms,
    polar: m.polar,
    acoustic: m.acoustic,
    metadata: m.metadata,
  };
}

const arrayColumns = ['frequencies', 'q', 'distances', 'weights'] as const;
export type StoredArrayColumn = (typeof arrayColumns)[number];

/**
 * The stored dispersion of a revision, or null; the arrays not asked for are left null (the
 * frequencies always come). Read with plain SQL and `encode(…, 'base64')`: the driver returns
 * bytea as hex text (twice the bytes, then a hex decode) and the ORM would also snapshot tens
 * of megabytes for change tracking; base64 is a third smaller on the wire and decodes straight
 * into a buffer the Float64Arrays view without a copy.
 */
export async function loadStoredDispersion(
  em: Em,
  revisionId: string,
  columns: readonly StoredArrayColumn[] = arrayColumns,
): Promise<Dispersion | null> {
  const wanted = new Set<StoredArrayColumn>(['frequencies', ...columns]);
  const select = arrayColumns.map((c) => (wanted.has(c) ? `encode(${c}, 'base64') as ${c}` : `null as ${c}`)).join(', ');
  const rows = await em
    .getConnection()
    .execute<({ meta: StoredDispersionMeta } & Record<StoredArrayColumn, string | null>)[]>(
      `select meta, ${select} from stored_dispersion where revision_id = ?`,
      [revisionId],
      'all',
      em.getTransactionContext(),
    );
  const row = rows[0];
  if (!row) return null;
  const bytes = (b64: string | null) => (b64 === null ? null : Buffer.from(b64, 'base64'));
  return fromStoredColumns({
    meta: row.meta,
    frequencies: bytes(row.frequencies)!,
    q: bytes(row.q),
    distances: bytes(row.distances),
    weights: bytes(row.weights),
  });
}
