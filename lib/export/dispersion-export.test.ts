import { describe, expect, it } from 'vitest';
import { buildModelSpectrum } from '@/lib/models/cli';
import { parseBandFile } from '@/lib/parsers';
import { fromTHz } from '@/lib/physics/units';
import { csvText, dispersionCsv } from './dispersion-csv';
import { dispersionYaml } from './dispersion-yaml';
import { contentDisposition, exportFilename, safeBaseName } from './filename';
import { dispersionSvg } from './plot-svg';

const d = buildModelSpectrum({ model: 'fcc', points: 12, polar: false });
const provenance = { spectrumId: 'id-1', title: 'Invented fcc', group: 'lab', revision: 2, status: 'approved', exportedAt: new Date('2026-01-01T00:00:00Z'), link: 'http://x/groups/lab/spectra/id-1' };

describe('YAML export', () => {
  it('reads back through parseBandFile to the same frequencies, q and labels', () => {
    const text = dispersionYaml(d, provenance);
    const back = parseBandFile(text, { filename: 'export.yaml' });
    expect(back.nq).toBe(d.nq);
    expect(back.nb).toBe(d.nb);
    expect(Array.from(back.frequencies)).toEqual(Array.from(d.frequencies));
    expect(Array.from(back.q!)).toEqual(Array.from(d.q!));
    expect(back.metadata.review).toMatchObject({ spectrum: 'id-1', revision: 2, status: 'approved' });
  });
});

describe('CSV export', () => {
  it('has a header with units and one column per branch, one row per q-point', () => {
    const csv = dispersionCsv(d, { units: 'cm-1' });
    const rows = csv.trimEnd().split('\r\n');
    const header = rows[0]!.split(',');
    expect(header.slice(0, 4)).toEqual(['index', 'segment', 'label', 'distance (1/Å)']);
    expect(header.slice(4, 7)).toEqual(['qx (fractional)', 'qy (fractional)', 'qz (fractional)']);
    expect(header.slice(7)).toEqual(Array.from({ length: d.nb }, (_, k) => `branch ${k + 1} (cm-1)`));
    expect(rows).toHaveLength(d.nq + 1);
    const first = rows[1]!.split(',');
    expect(first[2]).toBe(d.labels.get(0));
    for (let k = 0; k < d.nb; k++) expect(Number(first[7 + k])).toBeCloseTo(fromTHz(d.frequencies[k], 'cm-1'), 9);
    const lastLabelled = Math.max(...d.labels.keys());
    expect(rows[lastLabelled + 1]!.split(',')[2]).toBe(d.labels.get(lastLabelled));
  });

  it('quotes and defuses text cells', () => {
    expect(csvText('X,K')).toBe('"X,K"');
    expect(csvText('say "hi"')).toBe('"say ""hi"""');
    expect(csvText('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvText('Γ')).toBe('Γ');
  });
});

describe('file names', () => {
  it('keeps only safe characters', () => {
    expect(safeBaseName('Rock-salt "A"/../B\r\nC')).toBe('Rock-salt-A-..-B-C');
    expect(safeBaseName('Ünïcode Γ-point')).toBe('Unicode-point');
    expect(safeBaseName('"""')).toBe('spectrum');
    expect(exportFilename('Invented fcc', 3, 'record', 'html')).toBe('Invented-fcc-r3-record.html');
    expect(contentDisposition('Γ test.csv')).toBe(`attachment; filename="__test.csv"; filename*=UTF-8''%CE%93%20test.csv`);
  });
});

describe('SVG plot', () => {
  it('renders a standalone SVG with the high-symmetry labels on the axis', () => {
    const svg = dispersionSvg(d, { width: 800, height: 500, title: 'Invented <fcc>' });
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg).toContain('width="800"');
    for (const label of new Set(d.labels.values())) expect(svg).toContain(label === 'G' ? 'Γ' : label);
    expect(svg).toContain('Invented &lt;fcc&gt;');
    expect(svg).not.toContain('<fcc>');
  });
});
