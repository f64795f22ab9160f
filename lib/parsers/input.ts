/** Bytes or text in, text out: the size limit, UTF-8 decoding and the BOM. */
import { DEFAULT_MAX_BYTES, type ParseOptions } from './options';
import { ParseError } from './parse-error';

function describeBytes(n: number): string {
  if (n >= 1024 * 1024 && n % (1024 * 1024) === 0) return `${n / (1024 * 1024)} MiB`;
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(1)} MiB`;
  return `${n} bytes`;
}

function tooLarge(size: number, max: number): ParseError {
  return new ParseError(1, null, `a file of at most ${describeBytes(max)}`, `${describeBytes(size)}`);
}

/** UTF-8 length of a string, stopping early once it is known to exceed `limit`. */
function utf8Length(s: string, limit: number): number {
  let n = 0;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c < 0x80) n += 1;
    else if (c < 0x800) n += 2;
    else if (c >= 0xd800 && c <= 0xdbff) {
      n += 4;
      i++;
    } else n += 3;
    if (n > limit) return n;
  }
  return n;
}

export function checkTextSize(text: string, opts: ParseOptions | undefined): void {
  const max = opts?.maxBytes ?? DEFAULT_MAX_BYTES;
  if (text.length <= max / 3) return; // even at 3 bytes a character it fits
  if (text.length > max) throw tooLarge(text.length, max);
  // Node's native count when available (fast on 40 MB); the loop elsewhere.
  const B = (globalThis as { Buffer?: { byteLength(s: string, enc: string): number } }).Buffer;
  const n = B ? B.byteLength(text, 'utf8') : utf8Length(text, max);
  if (n > max) throw tooLarge(n, max);
}

/** Line and column (1-based) of a character offset. */
export function lineColumnAt(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      lineStart = i + 1;
    }
  }
  return { line, column: offset - lineStart + 1 };
}

export function stripBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

export function decodeInput(input: string | Uint8Array, opts: ParseOptions | undefined): string {
  if (typeof input === 'string') {
    checkTextSize(input, opts);
    return stripBom(input);
  }
  const max = opts?.maxBytes ?? DEFAULT_MAX_BYTES;
  if (input.byteLength > max) throw tooLarge(input.byteLength, max);
  try {
    // TextDecoder drops a leading BOM by default.
    return new TextDecoder('utf-8', { fatal: true }).decode(input);
  } catch {
    const loose = new TextDecoder('utf-8').decode(input);
    const at = loose.indexOf('\uFFFD');
    const { line, column } = lineColumnAt(loose, Math.max(0, at));
    throw new ParseError(line, column, 'UTF-8 text', 'bytes that are not valid UTF-8');
  }
}
