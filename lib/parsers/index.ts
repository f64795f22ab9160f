/**
 * Band-file parsers: columns and YAML into one `Dispersion` (band-files.md). Every failure is a
 * ParseError naming the line, the column where it applies, and what was expected.
 */
import type { Dispersion, SourceFormat } from '../dispersion/types';
import { parseColumns } from './columns';
import { decodeInput } from './input';
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

/** Format from opts.format, else the file name's extension, else the content. */
export function parseBandFile(input: string | Uint8Array, opts: ParseOptions = {}): Dispersion {
  try {
    const text = decodeInput(input, opts);
    const format = opts.format ?? formatFromFilename(opts.filename) ?? sniffFormat(text);
    return format === 'yaml' ? parseYaml(text, opts) : parseColumns(text, opts);
  } catch (e) {
    throw asParseError(e);
  }
}
