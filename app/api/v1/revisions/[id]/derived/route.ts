import { AppError } from '@/lib/errors';
import { route } from '@/lib/http/route';
import { loadStoredDispersion } from '@/lib/services/dispersion-store';
import { revisionAccess } from '@/lib/services/spectra';
import { derivedQuantities, type DerivedQuantities } from './derived-quantities';
import { derivedParams } from './schema';

export const dynamic = 'force-dynamic';

export type DerivedResponse = DerivedQuantities & { revision: string };

/**
 * Derived physics of a screened revision: sound and group velocities near Γ (paths), DOS and
 * thermodynamics (meshes). Computed on the server because it needs what the plot data leaves
 * out (lattice, mesh weights, exact frequencies).
 */
export const GET = route({ params: derivedParams }, async ({ em, caller, params }): Promise<DerivedResponse> => {
  const { revision } = await revisionAccess(em, caller, params.id);
  if (revision.screeningStatus !== 'done') {
    throw new AppError('conflict', revision.screeningStatus === 'pending'
      ? 'This revision is still being screened; derived quantities come after.'
      : "This revision's file could not be read, so nothing can be derived from it.");
  }
  const d = await loadStoredDispersion(em, revision.id);
  if (!d) throw new AppError('not_found', 'This revision has no stored data.');
  return { revision: revision.id, ...derivedQuantities(d) };
});
