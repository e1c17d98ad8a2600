/**
 * Box-and-strip chart: one column per group, a box from the lower to the upper quartile with the
 * median, whiskers to the most extreme values within 1.5 × IQR, and every value as a dot with a
 * deterministic horizontal jitter (so the same data always draw the same picture).
 */
import { esc, px } from '../escape.js';
import { quantileSorted, sortedFinite } from '../summary-stats.js';
import { createFrame, emptyChart, extentOf } from './chart-frame.js';
import { seriesColour } from './legend.js';

export interface BoxGroup {
  label: string;
  values: ArrayLike<number>;
}

export interface BoxStripSpec {
  id: string;
  title: string;
  /** Label under the group names (default "Group"). */
  xLabel?: string;
  yLabel: string;
  groups: readonly BoxGroup[];
  width?: number;
  height?: number;
}

/** Deterministic pseudo-random offset in [-0.5, 0.5) from an index (golden-ratio sequence). */
function jitter(k: number): number {
  const v = (k * 0.6180339887498949) % 1;
  return v - 0.5;
}

export function boxStripChart(spec: BoxStripSpec): string {
  if (spec.groups.length === 0) return emptyChart(spec.id, spec.title, 'No groups to draw.');
  const yd = extentOf(...spec.groups.map((g) => g.values));
  const f = createFrame({
    id: spec.id,
    title: spec.title,
    xLabel: spec.xLabel ?? 'Group',
    yLabel: spec.yLabel,
    xDomain: [0, spec.groups.length],
    yDomain: yd,
    xCategories: spec.groups.map((g) => g.label),
    ...(spec.width ? { width: spec.width } : {}),
    ...(spec.height ? { height: spec.height } : {}),
  });
  const slot = f.plotWidth / spec.groups.length;
  const marks: string[] = [];
  spec.groups.forEach((g, i) => {
    const s = sortedFinite(g.values);
    const cx = f.sx(i + 0.5);
    const colour = seriesColour(i);
    const boxW = Math.min(60, slot * 0.5);
    if (s.length > 0) {
      const q1 = quantileSorted(s, 0.25);
      const q3 = quantileSorted(s, 0.75);
      const med = quantileSorted(s, 0.5);
      const iqr = q3 - q1;
      const wLo = s.find((v) => v >= q1 - 1.5 * iqr) ?? q1;
      const wHi = [...s].reverse().find((v) => v <= q3 + 1.5 * iqr) ?? q3;
      marks.push(
        `<g class="box" stroke="#333" fill="none">` +
          `<line x1="${px(cx)}" x2="${px(cx)}" y1="${px(f.sy(wLo))}" y2="${px(f.sy(q1))}"/>` +
          `<line x1="${px(cx)}" x2="${px(cx)}" y1="${px(f.sy(q3))}" y2="${px(f.sy(wHi))}"/>` +
          `<rect x="${px(cx - boxW / 2)}" y="${px(f.sy(q3))}" width="${px(boxW)}" height="${px(Math.max(1, f.sy(q1) - f.sy(q3)))}" fill="${esc(colour)}" fill-opacity="0.18"/>` +
          `<line x1="${px(cx - boxW / 2)}" x2="${px(cx + boxW / 2)}" y1="${px(f.sy(med))}" y2="${px(f.sy(med))}" stroke-width="2"/>` +
          `</g>`,
      );
    }
    const dots: string[] = [];
    for (let k = 0; k < g.values.length; k++) {
      const v = g.values[k] as number;
      if (Number.isFinite(v)) dots.push(`<circle cx="${px(cx + jitter(k) * boxW * 1.4)}" cy="${px(f.sy(v))}" r="2.2"/>`);
    }
    marks.push(`<g class="points" fill="${esc(colour)}" fill-opacity="0.6">${dots.join('')}</g>`);
  });
  return f.open() + `<g class="marks" clip-path="url(#${esc(f.clipId)})">${marks.join('')}</g>` + f.close();
}
