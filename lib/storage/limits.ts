/**
 * What a band file upload may be: the extensions the parsers read (band-files.md) and the size
 * limit. Shared by the upload route, the multipart API and the pages (no server imports here).
 */
export const BAND_FILE_EXTENSIONS = ['.txt', '.dat', '.csv', '.tsv', '.yaml', '.yml'] as const;

/** 64 MiB: the parsers' own limit (lib/parsers DEFAULT_MAX_BYTES) and the upload route's. */
export const MAX_BAND_FILE_BYTES = 64 * 1024 * 1024;

/** The same limit written the way the upload SDK's route config wants it (1024-based units). */
export const MAX_BAND_FILE_SIZE = '64MB' as const;

export type BandFileProblem =
  | { code: 'too_large'; message: string }
  | { code: 'wrong_type'; message: string }
  | { code: 'empty'; message: string };

export function extensionOf(name: string): string {
  const m = /\.[^./\\]+$/.exec(name);
  return m ? m[0].toLowerCase() : '';
}

/** Why a file cannot be a band file, judged from its name and size alone, or null. */
export function bandFileProblem(file: { name: string; size: number }): BandFileProblem | null {
  const ext = extensionOf(file.name);
  if (!(BAND_FILE_EXTENSIONS as readonly string[]).includes(ext)) {
    return {
      code: 'wrong_type',
      message: `"${file.name}" is not a band file: accepted extensions are ${BAND_FILE_EXTENSIONS.join(' ')}.`,
    };
  }
  if (file.size > MAX_BAND_FILE_BYTES) {
    const mib = (file.size / 1024 / 1024).toFixed(1);
    return { code: 'too_large', message: `"${file.name}" is ${mib} MiB; the limit is 64 MiB.` };
  }
  if (file.size === 0) return { code: 'empty', message: `"${file.name}" is empty.` };
  return null;
}
