/**
 * npm run demo (after seed-demo.ts): the invented lab's spectra, made from the engine's
 * force-constant models (lib/models) and written as band files (lib/writers), then stored and
 * queued exactly as an uploaded file is: UTApi to the upload service, the same service that
 * creates spectra, the same screening queue (the app's worker screens them when it starts).
 * Idempotent: a spectrum whose title is already in the group is left alone.
 * Needs the upload fake running and DATABASE_URL / UPLOADTHING_* set (scripts/env.sh demo).
 */
import { Group, Spectrum, User } from '@/entities';
import { callerFromUser } from '@/lib/auth/caller';
import { closeOrm, getEm } from '@/lib/db/orm';
import type { Dispersion } from '@/lib/dispersion/types';
import { stopBoss } from '@/lib/jobs/boss';
import { breakSumRule, injectSoftMode, modelSpectrum, pushBeyondZone } from '@/lib/models';
import { createSpectrumWithFile, type SpectrumMeta } from '@/lib/services/revisions';
import { deleteStoredFiles, storeFile } from '@/lib/storage/ut-api';
import { writeColumns, writeYaml } from '@/lib/writers';

const GROUP = 'kestrel-ridge';
const SUBMITTER = 'priya@kestrel-ridge.example';

interface DemoSpectrum {
  file: string;
  meta: SpectrumMeta;
  make: () => Dispersion;
  write: (d: Dispersion) => string;
}

const fcc = () => modelSpectrum('fcc', { points: 41 });
const columns = (d: Dispersion) => writeColumns(d, { digits: 7 });

// Invented materials (names labelled as invented); the physics of each file is the model's.
const spectra: DemoSpectrum[] = [
  {
    file: 'kestrelium-clean.txt',
    meta: {
      title: 'Kestrelium, fcc, converged',
      material: 'Kestrelium (invented fcc metal)',
      formula: 'Ks',
      method: 'Nearest-neighbour force-constant model',
      code: 'branchwise model fcc (demo)',
      supercell: '4×4×4',
      notes: 'A clean spectrum: screening should pass.',
    },
    make: fcc,
    write: columns,
  },
  {
    file: 'kestrelium-soft-mode.txt',
    meta: {
      title: 'Kestrelium, strained cell',
      material: 'Kestrelium (invented fcc metal)',
      formula: 'Ks',
      method: 'Nearest-neighbour force-constant model with a soft pocket',
      code: 'branchwise model fcc (demo)',
      supercell: '2×2×2',
      notes: 'An imaginary pocket away from Γ: a real instability or a too-small supercell?',
    },
    make: () => injectSoftMode(fcc(), { index: 60, depthTHz: 1.4, widthPoints: 4 }),
    write: columns,
  },
  {
    file: 'ridgeite-no-sum-rule.yaml',
    meta: {
      title: 'Ridgeite, sum rule not imposed',
      material: 'Ridgeite (invented fcc alloy)',
      formula: 'Rg',
      method: 'Force-constant model, acoustic sum rule left out',
      code: 'branchwise model fcc (demo)',
      supercell: '3×3×3',
    },
    make: () => breakSumRule(fcc(), { offsetTHz: 0.35 }),
    write: (d) => writeYaml(d, { digits: 7 }),
  },
  {
    file: 'ashcrown-polar.txt',
    meta: {
      title: 'Ashcrown salt, polar, LO–TO split',
      material: 'Ashcrown salt (invented rocksalt-type compound)',
      formula: 'AcCl',
      method: 'Rocksalt-type model with LO–TO splitting at Γ',
      code: 'branchwise model cubic2 (demo)',
      supercell: '4×4×4',
      notes: 'Polar: the jump at Γ is expected and reported as info.',
    },
    make: () => modelSpectrum('cubic2', { polar: true, points: 41 }),
    write: columns,
  },
  {
    file: 'kestrelium-beyond-zone.txt',
    meta: {
      title: 'Kestrelium, path beyond the zone',
      material: 'Kestrelium (invented fcc metal)',
      formula: 'Ks',
      method: 'Nearest-neighbour force-constant model, q written outside the first zone',
      code: 'branchwise model fcc (demo)',
      qmesh: '8×8×8',
    },
    make: () => pushBeyondZone(fcc(), { indices: [45, 46, 47, 48, 49, 50], g: [1, 0, 0] }),
    write: columns,
  },
];

async function main() {
  const em = await getEm();
  const group = await em.findOne(Group, { slug: GROUP });
  const user = await em.findOne(User, { email: SUBMITTER });
  if (!group || !user) throw new Error(`run scripts/seed-demo.ts first (group ${GROUP}, ${SUBMITTER})`);
  const caller = callerFromUser({ id: user.id, email: user.email, name: user.name ?? null });
  let created = 0;
  for (const s of spectra) {
    if (await em.findOne(Spectrum, { group: group.id, title: s.meta.title })) continue;
    const text = s.write(s.make());
    const stored = await storeFile(new TextEncoder().encode(text), s.file, 'text/plain');
    try {
      await createSpectrumWithFile(em.fork(), caller, { group: { id: group.id }, meta: s.meta, file: stored });
    } catch (e) {
      await deleteStoredFiles([stored.key]);
      throw e;
    }
    created++;
  }
  console.log(created ? `Demo spectra: ${created} uploaded and queued for screening.` : 'Demo spectra already in place.');
}

main()
  .catch((e: unknown) => {
    console.error('seed-spectra failed:', e instanceof Error ? e.message : e);
    process.exitCode = 1;
  })
  .finally(async () => {
    await stopBoss();
    await closeOrm();
  });
