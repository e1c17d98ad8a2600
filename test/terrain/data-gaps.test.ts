/**
 * Gaps in the DEM: nodata_near is raised for a gap within the inner zone (Hammer zone F,
 * 894.9 m) and not for one kilometres away, which lowers the coverage and raises dem_partial
 * instead; a fully covered disc reports coverage exactly 1.
 */
import { describe, expect, it } from 'vitest';
import { contextFor, runStation, squareGrid } from '../helpers/synthetic-grid.js';
import { TR, TERRAIN_FLAG } from '../../src/terrain/station-terrain.js';

const CELL = 30;

/** A 60 km grid of gentle hills with a square gap of side `side` m centred `atM` m east of the origin. */
function gridWithGap(side: number, atM: number) {
  return squareGrid(2000, CELL, (x, y) =>
    Math.abs(x - atM) < side / 2 && Math.abs(y) < side / 2 ? NaN : 500 + 100 * Math.sin(x / 3000) * Math.cos(y / 5000),
  );
}

function flagsAndCoverage(side: number, atM: number): [number, number] {
  const ctx = contextFor(gridWithGap(side, atM), null, { radiusM: 25000 });
  const r = runStation(ctx, 15, 15, 500);
  return [r[TR.flags] as number, r[TR.coverage] as number];
}

describe('terrain engine: DEM gaps', () => {
  it('a 60 m gap 600 m from the station raises nodata_near', () => {
    const [flags] = flagsAndCoverage(60, 600);
    expect(flags & TERRAIN_FLAG.nodata_near).toBe(TERRAIN_FLAG.nodata_near);
  });

  it('a 1.5 km gap 8 km away lowers the coverage and raises dem_partial, not nodata_near', () => {
    const [flags, coverage] = flagsAndCoverage(1500, 8000);
    expect(flags & TERRAIN_FLAG.nodata_near).toBe(0);
    expect(flags & TERRAIN_FLAG.dem_partial).toBe(TERRAIN_FLAG.dem_partial);
    expect(coverage).toBeLessThan(1);
  });

  it('a 6 km gap 20 km away lowers the coverage by more than 1 %, without nodata_near', () => {
    // the gap is 36 km^2 of the 1963 km^2 disc (1.8 %); the sampled fraction is close to it
    const [flags, coverage] = flagsAndCoverage(6000, 20000);
    expect(flags & TERRAIN_FLAG.nodata_near).toBe(0);
    expect(coverage).toBeLessThan(0.99);
    expect(coverage).toBeGreaterThan(0.95);
  });

  it('without a gap the coverage is exactly 1 and no flag is raised', () => {
    const [flags, coverage] = flagsAndCoverage(0, 0);
    expect(coverage).toBe(1);
    expect(flags).toBe(0);
  });
});
