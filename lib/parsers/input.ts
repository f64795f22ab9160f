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

/** The size limit on bytes. */
export function checkByteSize(bytes: Uint8Array, opts: ParseOptions | undefined): void {
  const max = opts?.maxBytes ?? DEFAULT_MAX_BYTES;
  if (bytes.byteLength > max) throw tooLarge(bytes.byteLength, max);
}

/** Bytes without a leading UTF-8 BOM (a view, not a copy), as TextDecoder would drop it. */
export function skipBom(bytes: Uint8Array): Uint8Array {
  return bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? bytes.subarray(3) : bytes;
}

/**
 * Index of the first byte in [start, end) that begins an invalid UTF-8 sequence, or -1.
 * The rules of the WHATWG decoder (no overlongs, no surrogates, nothing above U+10FFFF).
 */
export function firstInvalidUtf8(b: Uint8Array, start: number, end: number): number {
  let i = start;
  while (i < end) {
    const c = b[i];
    if (c < 0x80) {
      i++;
      continue;
    }
    let need: number;
    let lo = 0x80;
    let hi = 0xbf;
    if (c >= 0xc2 && c <= 0xdf) need = 1;
    else if (c >= 0xe0 && c <= 0xef) {
      need = 2;
      if (c === 0xe0) lo = 0xa0;
      else if (c === 0xed) hi = 0x9f;
    } else if (c >= 0xf0 && c <= 0xf4) {
      need = 3;
      if (c === 0xf0) lo = 0x90;
      else if (c === 0xf4) hi = 0x8f;
    } else return i;
    if (i + need >= end) return i;
    const b1 = b[i + 1];
    if (b1 < lo || b1 > hi) return i;
    for (let k = 2; k <= need; k++) {
      const bk = b[i + k];
      if (bk < 0x80 || bk > 0xbf) return i;
    }
    i += need + 1;
  }
  return -1;
}

// ignoreBOM keeps a U+FEFF that is part of the text (only the file's first is dropped, by skipBom).
const looseDecoder = new TextDecoder('utf-8', { ignoreBOM: true });

/** Text of bytes already known to be valid UTF-8 (or where a U+FFFD is acceptable). */
export function decodeLoose(b: Uint8Array, start: number, end: number): string {
  return looseDecoder.decode(b.subarray(start, end));
}

/**
 * 1-based column of byte offset `at` on the line starting at byte `lineStart`, counted in
 * characters (UTF-16 code units, as for string input), not bytes.
 */
export function charColumn(b: Uint8Array, lineStart: number, at: number): number {
  let ascii = true;
  for (let i = lineStart; i < at; i++) {
    if (b[i] >= 0x80) {
      ascii = false;
      break;
    }
  }
  return (ascii ? at - lineStart : decodeLoose(b, lineStart, at).length) + 1;
}

/** Throws the UTF-8 error if [start, end) of the line starting at `lineStart` is not valid UTF-8. */
export function checkUtf8(b: Uint8Array, start: number, end: number, line: number, lineStart: number): void {
  const bad = firstInvalidUtf8(b, start, end);
  if (bad >= 0) throw new ParseError(line, charColumn(b, lineStart, bad), 'UTF-8 text', 'bytes that are not valid UTF-8');
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
