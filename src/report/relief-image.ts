/**
 * Shaded-relief background for station maps: a grey hillshade of a DEM window, downsampled to at
 * most `maxWidthPx` pixels wide and encoded as a PNG data URI. Drawing only — the DEM values are
 * never used for any result here.
 */
import { PNG } from 'pngjs';
import type { DemGrid } from '../dem/grid.js';
import { RELIEF_GREY, rgbAt } from './colour-maps.js';
import type { RasterBackground } from './charts/station-map.js';

/** Metres per degree of latitude (mean, for the shading slope only: a few % is invisible in grey). */
const METRES_PER_DEGREE = 111_195;
/** Sun from the north-west, 45° above the horizon (the usual cartographic convention). */
const SUN_AZIMUTH_DEG = 315;
const SUN_ALTITUDE_DEG = 45;

export interface ReliefOptions {
  /** Map-coordinate window to cover (the image is cropped to the DEM where they overlap). */
  xMin: number;
  xMax: number;
  yMin: number;
  yMax: number;
  maxWidthPx?: number;
}

/** The hillshade as a PNG data URI with its extent, or undefined when the window misses the DEM. */
export function reliefBackground(grid: DemGrid, opts: ReliefOptions): RasterBackground | undefined {
  const maxW = opts.maxWidthPx ?? 600;
  const c0 = Math.max(0, Math.floor((opts.xMin - grid.originX) / grid.cellSizeX));
  const c1 = Math.min(grid.width, Math.ceil((opts.xMax - grid.originX) / grid.cellSizeX));
  const r0 = Math.max(0, Math.floor((grid.originY - opts.yMax) / grid.cellSizeY));
  const r1 = Math.min(grid.height, Math.ceil((grid.originY - opts.yMin) / grid.cellSizeY));
  if (!(c1 - c0 >= 2 && r1 - r0 >= 2)) return undefined;
  const stride = Math.max(1, Math.ceil((c1 - c0) / maxW));
  const w = Math.floor((c1 - c0) / stride);
  const h = Math.floor((r1 - r0) / stride);
  if (w < 2 || h < 2) return undefined;
  // block means of the DEM at the output resolution
  const z = new Float64Array(w * h);
  for (let j = 0; j < h; j++) {
    for (let i = 0; i < w; i++) {
      let sum = 0;
      let n = 0;
      for (let dr = 0; dr < stride; dr++) {
        const row = r0 + j * stride + dr;
        for (let dc = 0; dc < stride; dc++) {
          const v = grid.data[row * grid.width + c0 + i * stride + dc] as number;
          if (Number.isFinite(v)) {
            sum += v;
            n++;
          }
        }
      }
      z[j * w + i] = n > 0 ? sum / n : NaN;
    }
  }
  const xMin = grid.originX + c0 * grid.cellSizeX;
  const yMax = grid.originY - r0 * grid.cellSizeY;
  const cellX = grid.cellSizeX * stride;
  const cellY = grid.cellSizeY * stride;
  let dxM: number;
  let dyM: number;
  if (grid.crs.kind === 'geographic') {
    const midLat = yMax - (h * cellY) / 2;
    dxM = cellX * METRES_PER_DEGREE * Math.cos((midLat * Math.PI) / 180);
    dyM = cellY * METRES_PER_DEGREE;
  } else {
    const unit = Number.isFinite(grid.crs.linearUnitM) ? grid.crs.linearUnitM : 1;
    dxM = cellX * unit;
    dyM = cellY * unit;
  }
  const png = new PNG({ width: w, height: h });
  const shade = hillshade(z, w, h, dxM, dyM);
  for (let k = 0; k < w * h; k++) {
    const s = shade[k] as number;
    const [r, g, b] = rgbAt(RELIEF_GREY, Number.isFinite(s) ? s : 0);
    png.data[4 * k] = Math.round(r);
    png.data[4 * k + 1] = Math.round(g);
    png.data[4 * k + 2] = Math.round(b);
    png.data[4 * k + 3] = Number.isFinite(s) ? 255 : 0;
  }
  const buf = PNG.sync.write(png);
  return { dataUri: `data:image/png;base64,${buf.toString('base64')}`, xMin, xMax: xMin + w * cellX, yMin: yMax - h * cellY, yMax };
}

/** Lambertian hillshade in [0, 1] from central differences (one-sided at the edges); NaN where z is NaN. */
export function hillshade(z: Float64Array, w: number, h: number, dxM: number, dyM: number): Float64Array {
  const out = new Float64Array(w * h);
  const az = ((360 - SUN_AZIMUTH_DEG + 90) * Math.PI) / 180; // math angle from +x, anticlockwise
  const alt = (SUN_ALTITUDE_DEG * Math.PI) / 180;
  const lx = Math.cos(alt) * Math.cos(az);
  const ly = Math.cos(alt) * Math.sin(az);
  const lz = Math.sin(alt);
  const at = (i: number, j: number, fallback: number) => {
    const v = z[Math.max(0, Math.min(h - 1, j)) * w + Math.max(0, Math.min(w - 1, i))] as number;
    return Number.isFinite(v) ? v : fallback;
  };
  for (let j = 0; j < h; j++) {
    for (let i = 0; i < w; i++) {
      const c = z[j * w + i] as number;
      if (!Number.isFinite(c)) {
        out[j * w + i] = NaN;
        continue;
      }
      const dzdx = (at(i + 1, j, c) - at(i - 1, j, c)) / ((Math.min(w - 1, i + 1) - Math.max(0, i - 1) || 1) * dxM);
      // row index grows southwards, so north-positive dz/dy has the opposite sign
      const dzdy = (at(i, j - 1, c) - at(i, j + 1, c)) / ((Math.min(h - 1, j + 1) - Math.max(0, j - 1) || 1) * dyM);
      const norm = Math.sqrt(dzdx * dzdx + dzdy * dzdy + 1);
      const lit = (-dzdx * lx - dzdy * ly + lz) / norm;
      out[j * w + i] = Math.max(0, Math.min(1, lit));
    }
  }
  return out;
}
