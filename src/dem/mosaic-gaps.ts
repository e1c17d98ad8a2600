/**
 * Where the tiles of a mosaic leave holes: the cells of the output grid that no tile's extent
 * covers, found with rectangle geometry (no per-cell mask), described as rectangles in CRS units.
 */
import type { CellRange } from './window.js';

export interface GapReport {
  /** Cells of the output grid outside every tile. */
  uncoveredCells: number;
  /** Uncovered rectangles as cell ranges of the output grid (row 0 north). */
  rects: CellRange[];
}

function sortedUnique(v: number[]): number[] {
  return [...new Set(v)].sort((a, b) => a - b);
}

/** Uncovered parts of [0,width) × [0,height) given tile ranges in the same cell indices. */
export function findGaps(width: number, height: number, tiles: readonly CellRange[]): GapReport {
  const clip = (r: CellRange): CellRange => ({
    col0: Math.max(0, r.col0), col1: Math.min(width, r.col1), row0: Math.max(0, r.row0), row1: Math.min(height, r.row1),
  });
  const rs = tiles.map(clip).filter((r) => r.col1 > r.col0 && r.row1 > r.row0);
  const xs = sortedUnique([0, width, ...rs.flatMap((r) => [r.col0, r.col1])]);
  const ys = sortedUnique([0, height, ...rs.flatMap((r) => [r.row0, r.row1])]);
  // runs of uncovered compressed columns in each compressed row, then merge equal runs downwards
  let open: CellRange[] = [];
  const rects: CellRange[] = [];
  let uncoveredCells = 0;
  for (let j = 0; j + 1 < ys.length; j++) {
    const y0 = ys[j] as number;
    const y1 = ys[j + 1] as number;
    const runs: CellRange[] = [];
    for (let i = 0; i + 1 < xs.length; i++) {
      const x0 = xs[i] as number;
      const x1 = xs[i + 1] as number;
      const covered = rs.some((r) => r.col0 <= x0 && x1 <= r.col1 && r.row0 <= y0 && y1 <= r.row1);
      if (covered) continue;
      uncoveredCells += (x1 - x0) * (y1 - y0);
      const last = runs[runs.length - 1];
      if (last !== undefined && last.col1 === x0) last.col1 = x1;
      else runs.push({ col0: x0, col1: x1, row0: y0, row1: y1 });
    }
    const next: CellRange[] = [];
    for (const run of runs) {
      const above = open.find((o) => o.col0 === run.col0 && o.col1 === run.col1 && o.row1 === run.row0);
      if (above !== undefined) {
        above.row1 = run.row1;
        next.push(above);
      } else next.push(run);
    }
    for (const o of open) if (!next.includes(o)) rects.push(o);
    open = next;
  }
  rects.push(...open);
  return { uncoveredCells, rects };
}
