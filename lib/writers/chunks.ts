/**
 * Text written piece by piece: a writer produces its lines lazily and chunkLines gathers them
 * into chunks of about `size` characters, so a large spectrum is never one string in memory
 * unless the caller joins the chunks (the string writers do, for small files and tests).
 */

export const CHUNK_CHARS = 1 << 16;

/** Each line followed by `eol`, gathered into chunks of at least `size` characters (the last may be shorter). */
export function* chunkLines(lines: Iterable<string>, eol = '\n', size = CHUNK_CHARS): Generator<string, void, undefined> {
  let parts: string[] = [];
  let length = 0;
  for (const line of lines) {
    parts.push(line);
    length += line.length + eol.length;
    if (length >= size) {
      yield parts.join(eol) + eol;
      parts = [];
      length = 0;
    }
  }
  if (parts.length > 0) yield parts.join(eol) + eol;
}

export function joinChunks(chunks: Iterable<string>): string {
  let text = '';
  for (const c of chunks) text += c;
  return text;
}

/**
 * Throws, naming the place, at the first value that is not a finite number (after `map`, e.g. a
 * unit conversion). The chunked writers check everything before their first chunk: a stream
 * cannot take back what it has already sent.
 */
export function checkFinite(values: ArrayLike<number>, where: (i: number) => string, map: (v: number) => number = (v) => v): void {
  for (let i = 0; i < values.length; i++) {
    const v = map(values[i]);
    if (!Number.isFinite(v)) throw new Error(`cannot write the non-finite value ${v} (${where(i)})`);
  }
}

/** Where the i-th value of a per-point array lies: `frequencies, q-point 3, branch 2`. */
export const pointPlace = (name: string, perPoint = 1, inner = 'component') => (i: number) =>
  perPoint === 1 ? `${name}, q-point ${i}` : `${name}, q-point ${Math.floor(i / perPoint)}, ${inner} ${(i % perPoint) + 1}`;
