import { describe, expect, it } from 'vitest';
import { CAUTION, exitCodeOf, formatReport, parseCliArgs, UsageError } from './report';
import type { ScreeningResult } from './types';

describe('parseCliArgs', () => {
  it('reads the file and the overrides', () => {
    expect(parseCliArgs(['si.txt'])).toEqual({ file: 'si.txt', json: false, help: false, overrides: {} });
    const a = parseCliArgs(['si.yaml', '--json', '--units', 'cm^-1', '--lattice', '0 2.7 2.7; 2.7 0 2.7; 2.7 2.7 0', '--polar', '--atoms', '2']);
    expect(a).toEqual({
      file: 'si.yaml',
      json: true,
      help: false,
      overrides: { units: 'cm-1', lattice: [[0, 2.7, 2.7], [2.7, 0, 2.7], [2.7, 2.7, 0]], polar: true, atoms: 2 },
    });
    expect(parseCliArgs(['--help']).help).toBe(true);
  });

  it('rejects bad arguments with a message that says what is wrong', () => {
    const bad: [string[], RegExp][] = [
      [[], /expected a band file/],
      [['a.txt', 'b.txt'], /expected one band file, got 2/],
      [['a.txt', '--units', 'Hz'], /--units: expected THz, cm-1 or meV, found "Hz"/],
      [['a.txt', '--lattice', '1 0 0 0 1 0 0 0'], /--lattice, column 16: expected 9 numbers/],
      [['a.txt', '--lattice', '1 0 zero 0 1 0 0 0 1'], /--lattice, column 5: expected a number/],
      [['a.txt', '--atoms', '2.5'], /--atoms: expected a positive whole number/],
      [['a.txt', '--atoms', '0'], /--atoms/],
      [['a.txt', '--colour'], /Unknown option '--colour'/],
      [['a.txt', '--units'], /--units/],
    ];
    for (const [argv, msg] of bad) {
      expect(() => parseCliArgs(argv)).toThrow(UsageError);
      expect(() => parseCliArgs(argv)).toThrow(msg);
    }
  });
});

const result: ScreeningResult = {
  format: 'columns',
  qpoints: 161,
  branches: 6,
  segments: 4,
  verdict: 'fail',
  findings: [
    { check: 'zone-folding', severity: 'info', segment: 0, index: 12, branch: null, q: [-0.25, -0.25, 0], value: null, limit: null, message: '1 q-point lies outside the first Brillouin zone.' },
    { check: 'imaginary-modes', severity: 'fail', segment: 1, index: 57, branch: 0, q: [0.5, 0, 0.5], value: -1.21, limit: -0.05, message: 'Branch 0 is imaginary. A soft mode can be real physics; a reviewer decides.' },
    { check: 'acoustic-gamma', severity: 'warn', segment: 2, index: 120, branch: 2, q: [0, 0, 0], value: 0.05, limit: 0.03, message: 'Impose the acoustic sum rule.' },
  ],
  folded: [{ index: 12, q: [0.75, 0.75, 0], folded: [-0.25, -0.25, 0] }],
};

describe('formatReport', () => {
  const text = formatReport(result, 'si.txt');

  it('groups findings by severity, fail first, in aligned columns', () => {
    const lines = text.split('\n');
    const fail = lines.indexOf('FAIL (1)');
    const warn = lines.indexOf('WARN (1)');
    const info = lines.indexOf('INFO (1)');
    expect(fail).toBeGreaterThan(0);
    expect(warn).toBeGreaterThan(fail);
    expect(info).toBeGreaterThan(warn);
    const header = lines[fail + 1];
    const row = lines[fail + 2];
    expect(header).toMatch(/^  check +segment +q-point +branch +value \(THz\) +limit$/);
    expect(row).toMatch(/^  imaginary-modes +1 +57 +0 +-1\.21 +-0\.05$/);
    // Right-aligned numbers end where their header ends.
    expect(row.indexOf('57') + 2).toBe(header.indexOf('q-point') + 'q-point'.length);
    expect(text).toMatch(/Verdict: FAIL {2}\(1 fail, 1 warn, 1 info\)/);
    expect(text).toMatch(/q-point 12: \(0\.75, 0\.75, 0\) → \(-0\.25, -0\.25, 0\)/);
  });

  it('ends with the caution that screening does not decide physics', () => {
    expect(text.replace(/\s+/g, ' ')).toContain(CAUTION);
    expect(CAUTION).toMatch(/soft mode may be a real instability/);
  });

  it('wraps messages to the width', () => {
    const long = { ...result, findings: [{ ...result.findings[1], message: 'word '.repeat(60).trim() }] };
    const lines = formatReport(long, 'x', 60).split('\n').filter((l) => l.startsWith('    word'));
    expect(lines.length).toBeGreaterThan(4);
    for (const l of lines) expect(l.length).toBeLessThanOrEqual(60);
  });

  it('exit code: 0 for pass or warn, 1 for fail', () => {
    expect(exitCodeOf(result)).toBe(1);
    expect(exitCodeOf({ ...result, verdict: 'warn' })).toBe(0);
    expect(exitCodeOf({ ...result, verdict: 'pass' })).toBe(0);
  });
});
