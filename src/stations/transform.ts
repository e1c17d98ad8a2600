/**
 * Coordinate conversion between two resolved CRSs (see crs-registry.ts) with proj4. Axis order
 * is always (x, y) = (easting, northing) or (longitude, latitude) in degrees, whatever the EPSG
 * axis order of the CRS. proj4 returns NaN (or Infinity) instead of failing for points it cannot
 * convert; here such a point is an InputError naming both CRSs and the point.
 */
import proj4 from 'proj4';
import type { CrsInfo } from '../dem/grid.js';
import { InputError, type InputErrorContext } from '../errors.js';

export type PointTransform = (x: number, y: number) => [number, number];

/** A reusable converter from `from` to `to` (the proj4 converter is built once). */
export function makeTransform(from: CrsInfo, to: CrsInfo): PointTransform {
  const forward = converter(from, to);
  return (x, y) => {
    const out = forward([x, y]);
    const ox = out[0];
    const oy = out[1];
    if (!(Number.isFinite(ox) && Number.isFinite(oy))) throw failure(from, to, x, y, ox, oy, {});
    return [ox as number, oy as number];
  };
}

/** Where a point of `transformArrays` came from, for messages (lines and ids by index). */
export interface PointSource {
  file?: string;
  lines?: readonly number[];
  ids?: readonly string[];
}

/**
 * Converts whole columns. `xs[i], ys[i]` that are NaN on input (rows already marked bad) stay
 * NaN on output; any other point that does not convert is an InputError naming the file line
 * and station when `source` gives them.
 */
export function transformArrays(
  from: CrsInfo,
  to: CrsInfo,
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  source: PointSource = {},
): { x: Float64Array; y: Float64Array } {
  const n = xs.length;
  if (ys.length !== n) throw new Error(`transformArrays: ${n} x values but ${ys.length} y values`);
  const forward = converter(from, to);
  const outX = new Float64Array(n);
  const outY = new Float64Array(n);
  const point: [number, number] = [0, 0];
  for (let i = 0; i < n; i++) {
    const x = xs[i] as number;
    const y = ys[i] as number;
    if (Number.isNaN(x) || Number.isNaN(y)) {
      outX[i] = NaN;
      outY[i] = NaN;
      continue;
    }
    point[0] = x;
    point[1] = y;
    const out = forward(point);
    const ox = out[0] as number;
    const oy = out[1] as number;
    if (!(Number.isFinite(ox) && Number.isFinite(oy))) {
      const ctx: InputErrorContext = {};
      if (source.file !== undefined) ctx.file = source.file;
      const line = source.lines?.[i];
      if (line !== undefined) ctx.line = line;
      const id = source.ids?.[i];
      if (id !== undefined) ctx.station = id;
      throw failure(from, to, x, y, ox, oy, ctx);
    }
    outX[i] = ox;
    outY[i] = oy;
  }
  return { x: outX, y: outY };
}

function converter(from: CrsInfo, to: CrsInfo): (p: number[]) => number[] {
  try {
    const c = proj4(from.proj4, to.proj4);
    return (p) => c.forward(p);
  } catch (e) {
    throw new InputError(
      `cannot convert coordinates from ${from.label} to ${to.label}: ${e instanceof Error ? e.message : String(e)}`,
    );
  }
}

function failure(
  from: CrsInfo,
  to: CrsInfo,
  x: number,
  y: number,
  ox: number | undefined,
  oy: number | undefined,
  ctx: InputErrorContext,
): InputError {
  return new InputError(
    `point (${x}, ${y}) in ${from.label} does not convert to ${to.label} (got ${String(ox)}, ${String(oy)}); ` +
      `expected a point inside the area the CRS covers`,
    ctx,
  );
}
