/**
 * Value → colour scales for map points. Limits come from quantiles so that a few extreme
 * stations don't wash out the rest; values beyond the limits take the end colours.
 */
import { BLUE_ORANGE, VIRIDIS, colourAt } from './colour-maps.js';
import type { ColourMap } from './colour-maps.js';
import { quantileSorted, sortedFinite } from './summary-stats.js';

export interface ColourScale {
  map: ColourMap;
  /** Value drawn with the first stop. */
  min: number;
  /** Value drawn with the last stop. */
  max: number;
  /** Diverging scales: the value drawn with the middle stop. */
  centre?: number;
  /** Colour of a value (NaN → the no-data grey). */
  colour(value: number): string;
}

export const NO_DATA_COLOUR = '#bdbdbd';

/** Lower and upper quantile used for limits (2 % each side). */
export const CLIP_QUANTILES: readonly [number, number] = [0.02, 0.98];

function build(map: ColourMap, min: number, max: number, centre?: number): ColourScale {
  const span = max - min;
  return {
    map,
    min,
    max,
    ...(centre !== undefined ? { centre } : {}),
    colour: (v: number) => (Number.isFinite(v) ? colourAt(map, span > 0 ? (v - min) / span : 0.5) : NO_DATA_COLOUR),
  };
}

/** Sequential scale from the 2 % to the 98 % quantile of the finite values. */
export function sequentialScale(values: ArrayLike<number>, map: ColourMap = VIRIDIS): ColourScale {
  const s = sortedFinite(values);
  if (s.length === 0) return build(map, 0, 1);
  let lo = quantileSorted(s, CLIP_QUANTILES[0]);
  let hi = quantileSorted(s, CLIP_QUANTILES[1]);
  if (!(hi > lo)) {
    lo = s[0] as number;
    hi = s[s.length - 1] as number;
  }
  if (!(hi > lo)) {
    lo -= 0.5;
    hi += 0.5;
  }
  return build(map, lo, hi);
}

/**
 * Diverging scale centred on `centre` ('median' = the median of the values, or a fixed number
 * such as 0 for misfits), symmetric, with half-width the larger distance from the centre to the
 * 2 % / 98 % quantiles.
 */
export function divergingScale(
  values: ArrayLike<number>,
  centre: 'median' | number = 'median',
  map: ColourMap = BLUE_ORANGE,
): ColourScale {
  const s = sortedFinite(values);
  if (s.length === 0) return build(map, -1, 1, 0);
  const c = centre === 'median' ? quantileSorted(s, 0.5) : centre;
  const lo = quantileSorted(s, CLIP_QUANTILES[0]);
  const hi = quantileSorted(s, CLIP_QUANTILES[1]);
  let half = Math.max(Math.abs(hi - c), Math.abs(c - lo));
  if (!(half > 0)) half = Math.max(Math.abs(c) * 0.1, 1);
  return build(map, c - half, c + half, c);
}
