import { route } from '@/lib/http/route';
import { exportSpectrum } from '@/lib/services/export';
import { exportParams, exportQuery } from './schema';

export const dynamic = 'force-dynamic';

/**
 * An approved spectrum as a file: `format=yaml|csv|record|svg` (409 unless approved). The
 * printable record opens inline; the others download. YAML and CSV bodies are streams (written
 * as they are sent). PNG is made in the browser from the page's chart instance (ECharts
 * getDataURL), not here.
 */
export const GET = route({ params: exportParams, query: exportQuery }, async ({ em, caller, params, query }) => {
  const file = await exportSpectrum(em, caller, params.id, query.format, { units: query.units, width: query.width, height: query.height });
  return new Response(file.body, {
    status: 200,
    headers: {
      'Content-Type': file.contentType,
      'Content-Disposition': file.disposition,
      'Cache-Control': 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
      // The record and the SVG are shown by the browser: nothing in them may run or load.
      'Content-Security-Policy': "default-src 'none'; style-src 'unsafe-inline'; img-src data:; sandbox",
    },
  });
});
