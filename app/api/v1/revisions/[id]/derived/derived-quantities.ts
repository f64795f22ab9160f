/**
 * What the derived-physics panel shows of one dispersion: sound velocities fitted from Γ with
 * the group velocity at the first point off Γ (paths), and the DOS with the harmonic
 * thermodynamics (meshes). Pure: the lib/physics functions on a `Dispersion`.
 */
import type { Dispersion } from '@/lib/dispersion/types';
import { phononDos } from '@/lib/physics/dos';
import { thermodynamics } from '@/lib/physics/thermo';
import { groupVelocities, soundVelocities, type PathBasis } from '@/lib/physics/velocity';

export interface SoundFromGamma {
  segment: number;
  gammaIndex: number;
  toward: string | null;
  direction: [number, number, number] | null;
  /** m/s per acoustic branch: least-squares slope near Γ. */
  velocities: number[];
  /** m/s per acoustic branch: |dν/dk| at the first point off Γ (null where undefined). */
  groupNearGamma: (number | null)[];
  /** THz: the fit's value at Γ (a large one points at the acoustic sum rule). */
  intercepts: number[];
  points: number;
}

export interface DerivedQuantities {
  kind: 'path' | 'mesh';
  acoustic: number;
  /** What the path coordinate was measured in; null without a usable path. */
  basis: PathBasis | null;
  sound: SoundFromGamma[];
  dos: { frequencies: number[]; values: number[]; sigmaTHz: number } | null;
  thermo: {
    temperatures: number[];
    atoms: number;
    /** J/(mol K) per mole of cells. */
    heatCapacity: number[];
    entropy: number[];
    /** kJ/mol per mole of cells. */
    freeEnergy: number[];
    zeroPointEnergy: number;
    /** Modes per cell left out: imaginary, and (near-)zero. */
    excluded: { imaginary: number; zero: number };
  } | null;
  /** Why something is missing, in words for the panel. */
  notes: string[];
}

/** 0 K to 1000 K in 10 K steps. */
export const TEMPERATURES = Array.from({ length: 101 }, (_, i) => i * 10);

const finite = (x: number) => (Number.isFinite(x) ? x : null);

export function derivedQuantities(d: Dispersion): DerivedQuantities {
  const notes: string[] = [];
  const out: DerivedQuantities = { kind: d.kind, acoustic: Math.min(d.acoustic, d.nb), basis: null, sound: [], dos: null, thermo: null, notes };

  if (d.kind === 'path') {
    const sound = soundVelocities(d);
    const group = groupVelocities(d);
    out.basis = sound[0]?.basis ?? group?.basis ?? null;
    out.sound = sound.map((s) => {
      const seg = d.segments[s.segment];
      const next = s.gammaIndex === seg.start ? s.gammaIndex + 1 : s.gammaIndex - 1;
      return {
        segment: s.segment,
        gammaIndex: s.gammaIndex,
        toward: s.toward,
        direction: s.direction,
        velocities: s.velocities,
        groupNearGamma: s.velocities.map((_, k) => (group ? finite(Math.abs(group.values[next * d.nb + k])) : null)),
        intercepts: s.intercepts,
        points: s.points,
      };
    });
    if (sound.length === 0) notes.push('No path segment starts or ends at Γ with at least three points, so no sound velocity can be fitted.');
    if (out.basis === 'file-distance') notes.push("The file gives no lattice, so velocities use the file's own path distances, read as Å⁻¹ with 2π included.");
    notes.push('The DOS and thermodynamics need a q-point mesh; this revision is a band path.');
  } else {
    try {
      const dos = phononDos(d);
      out.dos = { frequencies: Array.from(dos.frequencies), values: Array.from(dos.values), sigmaTHz: dos.sigmaTHz };
      const t = thermodynamics(d, TEMPERATURES);
      out.thermo = {
        temperatures: t.temperatures,
        atoms: t.atoms,
        heatCapacity: Array.from(t.perCell.heatCapacity),
        entropy: Array.from(t.perCell.entropy),
        freeEnergy: Array.from(t.perCell.freeEnergy),
        zeroPointEnergy: t.perCell.zeroPointEnergy,
        excluded: { imaginary: t.excluded.imaginary, zero: t.excluded.zero },
      };
    } catch (e) {
      notes.push(`The DOS could not be computed: ${(e as Error).message}.`);
    }
    notes.push('Sound velocities need a band path through Γ; this revision is a mesh.');
  }
  return out;
}
