/**
 * Station map: points coloured by a value with a colour-bar legend, on equal-aspect axes
 * (lon/lat degrees with cos(latitude) scaling, or projected metres), over an optional raster
 * background given as a PNG data URI (shaded relief) with its extent in the same coordinates.
 */
import { esc, px } from '../escape.js';
import type { ColourScale } from '../colour-scale.js';
import { createFrame, emptyChart, extentOf } from './chart-frame.js';
import { COLOUR_BAR_PAD, colourBar } from './colour-bar.js';

export type MapCoords = 'lonlat' | 'projected';

export interface RasterBackground {
  dataUri: string;
  /** Extent of the image's outer edges in map coordinates. */
  xMin: number;
  xMax: number;
  yMin: number;
  yMax: number;
}

export interface StationMapSpec {
  id: string;
  title: string;
  coords: MapCoords;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  values: ArrayLike<number>;
  scale: ColourScale;
  /** Colour-bar label with unit, e.g. "CBA (mGal)". */
  valueLabel: string;
  /** Station ids for hover titles (omitted above 5000 stations to keep the file small). */
  ids?: readonly string[];
  background?: RasterBackground;
  width?: number;
  height?: number;
}

const MAX_TITLED_POINTS = 5000;

export function stationMap(spec: StationMapSpec): string {
  const xd = extentOf(spec.x);
  const yd = extentOf(spec.y);
  let any = false;
  for (let i = 0; i < spec.x.length && !any; i++) any = Number.isFinite(spec.x[i] as number) && Number.isFinite(spec.y[i] as number);
  if (!any) return emptyChart(spec.id, spec.title, 'No station positions.');
  const midLat = (yd[0] + yd[1]) / 2;
  const aspect = spec.coords === 'lonlat' ? Math.max(0.05, Math.cos((midLat * Math.PI) / 180)) : 1;
  const f = createFrame({
    id: spec.id,
    title: spec.title,
    xLabel: spec.coords === 'lonlat' ? 'Longitude (°E)' : 'Easting (m)',
    yLabel: spec.coords === 'lonlat' ? 'Latitude (°N)' : 'Northing (m)',
    xDomain: xd,
    yDomain: yd,
    equalAspect: aspect,
    rightPad: COLOUR_BAR_PAD,
    width: spec.width ?? 640,
    height: spec.height ?? 480,
  });
  const marks: string[] = [];
  const bg = spec.background;
  if (bg) {
    const x0 = f.sx(bg.xMin);
    const x1 = f.sx(bg.xMax);
    const y0 = f.sy(bg.yMax);
    const y1 = f.sy(bg.yMin);
    marks.push(`<image class="relief" href="${esc(bg.dataUri)}" x="${px(x0)}" y="${px(y0)}" width="${px(x1 - x0)}" height="${px(y1 - y0)}" preserveAspectRatio="none"/>`);
  }
  const withTitles = spec.ids !== undefined && spec.x.length <= MAX_TITLED_POINTS;
  const dots: string[] = [];
  // draw in value order so extremes stay on top; NaN-valued stations first, in grey
  const order = Array.from({ length: spec.x.length }, (_, i) => i).sort((a, b) => rank(spec.values[a] as number, spec.scale) - rank(spec.values[b] as number, spec.scale));
  for (const i of order) {
    const x = spec.x[i] as number;
    const y = spec.y[i] as number;
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    const v = spec.values[i] as number;
    const title = withTitles ? `<title>${esc(spec.ids?.[i] ?? '')}: ${esc(Number.isFinite(v) ? v.toFixed(2) : 'no value')}</title>` : '';
    dots.push(`<circle cx="${px(f.sx(x))}" cy="${px(f.sy(y))}" r="3.6" fill="${spec.scale.colour(v)}">${title}</circle>`);
  }
  marks.push(`<g class="points" stroke="#222" stroke-width="0.5">${dots.join('')}</g>`);
  const bar = colourBar(spec.id, spec.scale, spec.valueLabel, f.left + f.plotWidth + 14, f.top, f.plotHeight);
  return f.open() + `<g class="marks" clip-path="url(#${esc(f.clipId)})">${marks.join('')}</g>` + bar + f.close();
}

function rank(v: number, scale: ColourScale): number {
  return Number.isFinite(v) ? Math.abs(v - (scale.centre ?? scale.min)) : -Infinity;
}
