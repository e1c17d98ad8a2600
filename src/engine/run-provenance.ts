/**
 * Provenance pieces of a run: the DEM records (with sha256) and the formulas in force.
 */
import type { DemGrid } from '../dem/grid.js';
import { meridianRadiusM, primeVerticalRadiusM } from '../terrain/geodesy.js';
import { NORMAL_FORMULAS } from '../reduction/normal-gravity.js';
import { sha256File, type DemProvenance } from '../io/provenance.js';
import type { LoadedDem } from './load-dems.js';
import type { ReduceOptions } from './run-options.js';

/** Largest cell side of a grid in metres near latitude latDeg. */
export function cellSizeM(g: DemGrid, latDeg: number): number {
  if (g.crs.kind === 'projected') return Math.max(g.cellSizeX, g.cellSizeY) * g.crs.linearUnitM;
  const deg = Math.PI / 180;
  return Math.max(g.cellSizeX * deg * primeVerticalRadiusM(latDeg) * Math.cos(latDeg * deg), g.cellSizeY * deg * meridianRadiusM(latDeg));
}

export function meanOf(a: Float64Array, active: Uint8Array): number {
  let s = 0;
  let n = 0;
  for (let i = 0; i < a.length; i++) if (active[i] === 1 && Number.isFinite(a[i] as number)) { s += a[i] as number; n++; }
  return n > 0 ? s / n : 0;
}

export async function demProvenance(role: 'fine' | 'far', d: LoadedDem, latDeg: number): Promise<DemProvenance[]> {
  const out: DemProvenance[] = [];
  for (const s of d.sources) {
    out.push({
      role,
      path: s.path,
      sha256: await sha256File(s.path),
      fileSizeBytes: s.fileSizeBytes,
      width: s.width,
      height: s.height,
      crs: s.crs.label,
      cellSizeX: s.cellSizeX,
      cellSizeY: s.cellSizeY,
      cellSizeM: cellSizeM(d.grid, latDeg),
      windowRead: { width: d.grid.width, height: d.grid.height, originX: d.grid.originX, originY: d.grid.originY },
    });
  }
  return out;
}

/** The formulas a run used, in words, for the provenance record. */
export function runFormulas(o: ReduceOptions): Record<string, string> {
  return {
    normalGravity: NORMAL_FORMULAS.find((f) => f.name === o.normalFormula)?.description ?? o.normalFormula,
    atmospheric: 'Hinze et al. 2005 (after Wenzel 1985): 0.874 - 9.9e-5 h + 3.56e-9 h^2 mGal',
    freeAir: o.freeAirOrder === 2 ? 'second order, Hinze et al. 2005' : 'first order, 0.3086 mGal/m',
    bouguer: o.bouguer === 'cap' ? `spherical cap to ${o.capRadiusM} m, LaFehr 1991` : 'infinite slab 2 pi G rho h',
    terrain: 'Bullard C relative to the spherical cap at station height, Earth curvature included, to --radius',
    ...(o.legacyTcRange ? { terrainRange: 'a second terrain pass over --legacy-tc-range (inside R1 skipped, ends at R2)' } : {}),
  };
}
