/**
 * A uniform grid over 2-D points for neighbour searches: points bucketed by cell with a
 * counting sort (two flat arrays, no per-cell objects). Points with a non-finite coordinate
 * are left out of the index.
 */

export interface GridIndex {
  minX: number;
  minY: number;
  /** Cell side, same unit as the coordinates. */
  cellSize: number;
  nx: number;
  ny: number;
  /** Points of cell c are order[start[c] .. start[c + 1]). */
  start: Int32Array;
  order: Int32Array;
}

/** Builds a grid with about `perCell` points per occupied cell on average for spread data. */
export function buildGridIndex(x: ArrayLike<number>, y: ArrayLike<number>, perCell = 2): GridIndex {
  const n = x.length;
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity, count = 0;
  for (let i = 0; i < n; i++) {
    const xi = x[i] as number, yi = y[i] as number;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) continue;
    count++;
    if (xi < minX) minX = xi;
    if (xi > maxX) maxX = xi;
    if (yi < minY) minY = yi;
    if (yi > maxY) maxY = yi;
  }
  if (count === 0) return { minX: 0, minY: 0, cellSize: 1, nx: 1, ny: 1, start: new Int32Array(2), order: new Int32Array(0) };
  const w = maxX - minX, h = maxY - minY;
  let cell = Math.sqrt((Math.max(w, 1e-9) * Math.max(h, 1e-9) * perCell) / count);
  if (!(cell > 0)) cell = 1;
  // keep the cell count near the point count even for long thin surveys
  cell = Math.max(cell, Math.max(w, h) / Math.max(1, 4 * count), 1e-9);
  while (((Math.floor(w / cell) + 1) * (Math.floor(h / cell) + 1)) > 4 * count + 16) cell *= 1.5;
  const nx = Math.floor(w / cell) + 1, ny = Math.floor(h / cell) + 1;
  const cellOf = new Int32Array(n);
  const start = new Int32Array(nx * ny + 1);
  for (let i = 0; i < n; i++) {
    const xi = x[i] as number, yi = y[i] as number;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) {
      cellOf[i] = -1;
      continue;
    }
    const c = Math.min(ny - 1, Math.floor((yi - minY) / cell)) * nx + Math.min(nx - 1, Math.floor((xi - minX) / cell));
    cellOf[i] = c;
    start[c + 1] = (start[c + 1] as number) + 1;
  }
  for (let c = 0; c < nx * ny; c++) start[c + 1] = (start[c + 1] as number) + (start[c] as number);
  const fill = start.slice(0, nx * ny);
  const order = new Int32Array(count);
  for (let i = 0; i < n; i++) {
    const c = cellOf[i] as number;
    if (c < 0) continue;
    order[fill[c] as number] = i;
    fill[c] = (fill[c] as number) + 1;
  }
  return { minX, minY, cellSize: cell, nx, ny, start, order };
}
