/** Scatter plot of one or more point series, with an optional fitted line and/or 1:1 line. */
import { esc, px } from '../escape.js';
import { createFrame, emptyChart, extentOf } from './chart-frame.js';
import { LEGEND_ROW_PX, legendNeedsOwnRow, legendRow, seriesColour } from './legend.js';
import type { LegendItem } from './legend.js';

export interface ScatterSeries {
  label: string;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  colour?: string;
}

export interface ScatterSpec {
  id: string;
  title: string;
  xLabel: string;
  yLabel: string;
  series: readonly ScatterSeries[];
  /** A straight line y = intercept + slope·x drawn across the plot (e.g. a fitted line). */
  line?: { slope: number; intercept: number; label: string };
  /** Draw the y = x line (and make both axes share one domain). */
  identity?: boolean;
  width?: number;
  height?: number;
}

export function scatterChart(spec: ScatterSpec): string {
  const xs = spec.series.map((s) => s.x);
  const ys = spec.series.map((s) => s.y);
  let xd = extentOf(...xs);
  let yd = extentOf(...ys);
  const count = spec.series.reduce((n, s) => n + countPairs(s), 0);
  if (count === 0) return emptyChart(spec.id, spec.title, 'No stations with both values.');
  if (spec.identity) {
    const both = extentOf(xd, yd);
    xd = both;
    yd = both;
  }
  const legend: LegendItem[] = [];
  if (spec.identity) legend.push({ label: '1:1', colour: '#444', kind: 'dash' });
  if (spec.series.length > 1 || spec.line || spec.identity) spec.series.forEach((s, i) => legend.push({ label: s.label, colour: s.colour ?? seriesColour(i), kind: 'point' }));
  const hasLine = spec.line !== undefined && Number.isFinite(spec.line.slope) && Number.isFinite(spec.line.intercept);
  if (spec.line && hasLine) legend.push({ label: spec.line.label, colour: '#d55e00', kind: 'line' });
  const width = spec.width ?? (spec.identity ? 560 : 640);
  const ownRow = legendNeedsOwnRow(spec.title, legend, width);
  const f = createFrame({
    id: spec.id,
    title: spec.title,
    xLabel: spec.xLabel,
    yLabel: spec.yLabel,
    xDomain: xd,
    yDomain: yd,
    ...(spec.identity ? { equalAspect: 1 } : {}),
    ...(ownRow ? { topPad: LEGEND_ROW_PX } : {}),
    width,
    height: spec.height ?? (spec.identity ? 500 : 400),
  });
  const marks: string[] = [];
  if (spec.identity) {
    const [a, b] = [Math.max(f.xDomain[0], f.yDomain[0]), Math.min(f.xDomain[1], f.yDomain[1])];
    marks.push(`<line class="ref-line" x1="${px(f.sx(a))}" y1="${px(f.sy(a))}" x2="${px(f.sx(b))}" y2="${px(f.sy(b))}" stroke="#444" stroke-width="1.2" stroke-dasharray="5 3"/>`);
  }
  spec.series.forEach((s, i) => {
    const colour = s.colour ?? seriesColour(i);
    const dots: string[] = [];
    const n = Math.min(s.x.length, s.y.length);
    for (let k = 0; k < n; k++) {
      const x = s.x[k] as number;
      const y = s.y[k] as number;
      if (Number.isFinite(x) && Number.isFinite(y)) dots.push(`<circle cx="${px(f.sx(x))}" cy="${px(f.sy(y))}" r="3"/>`);
    }
    marks.push(`<g class="points" fill="${esc(colour)}" fill-opacity="0.75" stroke="#fff" stroke-width="0.4">${dots.join('')}</g>`);
  });
  if (spec.line && hasLine) {
    const { slope, intercept } = spec.line;
    const [x0, x1] = f.xDomain;
    marks.push(
      `<line class="fit-line" x1="${px(f.sx(x0))}" y1="${px(f.sy(intercept + slope * x0))}" x2="${px(f.sx(x1))}" y2="${px(f.sy(intercept + slope * x1))}" stroke="#d55e00" stroke-width="2"/>`,
    );
  }
  const legendY = ownRow ? 20 + LEGEND_ROW_PX : 20;
  return f.open() + `<g class="marks" clip-path="url(#${esc(f.clipId)})">${marks.join('')}</g>` + legendRow(legend, f.left + f.plotWidth, legendY) + f.close();
}

function countPairs(s: ScatterSeries): number {
  let n = 0;
  for (let k = 0; k < Math.min(s.x.length, s.y.length); k++) if (Number.isFinite(s.x[k] as number) && Number.isFinite(s.y[k] as number)) n++;
  return n;
}
