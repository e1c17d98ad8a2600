/**
 * Colour maps for the report, as evenly spaced sRGB stops interpolated linearly.
 * viridis and cividis are sequential and readable with the common colour-vision deficiencies;
 * the diverging map runs dark blue → near white → dark orange (no red/green pair).
 */

export interface ColourMap {
  name: string;
  /** Evenly spaced stops from t = 0 to t = 1, as '#rrggbb'. */
  stops: readonly string[];
}

/** viridis sampled at t = i/9 (matplotlib's viridis; endpoints #440154 and #fde725). */
export const VIRIDIS: ColourMap = {
  name: 'viridis',
  stops: ['#440154', '#482878', '#3e4989', '#31688e', '#26828e', '#1f9e89', '#35b779', '#6ece58', '#b5de2b', '#fde725'],
};

/** cividis sampled at t = i/5 (matplotlib's cividis; endpoints #00224e and #fee838). */
export const CIVIDIS: ColourMap = {
  name: 'cividis',
  stops: ['#00224e', '#35456c', '#666970', '#948e77', '#c8b866', '#fee838'],
};

/** Diverging blue–orange map; the middle stop (t = 0.5) is the centre value. */
export const BLUE_ORANGE: ColourMap = {
  name: 'blue-orange',
  stops: ['#08306b', '#2f6db0', '#8fb8de', '#f2f0ec', '#f7b36b', '#d9661a', '#7f2704'],
};

/** Grey ramp used for shaded relief (0 = shadow, 1 = lit); kept light so coloured points stay readable on it. */
export const RELIEF_GREY: ColourMap = { name: 'grey', stops: ['#9a9a9a', '#f6f6f6'] };

export type Rgb = [number, number, number];

export function hexToRgb(hex: string): Rgb {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

export function rgbToHex([r, g, b]: Rgb): string {
  const h = (v: number) => Math.max(0, Math.min(255, Math.round(v))).toString(16).padStart(2, '0');
  return `#${h(r)}${h(g)}${h(b)}`;
}

/** Colour at t in [0, 1] (clamped; NaN → the map's middle never: callers draw NaN separately). */
export function rgbAt(map: ColourMap, t: number): Rgb {
  const stops = map.stops;
  const tc = Math.max(0, Math.min(1, Number.isFinite(t) ? t : 0));
  const pos = tc * (stops.length - 1);
  const i = Math.min(stops.length - 2, Math.floor(pos));
  const f = pos - i;
  const a = hexToRgb(stops[i] ?? '#000000');
  const b = hexToRgb(stops[i + 1] ?? stops[i] ?? '#000000');
  return [a[0] + (b[0] - a[0]) * f, a[1] + (b[1] - a[1]) * f, a[2] + (b[2] - a[2]) * f];
}

export function colourAt(map: ColourMap, t: number): string {
  return rgbToHex(rgbAt(map, t));
}
