/**
 * The browser side of the painted branch lines: lib/plot/raster fills a coverage buffer, this
 * turns it into pixels on a canvas the chart draws as an image. Two canvases take turns so
 * each redraw hands the chart a new image (an unchanged image source would not repaint), and
 * the pixel and coverage arrays are kept from one redraw to the next.
 */
import { coverageBuffer, paintCoverage, parseHex, rasterPolyline, type CoverageBuffer } from '@/lib/plot/raster';
import type { LinePainter } from './plot-option';

export function createLinePainter(): LinePainter {
  const canvases = [document.createElement('canvas'), document.createElement('canvas')];
  let turn = 0;
  let pixels: ImageData | null = null;
  let coverage: CoverageBuffer | null = null;
  const colors = new Map<string, [number, number, number]>();
  const rgb = (c: string) => {
    let v = colors.get(c);
    if (!v) colors.set(c, (v = parseHex(c)));
    return v;
  };

  return (layers, win, width, height) => {
    // Device pixels, so lines stay one pixel wide and sharp on dense screens.
    const ratio = window.devicePixelRatio || 1;
    const w = Math.max(1, Math.round(width * ratio));
    const h = Math.max(1, Math.round(height * ratio));
    const canvas = canvases[turn];
    turn = 1 - turn;
    if (canvas.width !== w || canvas.height !== h) {
      canvas.width = w;
      canvas.height = h;
    }
    const ctx = canvas.getContext('2d')!;
    if (!pixels || pixels.width !== w || pixels.height !== h) pixels = ctx.createImageData(w, h);
    else pixels.data.fill(0);
    for (const layer of layers) {
      coverage = coverageBuffer(w, h, coverage);
      const dash = layer.dash ? ([layer.dash[0] * ratio, layer.dash[1] * ratio] as const) : undefined;
      rasterPolyline(layer.xy, layer.points, win, coverage, { dash });
      paintCoverage(coverage, pixels.data, rgb(layer.color), layer.opacity ?? 1);
    }
    ctx.putImageData(pixels, 0, 0);
    return canvas;
  };
}
