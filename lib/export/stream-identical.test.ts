/**
 * The YAML and CSV exports are streamed in chunks; these are the files the single-string writers
 * made before streaming (sha256 of the UTF-8 text, recorded from them), and the chunks must add
 * up to them byte for byte on every model spectrum.
 */
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import type { Dispersion } from '@/lib/dispersion/types';
import { buildModelSpectrum, DEFECTS } from '@/lib/models/cli';
import { MODEL_NAMES } from '@/lib/models/catalogue';
import { pathGeometry } from '@/lib/physics/path';
import { CHUNK_CHARS, writeYaml, yamlChunks } from '@/lib/writers';
import { dispersionCsv, dispersionCsvChunks } from './dispersion-csv';
import { dispersionYaml, dispersionYamlChunks } from './dispersion-yaml';
import { textStream } from './text-stream';

const provenance = { spectrumId: 'id-7', title: 'Invented "quoted" crystal', group: 'kestrel', revision: 3, status: 'approved', exportedAt: new Date('2026-02-03T04:05:06Z'), link: 'http://x/groups/kestrel/spectra/id-7' };

function spectra(): [string, Dispersion][] {
  const out: [string, Dispersion][] = MODEL_NAMES.map((m) => [m, buildModelSpectrum({ model: m, polar: false })]);
  out.push(['cubic2 polar', buildModelSpectrum({ model: 'cubic2', polar: true })]);
  for (const defect of DEFECTS) out.push([`fcc ${defect}`, buildModelSpectrum({ model: 'fcc', polar: false, defect })]);
  const fcc = buildModelSpectrum({ model: 'fcc', points: 9, polar: false });
  // A path known only by its distances, with a break and no title.
  out.push(['fcc distances only', { ...fcc, q: null, coordinates: 'fractional', distance: pathGeometry(fcc).distance, title: undefined, lattice: null, segments: fcc.segments.map((s, i) => ({ ...s, connectedToNext: i % 2 === 1 })) }]);
  return out;
}

/** sha256 (first 24 hex digits) of what the string writers wrote before they were chunked. */
const before: Record<string, string> = {
  "fcc yaml": '9e2600baa599a6f149fd9360',
  "fcc yaml meV 6": '7b2a8cb15a9cb27f43446926',
  "fcc export yaml": '0e13339d5e3fe06570f29b58',
  "fcc csv THz": '4ddb3f2014d6d7e5d5fdfb20',
  "fcc csv cm-1": 'a1a73e6594c3ebd942b70ec9',
  "fcc csv meV": '94316b8c8478ddc97c3acd07',
  "chain yaml": 'c74a89e102823c33e83063a5',
  "chain yaml meV 6": '824d76d0394bd5e37c9c5334',
  "chain export yaml": '877a6901d5cf1e0b67a99546',
  "chain csv THz": 'b359e56bded6eb9008666739',
  "chain csv cm-1": 'f271a87a4fd6c4a23b032551',
  "chain csv meV": '327b602fbb3757f365f4645c',
  "diatomic yaml": '499ac7ee42bf37c4c7297879',
  "diatomic yaml meV 6": 'a5d4983d7fa18f7875bea213',
  "diatomic export yaml": '7434e1ed776447e46b4ba24e',
  "diatomic csv THz": 'e394515ab2585ad05ef7f97b',
  "diatomic csv cm-1": 'a20e81d3ac0498e1a1a97c9c',
  "diatomic csv meV": 'becde47cd14236fbc35955eb',
  "cubic2 yaml": '251508f3a2f2b308307e1220',
  "cubic2 yaml meV 6": 'cfc2eb10f64f29104728e20b',
  "cubic2 export yaml": '96d8546a564c2fc2ccc158c0',
  "cubic2 csv THz": 'e0e61070232375d5971d6f7d',
  "cubic2 csv cm-1": '31e2217be1fb44121721b66f',
  "cubic2 csv meV": '2446b09050fd5785dd3061c4',
  "layer yaml": 'a9915448f50558d847084515',
  "layer yaml meV 6": 'a3a729c155e414813a3cbb88',
  "layer export yaml": '6528e8533b3a574e6a1e8d18',
  "layer csv THz": '345d6e87253d3731092cd4e7',
  "layer csv cm-1": 'f481062b1b9d53198448f651',
  "layer csv meV": '37135b3f56520143571e2843',
  "fcc-mesh yaml": 'b94c850a4760be4a4daacc78',
  "fcc-mesh yaml meV 6": '473fdb8bb828e1e6101e9d94',
  "fcc-mesh export yaml": '81b3e1383fc11d618ecc4cb5',
  "fcc-mesh csv THz": '791b55ecf3582f3a1d9eb39d',
  "fcc-mesh csv cm-1": 'ffe2e2a0d1516ab6929e998f',
  "fcc-mesh csv meV": '8ae411fb694b4d669fd5a031',
  "cubic2 polar yaml": '61039d07221992a98909009c',
  "cubic2 polar yaml meV 6": '9c5692e06b89fad6107820ef',
  "cubic2 polar export yaml": '5a532c2e33a6cbe35ef5c310',
  "cubic2 polar csv THz": '2e145ac701777f4e9234d0c4',
  "cubic2 polar csv cm-1": 'a7400cbe75680beb46f0a10b',
  "cubic2 polar csv meV": '8cc66560f5a441442bca1f09',
  "fcc soft-mode yaml": 'b1c3e960951efa3ee333d106',
  "fcc soft-mode yaml meV 6": 'b2977e78f69ee487e5017301',
  "fcc soft-mode export yaml": '75c0ddc7eb006587098e3d23',
  "fcc soft-mode csv THz": '27f2a7b7a94d737d3daa967c',
  "fcc soft-mode csv cm-1": '7d1d2f43b7c94cfee0d97a73',
  "fcc soft-mode csv meV": '93c1462b3acf79863a40b514',
  "fcc sum-rule yaml": 'c22297d6c98230d10b92b760',
  "fcc sum-rule yaml meV 6": '5de818e33e370863e60de70b',
  "fcc sum-rule export yaml": 'bc65cdc328f7fb25cd8d89c8',
  "fcc sum-rule csv THz": 'a11618aa3d230aa5837338cc',
  "fcc sum-rule csv cm-1": 'df277ac3c1677fd364acc286',
  "fcc sum-rule csv meV": 'fff2cc0675f28dfe2c5932d9',
  "fcc shift yaml": 'ca0b025e1f2d92eafdc073ff',
  "fcc shift yaml meV 6": '18374800bd304f5187b6b603',
  "fcc shift export yaml": 'ae8ca32c0c70d4dc608e4201',
  "fcc shift csv THz": '415f3ed8c62cfd08e3f94ad2',
  "fcc shift csv cm-1": '6161fbe14d1531e8773ea791',
  "fcc shift csv meV": '5e04c4f07e9015966f73e9c4',
  "fcc beyond-zone yaml": 'd7aade8d76ce6fe710336069',
  "fcc beyond-zone yaml meV 6": '1967221d20c3ead932d69e45',
  "fcc beyond-zone export yaml": '510d479473bbd2eb1900459d',
  "fcc beyond-zone csv THz": '848ad76884e5d0962e596f2c',
  "fcc beyond-zone csv cm-1": '45b19571055eeb1c9532ecbe',
  "fcc beyond-zone csv meV": 'd60e52c4d6c85df73f6ccdcc',
  "fcc noise-pocket yaml": '89c30dfa45dd7abd58c8c3e3',
  "fcc noise-pocket yaml meV 6": '5637856d78bceee242c26b82',
  "fcc noise-pocket export yaml": '4eae500126260d00de1254b9',
  "fcc noise-pocket csv THz": 'a39267b83fcae64c3aec89f8',
  "fcc noise-pocket csv cm-1": '839d12cdadc589181374decc',
  "fcc noise-pocket csv meV": 'ec7da777fa9bc5e31df36f32',
  "fcc distances only yaml": '88b9cbe4f76490588c512741',
  "fcc distances only yaml meV 6": '6175ddf08edcd00c3113bcdc',
  "fcc distances only export yaml": 'ebc696404b470ce85c79bbba',
  "fcc distances only csv THz": '78f05255defae0ec03c00474',
  "fcc distances only csv cm-1": '58330fe329151a8d64720051',
  "fcc distances only csv meV": '75e20520a4697849723dd3e4',
};

const sha = (s: string | Uint8Array) => createHash('sha256').update(s).digest('hex').slice(0, 24);

async function streamed(chunks: Iterable<string>): Promise<Uint8Array> {
  return new Uint8Array(await new Response(textStream(chunks)).arrayBuffer());
}

describe('streamed YAML and CSV', () => {
  const all = spectra();

  it('the streams are byte for byte the files the string writers made', async () => {
    let checked = 0;
    for (const [name, d] of all) {
      const cases: [string, Iterable<string>, string][] = [
        [`${name} yaml`, yamlChunks(d), writeYaml(d)],
        [`${name} yaml meV 6`, yamlChunks(d, { units: 'meV', digits: 6 }), writeYaml(d, { units: 'meV', digits: 6 })],
        [`${name} export yaml`, dispersionYamlChunks(d, provenance), dispersionYaml(d, provenance)],
        ...(['THz', 'cm-1', 'meV'] as const).map((units): [string, Iterable<string>, string] => [`${name} csv ${units}`, dispersionCsvChunks(d, { units }), dispersionCsv(d, { units })]),
      ];
      for (const [key, chunks, text] of cases) {
        expect(before[key], key).toBeDefined();
        expect(sha(await streamed(chunks)), key).toBe(before[key]);
        expect(sha(text), `${key} (string)`).toBe(before[key]);
        checked++;
      }
    }
    expect(checked).toBe(Object.keys(before).length);
  });

  it('a large spectrum comes in bounded chunks that add up to the string', () => {
    const d = buildModelSpectrum({ model: 'cubic2', points: 2000, polar: true });
    for (const [chunks, text] of [[dispersionCsvChunks(d, { units: 'cm-1' }), dispersionCsv(d, { units: 'cm-1' })], [yamlChunks(d), writeYaml(d)]] as const) {
      const parts = [...chunks];
      expect(parts.length).toBeGreaterThan(10);
      const longestLine = Math.max(...text.split('\n').map((l) => l.length + 1));
      for (const p of parts) expect(p.length).toBeLessThan(CHUNK_CHARS + longestLine + 2);
      expect(parts.join('') === text).toBe(true);
    }
  });

  it('a value that cannot be written is refused before the first chunk, saying where', () => {
    const d = buildModelSpectrum({ model: 'fcc', points: 5, polar: false });
    const bad = { ...d, frequencies: Float64Array.from(d.frequencies) };
    bad.frequencies[2 * d.nb + 1] = Number.NaN;
    expect(() => dispersionCsvChunks(bad)).toThrow('cannot write the non-finite value NaN (frequencies in THz, q-point 2, branch 2)');
    expect(() => yamlChunks(bad, { units: 'cm-1' })).toThrow('(frequencies in cm-1, q-point 2, branch 2)');
    const farQ = { ...d, q: Float64Array.from(d.q!) };
    farQ.q[4] = Number.POSITIVE_INFINITY;
    expect(() => dispersionYamlChunks(farQ, provenance)).toThrow('non-finite value Infinity (q, q-point 1, component 2)');
    // The old single-string writer refused the same input.
    expect(() => dispersionCsv(bad)).toThrow(/non-finite/);
  });
});
