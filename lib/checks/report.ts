/**
 * The `screen` command line without the process: argument handling, the readable report and
 * the exit code, so they can be tested; scripts/screen.ts only wires in the file system and stdio.
 */
import { parseArgs } from 'node:util';
import type { ParseOverrides } from '../parsers/options';
import { readLattice } from '../physics/lattice';
import { parseUnit } from '../physics/units';
import { fmt, fmtQ } from './common';
import type { Finding, ScreeningResult, Severity } from './types';

export const USAGE = `Usage: npm run screen -- FILE [--json] [--units THz|cm-1|meV] [--lattice "9 numbers"] [--polar] [--atoms N]

Screens a band file (columns or Branchwise YAML) and prints a report.
  --json            print exactly one JSON object (the screening result) on stdout
  --units U         the unit the file's frequencies are in: THz, cm-1 or meV (replaces the file's)
  --lattice "..."   real-space vectors a1; a2; a3 in Å, 9 numbers (replaces the file's)
  --polar           LO–TO splitting is expected at Γ
  --atoms N         atoms in the primitive cell (3N branches expected)
Exit code: 0 pass or warn, 1 fail, 2 unreadable input or bad arguments.`;

export const CAUTION =
  'Screening is an aid for the reviewer, not a decision on the physics: a flagged soft mode may be a real instability.';

export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

export interface CliArgs {
  file: string;
  json: boolean;
  help: boolean;
  overrides: ParseOverrides;
}

/** Reads the command line (without `node script`); throws UsageError saying what is wrong. */
export function parseCliArgs(argv: string[]): CliArgs {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      allowPositionals: true,
      strict: true,
      options: {
        json: { type: 'boolean' },
        units: { type: 'string' },
        lattice: { type: 'string' },
        polar: { type: 'boolean' },
        atoms: { type: 'string' },
        help: { type: 'boolean', short: 'h' },
      },
    });
  } catch (e) {
    throw new UsageError((e as Error).message);
  }
  const { values, positionals } = parsed;
  if (values.help) return { file: '', json: false, help: true, overrides: {} };
  if (positionals.length !== 1)
    throw new UsageError(positionals.length === 0 ? 'expected a band file to screen' : `expected one band file, got ${positionals.length}: ${positionals.join(' ')}`);

  const overrides: ParseOverrides = {};
  if (values.units !== undefined) {
    const u = parseUnit(values.units);
    if (!u) throw new UsageError(`--units: expected THz, cm-1 or meV, found "${values.units}"`);
    overrides.units = u;
  }
  if (values.lattice !== undefined) {
    const l = readLattice(values.lattice);
    if (!Array.isArray(l)) throw new UsageError(`--lattice, column ${l.offset + 1}: ${l.message}`);
    overrides.lattice = l;
  }
  if (values.polar) overrides.polar = true;
  if (values.atoms !== undefined) {
    const n = Number(values.atoms);
    if (!/^\s*\d+\s*$/.test(values.atoms) || !Number.isSafeInteger(n) || n < 1)
      throw new UsageError(`--atoms: expected a positive whole number, found "${values.atoms}"`);
    overrides.atoms = n;
  }
  return { file: positionals[0], json: values.json ?? false, help: false, overrides };
}

/** 0 for pass or warn, 1 for fail. */
export function exitCodeOf(r: ScreeningResult): 0 | 1 {
  return r.verdict === 'fail' ? 1 : 0;
}

const ORDER: Severity[] = ['fail', 'warn', 'info'];
const TITLE: Record<Severity, string> = { fail: 'FAIL', warn: 'WARN', info: 'INFO' };

function wrap(text: string, width: number, indent: string): string {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (line && indent.length + line.length + 1 + word.length > width) {
      lines.push(indent + line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(indent + line);
  return lines.join('\n');
}

const cell = (x: number | null, digits = 3) => (x == null ? '–' : fmt(x, digits));

/** The readable report: summary, findings grouped by severity in aligned columns, the caution. */
export function formatReport(r: ScreeningResult, file: string, width = 100): string {
  const count = (s: Severity) => r.findings.filter((f) => f.severity === s).length;
  const out: string[] = [];
  out.push(`Screening of ${file}`);
  out.push(`  ${r.format} file, ${r.qpoints} q-points, ${r.branches} branches, ${r.segments} segment${r.segments === 1 ? '' : 's'}`);
  out.push(`  Verdict: ${r.verdict.toUpperCase()}  (${count('fail')} fail, ${count('warn')} warn, ${count('info')} info)`);

  const head = ['check', 'segment', 'q-point', 'branch', 'value (THz)', 'limit'];
  const rowOf = (f: Finding) => [f.check, cell(f.segment), cell(f.index), cell(f.branch), cell(f.value), cell(f.limit, 6)];
  const widths = head.map((h, c) => Math.max(h.length, ...r.findings.map((f) => rowOf(f)[c].length)));
  const line = (cells: string[]) =>
    `  ${cells.map((s, c) => (c === 0 ? s.padEnd(widths[c]) : s.padStart(widths[c]))).join('  ')}`.trimEnd();

  for (const s of ORDER) {
    const group = r.findings.filter((f) => f.severity === s);
    if (group.length === 0) continue;
    out.push('', `${TITLE[s]} (${group.length})`, line(head));
    for (const f of group) {
      out.push(line(rowOf(f)));
      if (f.q) out.push(`    q = ${fmtQ(f.q)}`);
      out.push(wrap(f.message, width, '    '));
    }
  }
  if (r.findings.length === 0) out.push('', 'No findings.');
  if (r.folded.length > 0) {
    out.push('', `Folded into the first Brillouin zone (${r.folded.length}):`);
    for (const f of r.folded.slice(0, 20)) out.push(`  q-point ${f.index}: ${fmtQ(f.q)} → ${fmtQ(f.folded)}`);
    if (r.folded.length > 20) out.push(`  … and ${r.folded.length - 20} more (see --json)`);
  }
  out.push('', wrap(CAUTION, width, ''));
  return `${out.join('\n')}\n`;
}
