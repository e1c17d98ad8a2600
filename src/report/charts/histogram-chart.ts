/** Histogram with nice bin edges, and optional vertical marker lines (e.g. a tolerance). */
import { esc, px } from '../escape.js';
import { niceStep } from '../ticks.js';
import { sortedFinite } from '../summary-stats.js';
import { createFrame, emptyChart } from './chart-frame.js';

export interface HistogramBins {
  /** Left edge of the first bin. */
  start: number;
  /** Bin width. */
  width: number;
  counts: number[];
}

/** Bins the finite values into about `targetBins` bins whose edges are multiples of a 1-2-5 step. */
export function binValues(values: ArrayLike<number>, targetBins = 20): HistogramBins {
  const s = sortedFinite(values);
  if (s.length === 0) return { start: 0, width: 1, counts: [] };
  const lo = s[0] as number;
  const hi = s[s.length - 1] as number;
  const width = hi > lo ? niceStep(hi - lo, targetBins) : Math.max(Math.abs(lo) * 0.1, 1);
  const start = Math.floor(lo / width) * width;
  const n = Math.max(1, Math.floor((hi - start) / width) + 1);
  const counts = new Array<number>(n).fill(0);
  for (const v of s) {
    const i = Math.min(n - 1, Math.floor((v - start) / width));
    counts[i] = (counts[i] ?? 0) + 1;
  }
  return { start, width, counts };
}

export interface HistogramSpec {
  id: string;
  title: string;
  xLabel: string;
  values: ArrayLike<number>;
  markers?: readonly { x: number; label: string }[];
  colour?: string;
  width?: number;
  height?: number;
}

export function histogramChart(spec: HistogramSpec): string {
  const bins = binValues(spec.values);
  if (bins.counts.length === 0) return emptyChart(spec.id, spec.title, 'No values to bin.');
  const xEnd = bins.start + bins.width * bins.counts.length;
  const markerXs = (spec.markers ?? []).map((m) => m.x).filter((x) => Number.isFinite(x));
  const f = createFrame({
    id: spec.id,
    title: spec.title,
    xLabel: spec.xLabel,
    yLabel: 'Stations (count)',
    xDomain: [Math.min(bins.start, ...markerXs), Math.max(xEnd, ...markerXs)],
    yDomain: [0, Math.max(...bins.counts)],
    ...(spec.width ? { width: spec.width } : {}),
    ...(spec.height ? { height: spec.height } : {}),
  });
  const bars = bins.counts
    .map((c, i) => {
      if (c === 0) return '';
      const x0 = f.sx(bins.start + i * bins.width);
      const x1 = f.sx(bins.start + (i + 1) * bins.width);
      const y = f.sy(c);
      return `<rect x="${px(x0)}" y="${px(y)}" width="${px(Math.max(0.5, x1 - x0 - 1))}" height="${px(f.sy(0) - y)}"><title>${esc(`${c}`)}</title></rect>`;
    })
    .join('');
  const marks = [`<g class="bars" fill="${esc(spec.colour ?? '#31688e')}">${bars}</g>`];
  for (const m of spec.markers ?? []) {
    if (!Number.isFinite(m.x)) continue;
    const x = px(f.sx(m.x));
    marks.push(`<line class="marker" x1="${x}" x2="${x}" y1="${f.top}" y2="${f.top + f.plotHeight}" stroke="#d55e00" stroke-width="1.5" stroke-dasharray="5 3"/>`);
    marks.push(`<text class="marker-label" x="${px(f.sx(m.x) + 4)}" y="${f.top + 14}">${esc(m.label)}</text>`);
  }
  return f.open() + `<g class="marks" clip-path="url(#${esc(f.clipId)})">${marks.join('')}</g>` + f.close();
}
