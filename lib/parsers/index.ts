/**
 * Band-file parsers: columns and YAML into one `Dispersion` (band-files.md). Every failure is a
 * ParseError naming the line, the column where it applies, and what was expected.
 */
import type { Dispersion, SourceFormat } from '../dispersion/types';
import { parseColumns } from './columns';
import { checkByteSize, decodeInput, decodeLoose, skipBom } from './input';
import type { ParseOptions } from './options';
import { asParseError } from './parse-error';
import { parseYaml } from './yaml';

export { parseColumns } from './columns';
export { parseYaml, YAML_FORMAT_ID, MAX_ALIAS_NODES } from './yaml';
export { ParseError } from './parse-error';
export { DEFAULT_MAX_BYTES, type ParseOptions, type ParseOverrides } from './options';

const EXTENSIONS: Record<string, SourceFormat> = {
  txt: 'columns',
  dat: 'columns',
  csv: 'columns',
  tsv: 'columns',
  yaml: 'yaml',
  yml: 'yaml',
};

/** The format a file name announces, if any. */
export function formatFromFilename(filename: string | undefined): SourceFormat | null {
  if (!filename) return null;
  const m = /\.([A-Za-z0-9]+)$/.exec(filename);
  return (m && EXTENSIONS[m[1].toLowerCase()]) || null;
}

/**
 * Guesses the format from the text: the first line that is neither blank nor a `#` comment
 * starts with a number in a columns file, and with a key (or `---`) in a YAML file.
 */
export function sniffFormat(text: string): SourceFormat {
  const m = /^[ \t]*([^\s#])/m.exec(text);
  if (!m) return 'columns';
  const start = text.slice(m.index, m.index + 8).trimStart();
  return /^[-+.\d]/.test(start) && !/^(---|-\s)/.test(start) ? 'columns' : 'yaml';
}

/**
 * The sniff on bytes: decodes only as much of the start as it takes to see the first line that
 * is neither blank nor a comment (the data of a columns file is never decoded as a whole).
 */
function sniffBytes(bytes: Uint8Array): SourceFormat {
  for (let size = 64 * 1024; ; size *= 4) {
    const whole = size >= bytes.length;
    const head = decodeLoose(bytes, 0, Math.min(size, bytes.length));
    const m = /^[ \t]*([^\s#])/m.exec(head);
    // Decide only with the 8 characters sniffFormat looks at in hand.
    if (whole || (m && m.index + 9 < head.length)) return sniffFormat(head);
  }
}

/**
 * Format from opts.format, else the file name's extension, else the content. Bytes (uploads)
 * go to the columns reader as they are; YAML is decoded first (the yaml package reads text).
 */
export function parseBandFile(input: string | Uint8Array, opts: ParseOptions = {}): Dispersion {
  try {
    const named = opts.format ?? formatFromFilename(opts.filename);
    if (typeof input === 'string') {
      const text = decodeInput(input, opts);
      return (named ?? sniffFormat(text)) === 'yaml' ? parseYaml(text, opts) : parseColumns(text, opts);
    }
    checkByteSize(input, opts);
    const bytes = skipBom(input);
    const format = named ?? sniffBytes(bytes);
    return format === 'yaml' ? parseYaml(decodeInput(input, opts), opts) : parseColumns(bytes, opts);
  } catch (e) {
    throw asParseError(e);
  }
}
