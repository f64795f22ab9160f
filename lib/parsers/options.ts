import type { FrequencyUnit, Lattice, SourceFormat } from '../dispersion/types';

export interface ParseOverrides {
  /** The unit the file's frequencies are in (replaces the file's `units`). */
  units?: FrequencyUnit;
  lattice?: Lattice;
  polar?: boolean;
  atoms?: number;
}

export interface ParseOptions {
  filename?: string;
  format?: SourceFormat;
  /** Largest accepted input, in bytes (UTF-8). Default 64 MiB. */
  maxBytes?: number;
  /** Values from the command line (`--units`, `--lattice`, `--polar`, `--atoms`); they replace the file's. */
  overrides?: ParseOverrides;
}

export const DEFAULT_MAX_BYTES = 64 * 1024 * 1024;
