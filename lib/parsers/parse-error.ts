/**
 * The one error a parser throws: where (1-based line, column when it applies) and what was
 * expected. Callers show `message`; the command line exits with code 2.
 */
export class ParseError extends Error {
  readonly line: number;
  readonly column: number | null;
  readonly expected: string;
  readonly found: string | null;

  constructor(line: number, column: number | null, expected: string, found: string | null = null) {
    const where = column === null ? `line ${line}` : `line ${line}, column ${column}`;
    super(`${where}: expected ${expected}${found === null ? '' : `, found ${found}`}`);
    this.name = 'ParseError';
    this.line = line;
    this.column = column;
    this.expected = expected;
    this.found = found;
  }
}

/** Shortens a token for a message, quoted. */
export function quote(token: string, max = 40): string {
  const t = token.length > max ? `${token.slice(0, max)}…` : token;
  return JSON.stringify(t);
}

/** Turns anything thrown by the code into a ParseError (nothing else leaves a parser). */
export function asParseError(e: unknown): ParseError {
  if (e instanceof ParseError) return e;
  const msg = e instanceof Error ? e.message : String(e);
  return new ParseError(1, null, 'a readable band file', `an internal failure (${msg})`);
}
