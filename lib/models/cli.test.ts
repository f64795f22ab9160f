import { describe, expect, it } from 'vitest';
import { screen } from '../checks';
import { buildModelSpectrum, ModelUsageError, parseModelArgs } from './cli';
import { MODEL_NAMES } from './catalogue';

describe('parseModelArgs', () => {
  it('reads a full command line and picks the format from the file name', () => {
    const a = parseModelArgs(['cubic2', '--out', 'x.yaml', '--units', 'cm-1', '--points', '21', '--defect', 'shift', '--polar']);
    expect(a).toMatchObject({ model: 'cubic2', out: 'x.yaml', format: 'yaml', units: 'cm-1', points: 21, defect: 'shift', polar: true });
    expect(parseModelArgs(['fcc', '--out', 'x.txt']).format).toBe('columns');
  });

  it.each([
    [['--out', 'x'], /which model/],
    [['fcc'], /--out FILE is required/],
    [['copper', '--out', 'x'], /unknown model "copper"/],
    [['fcc', '--out', 'x', '--units', 'Hz'], /--units must be/],
    [['fcc', '--out', 'x', '--points', '1'], /--points must be an integer/],
    [['fcc', '--out', 'x', '--defect', 'cracks'], /--defect must be one of/],
    [['fcc', '--out', 'x', '--polar'], /cubic2 model only/],
    [['fcc-mesh', '--out', 'x', '--defect', 'shift'], /not into fcc-mesh/],
    [['fcc', '--out'], /--out needs a value/],
    [['fcc', '--out', 'x', '--colour', 'red'], /unknown option --colour/],
  ])('rejects %j', (argv, message) => {
    expect(() => parseModelArgs(argv as string[])).toThrow(ModelUsageError);
    expect(() => parseModelArgs(argv as string[])).toThrow(message);
  });
});

describe('buildModelSpectrum', () => {
  it('gives every clean model path a pass or a warn from screening (none fails)', () => {
    for (const model of MODEL_NAMES.filter((m) => m !== 'fcc-mesh')) {
      const r = screen(buildModelSpectrum({ model, polar: false }));
      expect([model, r.verdict]).not.toEqual([model, 'fail']);
    }
  });

  it.each([
    ['soft-mode', 'imaginary-modes', 'fail'],
    ['sum-rule', 'acoustic-gamma', 'fail'],
    ['shift', 'continuity', 'fail'],
    ['beyond-zone', 'zone-folding', 'info'],
    ['noise-pocket', 'imaginary-modes', 'warn'],
  ] as const)('injects %s into fcc so that %s reports %s', (defect, check, severity) => {
    const r = screen(buildModelSpectrum({ model: 'fcc', defect, polar: false }));
    expect(r.findings.some((f) => f.check === check && f.severity === severity)).toBe(true);
  });

  it('builds the fcc mesh with N³ points', () => {
    const d = buildModelSpectrum({ model: 'fcc-mesh', points: 5, polar: false });
    expect(d.kind).toBe('mesh');
    expect(d.nq).toBe(125);
  });
});
