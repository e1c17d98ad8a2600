/**
 * Earth curvature: a station on a lowland ringed by a plateau from 30 km to beyond 166.7 km.
 * Reference: an independent numerical integration on the sphere written here (nested
 * Gauss-Legendre over angular distance psi and radius r of the point-mass kernel of the
 * spherical shell segment between the station's sphere and the plateau top), not the
 * engine's code path. physics.md §5: ignoring curvature errs by about pi G rho dh (d2-d1)/R.
 */
import { describe, expect, it } from 'vitest';
import { assertClose } from '../helpers/assert-close.js';
import { contextFor, runStation, squareGrid } from '../helpers/synthetic-grid.js';
import { TR } from '../../src/terrain/station-terrain.js';
import { G, EARTH_RADIUS_M, CAP_RADIUS_M } from '../../src/constants.js';
import { gaussLegendre } from '../helpers/gauss-legendre.js';

const RHO = 2670;
const TO_MGAL = 1e5;

/** TC (mGal) of the shell segment rs..R0+H for psi in [psi1, psi2], full azimuth, on the sphere. */
function sphericalShellTc(stationH: number, plateauH: number, d1: number, d2: number): number {
  const rs = EARTH_RADIUS_M + stationH;
  const rTop = EARTH_RADIUS_M + plateauH;
  const rule = gaussLegendre(12);
  const gx = rule.nodes;
  const gw = rule.weights;
  const psi1 = d1 / EARTH_RADIUS_M;
  const psi2 = d2 / EARTH_RADIUS_M;
  const segs = 400;
  let g = 0;
  for (let s = 0; s < segs; s++) {
    const a = psi1 + ((psi2 - psi1) * s) / segs;
    const b = psi1 + ((psi2 - psi1) * (s + 1)) / segs;
    for (let i = 0; i < gx.length; i++) {
      const psi = 0.5 * (a + b) + 0.5 * (b - a) * (gx[i] as number);
      const wpsi = 0.5 * (b - a) * (gw[i] as number);
      const c = Math.cos(psi);
      for (let j = 0; j < gx.length; j++) {
        const r = 0.5 * (rs + rTop) + 0.5 * (rTop - rs) * (gx[j] as number);
        const wr = 0.5 * (rTop - rs) * (gw[j] as number);
        const L = Math.sqrt(rs * rs + r * r - 2 * rs * r * c);
        g += wpsi * wr * r * r * Math.sin(psi) * (rs - r * c) / (L * L * L);
      }
    }
  }
  // downward attraction of the plateau mass (2 pi from the azimuth); TC = minus it
  return -2 * Math.PI * G * RHO * g * TO_MGAL;
}

describe('Earth curvature in the far zones', () => {
  it('a plateau ring from 30 km to beyond the cap radius: engine within 1 % of the spherical integral', () => {
    const cell = 500;
    const r1 = 30000;
    const stationH = 100;
    const plateauH = 1100;
    const grid = squareGrid(720, cell, (x, y) => (Math.hypot(x, y) >= r1 ? plateauH : stationH));
    const ctx = contextFor(grid, null, { radiusM: CAP_RADIUS_M });
    const r = runStation(ctx, 0, 0, stationH);
    const engine = (r[TR.tcUnitMgal] as number) * (RHO / 1000);
    const sphere = sphericalShellTc(stationH, plateauH, r1, CAP_RADIUS_M);
    // Flat earth (no curvature): Hammer's ring formula [Hammer1939] for the same annulus.
    const h = plateauH - stationH;
    const flat = G * RHO * 2 * Math.PI * (CAP_RADIUS_M - r1 + Math.hypot(r1, h) - Math.hypot(CAP_RADIUS_M, h)) * TO_MGAL;
    process.stdout.write(`  plateau ring: engine ${engine.toFixed(4)} mGal, sphere ${sphere.toFixed(4)} mGal, flat earth ${flat.toFixed(4)} mGal\n`);
    // 1 % (the target): the ring's inner edge is a 500 m staircase.
    assertClose(engine, sphere, { rel: 0.01 }, 'curved plateau TC');
    // The flat-earth value is off by about pi G rho dh (d2 - d1)/R = 1.22 mGal here (physics.md §5).
    const predictedFlatError = Math.PI * G * RHO * h * (CAP_RADIUS_M - r1) / EARTH_RADIUS_M * TO_MGAL;
    expect(Math.abs(flat - sphere)).toBeGreaterThan(0.8 * predictedFlatError);
    expect(r[TR.coverage]).toBe(1);
  });
});
