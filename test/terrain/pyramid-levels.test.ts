/**
 * The stored pyramid levels against their definition: every cell of every stored level is
 * recomputed straight from the native heights under its (clipped) footprint, in float64, and
 * compared with what buildPyramid stored after combining children level by level in row strips.
 * Odd sizes make the last row and column of many levels partial and leave the last row of a
 * level without a sibling, so a child read from the wrong strip row shows up here.
 */
import { describe, expect, it } from 'vitest';
import { assertClose } from '../helpers/assert-close.js';
import { gridFromFunction, sharedFloat32, type DemGrid } from '../../src/dem/grid.js';
import {
  buildPyramid,
  CELL_LO_OFFSET,
  CELL_MEAN,
  CELL_P_UP_COL,
  CELL_P_UP_ROW,
  CELL_SD,
  CELL_STRIDE,
  CELL_UP_OFFSET,
  CELL_W_UP,
  CELL_WEIGHT,
  FIRST_STORED_LEVEL,
  type PyramidLevel,
} from '../../src/terrain/pyramid.js';

const CRS = { kind: 'projected' as const, proj4: '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs', label: 'EPSG:32633', linearUnitM: 1 };

/** Invented hills with metre-scale roughness; optionally a sprinkle of nodata. */
function hills(width: number, height: number, gaps: boolean): DemGrid {
  return gridFromFunction({ width, height, originX: 0, originY: 0, cellSizeX: 30, cellSizeY: 30, crs: CRS, source: 'test hills' }, (x, y, row, col) =>
    gaps && (row * 7 + col * 3) % 13 === 0 ? NaN : 500 + 300 * Math.sin(x / 900) * Math.cos(y / 700) + ((row * 31 + col * 17) % 7),
  );
}

interface Direct {
  weight: number;
  mean: number;
  sd: number;
  covCol: number;
  covRow: number;
}

/** One cell's weight, mean, sd and covariances with the native offsets from its centre, from the native cells. */
function direct(grid: DemGrid, weights: Float32Array | null, lv: PyramidLevel, row: number, col: number): Direct {
  const f = lv.factor;
  const r0 = row * f;
  const c0 = col * f;
  const r1 = Math.min(r0 + f, grid.height);
  const c1 = Math.min(c0 + f, grid.width);
  const rowCentre = 0.5 * (r0 + r1);
  const colCentre = 0.5 * (c0 + c1);
  let wSum = 0;
  let m1 = 0;
  for (let r = r0; r < r1; r++) {
    for (let c = c0; c < c1; c++) {
      const h = grid.data[r * grid.width + c] as number;
      const w = Number.isNaN(h) ? 0 : weights !== null ? (weights[r * grid.width + c] as number) : 1;
      if (w > 0) {
        wSum += w;
        m1 += w * h;
      }
    }
  }
  const mean = m1 / wSum;
  let v = 0;
  let hx = 0;
  let hy = 0;
  for (let r = r0; r < r1; r++) {
    for (let c = c0; c < c1; c++) {
      const h = grid.data[r * grid.width + c] as number;
      const w = Number.isNaN(h) ? 0 : weights !== null ? (weights[r * grid.width + c] as number) : 1;
      if (!(w > 0)) continue;
      v += w * (h - mean) ** 2;
      hx += w * (h - mean) * (c + 0.5 - colCentre);
      hy += w * (h - mean) * (r + 0.5 - rowCentre);
    }
  }
  return { weight: wSum / ((r1 - r0) * (c1 - c0)), mean, sd: Math.sqrt(v / wSum), covCol: hx / wSum, covRow: hy / wSum };
}

function checkLevels(grid: DemGrid, weights: Float32Array | null, exactCovariances: boolean): number {
  const pyr = buildPyramid(grid, weights ?? undefined);
  let checked = 0;
  for (const lv of pyr.levels) {
    if (lv.level < FIRST_STORED_LEVEL) {
      expect(lv.cells).toBeNull();
      continue;
    }
    const cells = lv.cells as Float32Array;
    expect(cells.length).toBe(lv.width * lv.height * CELL_STRIDE);
    for (let row = 0; row < lv.height; row++) {
      for (let col = 0; col < lv.width; col++) {
        const c = (row * lv.width + col) * CELL_STRIDE;
        const d = direct(grid, weights, lv, row, col);
        const at = `level ${lv.level} cell (${row}, ${col})`;
        // float32 storage of the weight, a fraction 0..1: a few ulps of 1
        assertClose(cells[c + CELL_WEIGHT] as number, d.weight, { abs: 1e-6 }, `${at} weight`);
        if (!(d.weight > 0)) {
          expect(cells[c + CELL_MEAN]).toBeNaN();
          continue;
        }
        // each level rounds its mean (about 500 m) to float32 (6e-8 relative); 13 levels at most
        assertClose(cells[c + CELL_MEAN] as number, d.mean, { rel: 2e-6 }, `${at} mean`);
        // deviations from the parent mean carry the children's float32 means (3e-5 m at 500 m)
        assertClose(cells[c + CELL_SD] as number, d.sd, { abs: 2e-4, rel: 1e-5 }, `${at} sd`);
        const sd = cells[c + CELL_SD] as number;
        if (!exactCovariances || !(sd > 1e-3)) continue;
        // the two-point form keeps the covariances: cov = wUp (up + lo) pUp, unless pUp was clamped to the half cell
        const k = (cells[c + CELL_W_UP] as number) * ((cells[c + CELL_UP_OFFSET] as number) + (cells[c + CELL_LO_OFFSET] as number));
        const halfCol = 0.5 * (Math.min((col + 1) * lv.factor, grid.width) - col * lv.factor);
        const halfRow = 0.5 * (Math.min((row + 1) * lv.factor, grid.height) - row * lv.factor);
        const pCol = cells[c + CELL_P_UP_COL] as number;
        const pRow = cells[c + CELL_P_UP_ROW] as number;
        // float32 moments and two-point values: relative 1e-4 of the covariance scale sd x half cell
        if (Math.abs(pCol) < halfCol * 0.999) assertClose(k * pCol, d.covCol, { abs: 1e-4 * sd * halfCol }, `${at} cov col`);
        if (Math.abs(pRow) < halfRow * 0.999) assertClose(k * pRow, d.covRow, { abs: 1e-4 * sd * halfRow }, `${at} cov row`);
        checked++;
      }
    }
  }
  return checked;
}

describe('pyramid: stored levels against the native heights', () => {
  it('every stored cell of a 37 x 23 grid (odd sizes at every level) matches its footprint, covariances included', () => {
    expect(checkLevels(hills(37, 23, false), null, true)).toBeGreaterThan(80);
  });

  it('every stored cell of a 300 x 171 grid matches its footprint, covariances included', () => {
    expect(checkLevels(hills(300, 171, false), null, true)).toBeGreaterThan(4000);
  });

  it('with nodata and native weights, weights, means and sds match the footprint', () => {
    const grid = hills(129, 67, true);
    const weights = sharedFloat32(grid.width * grid.height);
    for (let i = 0; i < weights.length; i++) weights[i] = ((i * 13) % 10) / 9;
    checkLevels(grid, weights, false);
    checkLevels(hills(129, 67, true), null, false);
  });

  it('one-row and one-column grids build up to one cell, each level matching its footprint', () => {
    for (const [w, h] of [[40, 1], [1, 40], [5, 3]] as const) {
      const pyr = buildPyramid(hills(w, h, false));
      const top = pyr.levels[pyr.levels.length - 1] as PyramidLevel;
      expect([top.width, top.height]).toEqual([1, 1]);
      checkLevels(hills(w, h, false), null, true);
    }
  });
});
