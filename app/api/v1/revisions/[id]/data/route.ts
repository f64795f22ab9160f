import { route } from '@/lib/http/route';
import { PLOT_CONTENT_TYPE } from '@/lib/plot/wire';
import { getPlotBytes } from '@/lib/services/screening-results';
import { revisionParams } from '../schema';

export const dynamic = 'force-dynamic';

/**
 * The parsed dispersion for plotting in the binary plot format (lib/plot/wire.ts, docs/api.md):
 * typed arrays the browser maps without parsing. A screened revision never changes, so the
 * browser may keep it.
 */
export const GET = route({ params: revisionParams }, async ({ em, caller, params }) => {
  const bytes = await getPlotBytes(em, caller, params.id);
  return new Response(bytes as Uint8Array<ArrayBuffer>, {
    status: 200,
    headers: {
      'Content-Type': PLOT_CONTENT_TYPE,
      'Content-Length': String(bytes.byteLength),
      'Cache-Control': 'private, max-age=31536000, immutable',
      'X-Content-Type-Options': 'nosniff',
    },
  });
});
