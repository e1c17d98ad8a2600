/**
 * The frame every chart draws into: an inline <svg> (no namespace URL needed inside HTML) with a
 * title, a plot area, grid lines, tick marks with labels, and axis labels that carry units.
 * Text widths are estimated (no layout engine), so margins are sized from label lengths.
 */
import { esc, px, tickLabel } from '../escape.js';
import { linearScale, niceTicks } from '../ticks.js';

export interface FrameSpec {
  /** Unique id within the report (used for the clip path and data-chart attribute). */
  id: string;
  title: string;
  /** Axis labels with units, e.g. "Station height (m)". */
  xLabel: string;
  yLabel: string;
  /** Data extents; ticks extend them to whole steps unless equalAspect is set. */
  xDomain: readonly [number, number];
  yDomain: readonly [number, number];
  width?: number;
  height?: number;
  /** Extra space on the right (colour bars, legends), px. */
  rightPad?: number;
  /**
   * Equal-aspect maps: ground distance per x unit divided by distance per y unit
   * (cos(latitude) for lon/lat degrees, 1 for projected metres).
   */
  equalAspect?: number;
  /** Approximate tick count per axis. */
  tickCount?: number;
  /** Extra space above the plot (a legend row under the title), px. */
  topPad?: number;
  /** Categorical x axis: category i is centred at x = i + 0.5 (xDomain is then [0, n]). */
  xCategories?: readonly string[];
}

export interface Frame {
  sx: (v: number) => number;
  sy: (v: number) => number;
  /** Plot area in px. */
  left: number;
  top: number;
  plotWidth: number;
  plotHeight: number;
  width: number;
  height: number;
  /** Final domains after tick extension or aspect fitting. */
  xDomain: [number, number];
  yDomain: [number, number];
  clipId: string;
  /** Opening markup: <svg>, title, background, grid. */
  open(): string;
  /** Closing markup: axes, ticks, labels, </svg>. */
  close(): string;
}

const CHAR_W = 6.4; // px per character of the 11 px tick font (estimate for margin sizing)

export function createFrame(spec: FrameSpec): Frame {
  const width = spec.width ?? 640;
  const height = spec.height ?? 400;
  const target = spec.tickCount ?? 6;
  let xt = niceTicks(spec.xDomain[0], spec.xDomain[1], target);
  let yt = niceTicks(spec.yDomain[0], spec.yDomain[1], target);
  const yLabelChars = Math.max(...yt.ticks.map((t) => tickLabel(t, yt.step).length));
  const left = Math.round(30 + yLabelChars * CHAR_W + 8);
  const top = 34 + (spec.topPad ?? 0);
  const bottom = 50;
  const plotHeight = height - top - bottom;
  // the last x label is centred on the right edge: leave room for half of it
  const xLabelW = (t: { ticks: number[]; step: number }) => Math.max(...t.ticks.map((v) => tickLabel(v, t.step).length)) * CHAR_W;
  const right = Math.max(16, Math.ceil(xLabelW(xt) / 2) + 4) + (spec.rightPad ?? 0);
  const plotWidth = width - left - right;
  let xDomain: [number, number] = [xt.domainMin, xt.domainMax];
  let yDomain: [number, number] = [yt.domainMin, yt.domainMax];
  if (spec.equalAspect !== undefined) {
    [xDomain, yDomain] = fitAspect(spec.xDomain, spec.yDomain, plotWidth, plotHeight, spec.equalAspect);
    xt = niceTicks(xDomain[0], xDomain[1], target - 1);
    yt = niceTicks(yDomain[0], yDomain[1], target - 1);
  }
  // fewer x ticks while their labels (plus a gap) would not fit side by side
  for (let n = target - 1; n >= 2 && xt.ticks.length * (xLabelW(xt) + 12) > plotWidth + xLabelW(xt); n--) {
    const fewer = niceTicks(xDomain[0], xDomain[1], n);
    if (spec.equalAspect === undefined) xDomain = [fewer.domainMin, fewer.domainMax];
    xt = fewer;
  }
  const inside = (v: number, d: [number, number]) => v >= d[0] - 1e-9 * Math.abs(d[1] - d[0]) && v <= d[1] + 1e-9 * Math.abs(d[1] - d[0]);
  const cats = spec.xCategories;
  if (cats !== undefined) xDomain = [0, cats.length];
  const xTicks = cats !== undefined ? cats.map((_, i) => i + 0.5) : xt.ticks.filter((t) => inside(t, xDomain));
  const xText = (t: number) => (cats !== undefined ? (cats[Math.floor(t)] ?? '') : tickLabel(t, xt.step));
  const yTicks = yt.ticks.filter((t) => inside(t, yDomain));
  const sx = linearScale(xDomain[0], xDomain[1], left, left + plotWidth);
  const sy = linearScale(yDomain[0], yDomain[1], top + plotHeight, top);
  const clipId = `clip-${spec.id}`;

  const open = () => {
    const grid = [
      ...(cats !== undefined ? [] : xTicks).map((t) => `<line x1="${px(sx(t))}" x2="${px(sx(t))}" y1="${top}" y2="${top + plotHeight}"/>`),
      ...yTicks.map((t) => `<line x1="${left}" x2="${left + plotWidth}" y1="${px(sy(t))}" y2="${px(sy(t))}"/>`),
    ].join('');
    return (
      `<svg class="chart" data-chart="${esc(spec.id)}" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${esc(spec.title)}">` +
      `<title>${esc(spec.title)}</title>` +
      `<defs><clipPath id="${esc(clipId)}"><rect x="${left}" y="${top}" width="${plotWidth}" height="${plotHeight}"/></clipPath></defs>` +
      `<text class="chart-title" x="${left}" y="20">${esc(spec.title)}</text>` +
      `<rect class="plot-bg" x="${left}" y="${top}" width="${plotWidth}" height="${plotHeight}"/>` +
      `<g class="grid">${grid}</g>`
    );
  };

  const close = () => {
    const xb = top + plotHeight;
    const xTickMarks = xTicks
      .map((t) => `<line x1="${px(sx(t))}" x2="${px(sx(t))}" y1="${xb}" y2="${xb + 5}"/><text x="${px(sx(t))}" y="${xb + 17}" text-anchor="middle">${esc(xText(t))}</text>`)
      .join('');
    const yTickMarks = yTicks
      .map((t) => `<line x1="${left - 5}" x2="${left}" y1="${px(sy(t))}" y2="${px(sy(t))}"/><text x="${left - 8}" y="${px(sy(t) + 4)}" text-anchor="end">${esc(tickLabel(t, yt.step))}</text>`)
      .join('');
    return (
      `<rect class="plot-border" x="${left}" y="${top}" width="${plotWidth}" height="${plotHeight}"/>` +
      `<g class="axis x-axis">${xTickMarks}<text class="axis-label" x="${px(left + plotWidth / 2)}" y="${height - 10}" text-anchor="middle">${esc(spec.xLabel)}</text></g>` +
      `<g class="axis y-axis">${yTickMarks}<text class="axis-label" transform="translate(14 ${px(top + plotHeight / 2)}) rotate(-90)" text-anchor="middle">${esc(spec.yLabel)}</text></g>` +
      `</svg>`
    );
  };

  return { sx, sy, left, top, plotWidth, plotHeight, width, height, xDomain, yDomain, clipId, open, close };
}

/** Widens the x or y domain (about its centre) so one x unit spans `aspect` times one y unit on screen. */
function fitAspect(
  xd: readonly [number, number],
  yd: readonly [number, number],
  w: number,
  h: number,
  aspect: number,
): [[number, number], [number, number]] {
  const pad = 0.05;
  let xSpan = Math.max(xd[1] - xd[0], 1e-9) * (1 + 2 * pad);
  let ySpan = Math.max(yd[1] - yd[0], 1e-9) * (1 + 2 * pad);
  const xc = (xd[0] + xd[1]) / 2;
  const yc = (yd[0] + yd[1]) / 2;
  // ground units per pixel must match on both axes
  const perPxX = (xSpan * aspect) / w;
  const perPxY = ySpan / h;
  if (perPxX > perPxY) ySpan = (perPxX * h);
  else xSpan = (perPxY * w) / aspect;
  return [
    [xc - xSpan / 2, xc + xSpan / 2],
    [yc - ySpan / 2, yc + ySpan / 2],
  ];
}

/** Finite min and max over several arrays; [0, 1] when there is none. */
export function extentOf(...arrays: ArrayLike<number>[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const a of arrays) {
    for (let i = 0; i < a.length; i++) {
      const v = a[i] as number;
      if (Number.isFinite(v)) {
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
    }
  }
  return lo <= hi ? [lo, hi] : [0, 1];
}

/** An empty-state chart: the frame with a centred message (so a section never silently vanishes). */
export function emptyChart(id: string, title: string, message: string): string {
  return (
    `<svg class="chart chart-empty" data-chart="${esc(id)}" viewBox="0 0 640 120" width="640" height="120" role="img" aria-label="${esc(title)}">` +
    `<text class="chart-title" x="16" y="20">${esc(title)}</text>` +
    `<text x="320" y="70" text-anchor="middle" class="note">${esc(message)}</text></svg>`
  );
}
