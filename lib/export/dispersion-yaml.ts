/**
 * The dispersion in our YAML schema (branchwise-dispersion/1, read back by lib/parsers), with
 * where it came from added under `metadata.review` so the file stays traceable on its own.
 */
import type { Dispersion } from '@/lib/dispersion/types';
import { joinChunks, yamlChunks } from '@/lib/writers';

export interface ExportProvenance {
  spectrumId: string;
  title: string;
  group: string;
  revision: number;
  status: string;
  exportedAt: Date;
  link: string;
}

export function dispersionYaml(d: Dispersion, from: ExportProvenance): string {
  return joinChunks(dispersionYamlChunks(d, from));
}

/** The same text as dispersionYaml, in chunks; throws before the first chunk if it cannot be written. */
export function dispersionYamlChunks(d: Dispersion, from: ExportProvenance): Iterable<string> {
  return yamlChunks(withProvenance(d, from));
}

function withProvenance(d: Dispersion, from: ExportProvenance): Dispersion {
  return {
    ...d,
    title: d.title ?? from.title,
    metadata: {
      ...d.metadata,
      review: {
        spectrum: from.spectrumId,
        title: from.title,
        group: from.group,
        revision: from.revision,
        status: from.status,
        exported: from.exportedAt.toISOString(),
        link: from.link,
      },
    },
  };
}
