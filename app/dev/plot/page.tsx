import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Badge } from '@/components/ui/badge';
import { PlotHarness } from './plot-harness';

export const metadata: Metadata = { title: 'Plot harness (development)' };
export const dynamic = 'force-dynamic';

type Search = Record<string, string | string[] | undefined>;

const int = (v: string | string[] | undefined, def: number, lo: number, hi: number) => {
  const n = Number.parseInt(Array.isArray(v) ? v[0] : (v ?? ''), 10);
  return Number.isFinite(n) ? Math.min(hi, Math.max(lo, n)) : def;
};
const flag = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) === '1';

/**
 * The dispersion plot on synthetic bands of a chosen size, for development and the plot
 * benchmark: `?branches=1500&points=2000`, `&mode=naive` (ECharts alone, one series per
 * branch), `&overlay=1`, `&measured=1`, `&soft=0`, `&height=700` (px). Not served in production unless
 * DEV_PLOT_PAGE=1.
 */
export default async function DevPlotPage({ searchParams }: { searchParams: Promise<Search> }) {
  if (process.env.NODE_ENV === 'production' && process.env.DEV_PLOT_PAGE !== '1') notFound();
  const sp = await searchParams;
  const branches = int(sp.branches, 48, 1, 5000);
  const points = int(sp.points, 600, 24, 20000);
  const mode = sp.mode === 'naive' ? 'naive' : 'ours';
  const height = int(sp.height, 520, 240, 1400);

  return (
    <div className="min-h-screen">
      <header className="border-b border-paper-300 bg-paper-100">
        <div className="mx-auto flex max-w-6xl items-center gap-3 px-4 py-3 sm:px-6">
          <span className="font-semibold">Branchwise</span>
          <Badge tone="warn" shape="bang">
            development only
          </Badge>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-6xl space-y-4 px-4 py-6 sm:px-6">
        <div>
          <h1 className="text-xl font-semibold tracking-tight">Dispersion plot harness</h1>
          <p className="text-sm text-paper-700">
            Synthetic bands from a smooth analytic model (invented data, generated in the browser): {branches} branches ×{' '}
            {points} q-points{mode === 'naive' ? ', drawn by ECharts alone for comparison' : ''}.
          </p>
        </div>
        <PlotHarness
          branches={branches}
          points={points}
          mode={mode}
          overlay={flag(sp.overlay)}
          measured={flag(sp.measured)}
          soft={sp.soft === undefined ? true : flag(sp.soft)}
          height={height}
        />
      </main>
    </div>
  );
}
