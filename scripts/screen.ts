/**
 * npm run screen -- FILE [--json] [--units THz|cm-1|meV] [--lattice "9 numbers"] [--polar] [--atoms N]
 * Exit code 0 pass/warn, 1 fail, 2 unreadable input or bad arguments (screening.md).
 */
import { readFileSync } from 'node:fs';
import { screenFile } from '../lib/checks';
import { exitCodeOf, formatReport, parseCliArgs, USAGE, UsageError } from '../lib/checks/report';
import { ParseError } from '../lib/parsers';

function main(argv: string[]): number {
  let args;
  try {
    args = parseCliArgs(argv);
  } catch (e) {
    if (!(e instanceof UsageError)) throw e;
    process.stderr.write(`screen: ${e.message}\n\n${USAGE}\n`);
    return 2;
  }
  if (args.help) {
    process.stdout.write(`${USAGE}\n`);
    return 0;
  }
  let bytes: Uint8Array;
  try {
    bytes = readFileSync(args.file);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a directory' : (e as Error).message;
    process.stderr.write(`screen: cannot read ${args.file}: ${why}\n`);
    return 2;
  }
  try {
    const result = screenFile(bytes, { filename: args.file, overrides: args.overrides });
    process.stdout.write(args.json ? `${JSON.stringify(result, null, 2)}\n` : formatReport(result, args.file));
    return exitCodeOf(result);
  } catch (e) {
    if (e instanceof ParseError) {
      process.stderr.write(`screen: ${args.file}: ${e.message}\n`);
      return 2;
    }
    process.stderr.write(`screen: ${args.file}: could not be screened: ${(e as Error).message}\n`);
    return 2;
  }
}

process.exitCode = main(process.argv.slice(2));
