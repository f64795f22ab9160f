'use client';

import { getInstanceByDom } from 'echarts/core';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import { exportUrl } from '@/lib/client/review/review-api';

const FORMATS = [
  { format: 'yaml', label: 'Data (YAML)', help: 'Our band-file schema' },
  { format: 'csv', label: 'Data (CSV)', help: 'One row per q-point' },
  { format: 'record', label: 'Review record', help: 'Printable: findings, waivers, threads, decisions, audit trail' },
  { format: 'svg', label: 'Plot (SVG)', help: 'Vector image of the dispersion' },
] as const;

/** The plot as the reviewer sees it, as a PNG from the chart itself. */
function downloadPng(fileName: string): string | null {
  const host = document.querySelector<HTMLElement>('[data-testid="dispersion-plot-canvas"]');
  const chart = host ? getInstanceByDom(host) : undefined;
  if (!chart) return 'The plot is not drawn yet.';
  // At the screen's own pixel ratio: the branch lines are painted for it (a larger PNG would only
  // scale them up); the SVG export is the one for print.
  const url = chart.getDataURL({ type: 'png', pixelRatio: window.devicePixelRatio || 1, backgroundColor: '#ffffff' });
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.click();
  return null;
}

export function ExportPanel({ spectrumId, approved, pngName }: { spectrumId: string; approved: boolean; pngName: string }) {
  const [pngError, setPngError] = useState<string | null>(null);
  return (
    <Panel title="Export" data-testid="export">
      {!approved ? (
        <p className="text-sm text-paper-600">Export opens once the spectrum is approved.</p>
      ) : (
        <div className="flex flex-col gap-2">
          {FORMATS.map((f) => (
            <a
              key={f.format}
              href={exportUrl(spectrumId, f.format)}
              className={buttonClasses('secondary', 'sm', 'h-auto flex-col items-start gap-0 whitespace-normal py-1.5 text-left')}
              title={f.help}
              data-testid={`export-${f.format}`}
              {...(f.format === 'record' ? { target: '_blank', rel: 'noopener' } : { download: '' })}
            >
              {f.label}
              <span className="text-2xs font-normal text-paper-600">{f.help}</span>
            </a>
          ))}
          <Button variant="secondary" size="sm" className="h-auto flex-col items-start gap-0 whitespace-normal py-1.5 text-left" onClick={() => setPngError(downloadPng(pngName))} data-testid="export-png">
            Plot (PNG)
            <span className="text-2xs font-normal text-paper-600">As drawn now, unit and zoom included</span>
          </Button>
          {pngError && <Alert tone="error">{pngError}</Alert>}
        </div>
      )}
    </Panel>
  );
}
