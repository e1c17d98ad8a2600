/** Line chart of one or more (x, y) series, with optional vertical marker lines. */
import { esc, px } from '../escape.js';
import { createFrame, emptyChart, extentOf } from './chart-frame.js';
import { LEGEND_ROW_PX, legendNeedsOwnRow, legendRow, seriesColour } from './legend.js';
import type { LegendItem } from './legend.js';

export interface LineSeries {
  label: string;
  points: readonly (readonly [number, number])[];
  colour?: string;
}

export interface LineSpec {
  id: string;
  title: string;
  xLabel: string;
  yLabel: string;
  series: readonly LineSeries[];
  /** Vertical lines at given x (e.g. the chosen density). */
  markers?: readonly { x: number; label: string }[];
  width?: number;
  height?: number;
}

export function lineChart(spec: LineSpec): string {
  const finite = spec.series.map((s) => s.points.filter((p) => Number.isFinite(p[0]) && Number.isFinite(p[1])));
  if (finite.every((p) => p.length === 0)) return emptyChart(spec.id, spec.title, 'No curve to draw.');
  const xd = extentOf(finite.flat().map((p) => p[0]), (spec.markers ?? []).map((m) => m.x));
  const yd = extentOf(finite.flat().map((p) => p[1]));
  const legend: LegendItem[] = spec.series.map((s, i) => ({ label: s.label, colour: s.colour ?? seriesColour(i), kind: 'line' }));
  const width = spec.width ?? 640;
  const ownRow = legendNeedsOwnRow(spec.title, legend, width);
  const f = createFrame({
    id: spec.id,
    title: spec.title,
    xLabel: spec.xLabel,
    yLabel: spec.yLabel,
    xDomain: xd,
    yDomain: yd,
    width,
    ...(ownRow ? { topPad: LEGEND_ROW_PX } : {}),
    ...(spec.height ? { height: spec.height } : {}),
  });
  const marks: string[] = [];
  finite.forEach((pts, i) => {
    const s = spec.series[i];
    if (!s) return;
    const colour = s.colour ?? seriesColour(i);
    const d = pts.map((p, k) => `${k === 0 ? 'M' : 'L'}${px(f.sx(p[0]))} ${px(f.sy(p[1]))}`).join('');
    marks.push(`<path class="series" d="${d}" fill="none" stroke="${esc(colour)}" stroke-width="2"/>`);
    marks.push(`<g fill="${esc(colour)}">${pts.map((p) => `<circle cx="${px(f.sx(p[0]))}" cy="${px(f.sy(p[1]))}" r="2.2"/>`).join('')}</g>`);
  });
  for (const m of spec.markers ?? []) {
    if (!Number.isFinite(m.x)) continue;
    const x = px(f.sx(m.x));
    marks.push(`<line class="marker" x1="${x}" x2="${x}" y1="${f.top}" y2="${f.top + f.plotHeight}" stroke="#444" stroke-dasharray="5 3"/>`);
    marks.push(`<text class="marker-label" x="${px(f.sx(m.x) + 4)}" y="${f.top + 14}">${esc(m.label)}</text>`);
  }
  return f.open() + `<g class="marks" clip-path="url(#${esc(f.clipId)})">${marks.join('')}</g>` + legendRow(legend, f.left + f.plotWidth, ownRow ? 20 + LEGEND_ROW_PX : 20) + f.close();
}
