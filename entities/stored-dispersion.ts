import { defineEntity, type InferEntity } from '@mikro-orm/core';
import type { Coordinates, FrequencyUnit, Lattice, Segment, SourceFormat } from '../lib/dispersion/types';
import { Revision } from './revision';

/** Everything of a Dispersion except its number arrays: small, kept as JSON. */
export interface StoredDispersionMeta {
  format: SourceFormat;
  kind: 'path' | 'mesh';
  title: string | null;
  nq: number;
  nb: number;
  coordinates: Coordinates;
  lattice: Lattice | null;
  units: FrequencyUnit;
  labels: [number, string][];
  segments: Segment[];
  atoms: number | null;
  polar: boolean;
  acoustic: number;
  metadata: Record<string, unknown>;
  /** Element type and byte order of the bytea columns. */
  encoding: 'f64le';
}

/**
 * A revision's parsed dispersion. The arrays are little-endian Float64 in bytea columns (one
 * value never becomes a row or a JSON number). Float64 because these are the values screening
 * ran on: re-screening from here, or looking up a thread's anchor, gives exactly the file's
 * numbers; the plot endpoint narrows to Float32 on the way out.
 */
export const StoredDispersion = defineEntity({
  name: 'StoredDispersion',
  tableName: 'stored_dispersion',
  properties: (p) => ({
    revision: p.oneToOne(Revision).primary().deleteRule('cascade'),
    meta: p.json<StoredDispersionMeta>().columnType('jsonb'),
    /** THz, point-major [iq * nb + k], ascending at each point (the parser's layout). */
    frequencies: p.blob().lazy(true, false),
    q: p.blob().lazy(true, false).nullable(),
    distances: p.blob().lazy(true, false).nullable(),
    weights: p.blob().lazy(true, false).nullable(),
    byteSize: p.bigint('number'),
  }),
});
export type StoredDispersion = InferEntity<typeof StoredDispersion>;
