/**
 * The far-zone DEM takes over only where the fine DEM has no data: each far native cell gets
 * the weight 1 - (fraction of it covered by valid fine-DEM cells). The fraction is sampled on
 * 4 x 4 points per far cell; the points are mapped into the fine DEM's CRS through the cell
 * corners' transformed positions (one CRS transform per far-grid node, then bilinear
 * interpolation inside each cell: the transform is smooth on the scale of one far cell).
 */
import type { DemGrid } from '../dem/grid.js';
import { sharedFloat32 } from '../dem/grid.js';

/** Maps a point of the far grid's CRS to the fine grid's CRS. */
export type CrsMap = (x: number, y: number) => [number, number];

const SUB = 4;

export function farWeights(far: DemGrid, fine: DemGrid, toFine: CrsMap): Float32Array {
  const W = far.width;
  const H = far.height;
  // transformed grid nodes (W + 1) x (H + 1)
  const nodeX = new Float64Array((W + 1) * (H + 1));
  const nodeY = new Float64Array((W + 1) * (H + 1));
  for (let r = 0; r <= H; r++) {
    const y = far.originY - r * far.cellSizeY;
    for (let c = 0; c <= W; c++) {
      const x = far.originX + c * far.cellSizeX;
      let p: [number, number];
      try {
        p = toFine(x, y);
      } catch {
        p = [NaN, NaN];
      }
      nodeX[r * (W + 1) + c] = p[0];
      nodeY[r * (W + 1) + c] = p[1];
    }
  }
  const weight = sharedFloat32(W * H);
  for (let r = 0; r < H; r++) {
    for (let c = 0; c < W; c++) {
      const i00 = r * (W + 1) + c;
      const i01 = i00 + 1;
      const i10 = i00 + W + 1;
      const i11 = i10 + 1;
      let covered = 0;
      for (let a = 0; a < SUB; a++) {
        const v = (a + 0.5) / SUB;
        for (let b = 0; b < SUB; b++) {
          const u = (b + 0.5) / SUB;
          const x =
            (1 - v) * ((1 - u) * (nodeX[i00] as number) + u * (nodeX[i01] as number)) +
            v * ((1 - u) * (nodeX[i10] as number) + u * (nodeX[i11] as number));
          const y =
            (1 - v) * ((1 - u) * (nodeY[i00] as number) + u * (nodeY[i01] as number)) +
            v * ((1 - u) * (nodeY[i10] as number) + u * (nodeY[i11] as number));
          const col = Math.floor((x - fine.originX) / fine.cellSizeX);
          const row = Math.floor((fine.originY - y) / fine.cellSizeY);
          if (col >= 0 && row >= 0 && col < fine.width && row < fine.height && !Number.isNaN(fine.data[row * fine.width + col] as number)) {
            covered++;
          }
        }
      }
      weight[r * W + c] = 1 - covered / (SUB * SUB);
    }
  }
  return weight;
}
