/**
 * duplicate_position: two or more stations within a horizontal tolerance of each other (a
 * station entered twice, or a reoccupation under a new id). Hashing on cells of the tolerance
 * size (a Map from cell to a chain through one Int32Array) and checking the 3 x 3 block
 * around each station: O(n) expected, no per-cell arrays.
 */

/**
 * One flag per station: true when another station lies within toleranceM (distance <= tol).
 * Coordinates in metres. toleranceM = 0 flags exact coincidences only. Non-finite positions
 * never flag.
 */
export function duplicatePositionFlags(xM: ArrayLike<number>, yM: ArrayLike<number>, toleranceM: number): boolean[] {
  if (!(toleranceM >= 0)) throw new RangeError(`duplicatePositionFlags: toleranceM must be >= 0, got ${toleranceM}`);
  const n = xM.length;
  const flags = new Array<boolean>(n).fill(false);
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = xM[i] as number, y = yM[i] as number;
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  if (!(maxX >= minX)) return flags;
  // cell side: the tolerance, enlarged if needed so that cell numbers stay exact integers
  let cell = toleranceM > 0 ? toleranceM : Math.max(maxX - minX, maxY - minY, 1) * 1e-9;
  while (((maxX - minX) / cell + 3) * ((maxY - minY) / cell + 3) > 2 ** 52) cell *= 2;
  const rowLen = Math.floor((maxY - minY) / cell) + 3;
  const cellKey = (ix: number, iy: number): number => ix * rowLen + iy;
  const head = new Map<number, number>();
  const next = new Int32Array(n).fill(-1);
  const cx = new Float64Array(n), cy = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = xM[i] as number, y = yM[i] as number;
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    cx[i] = Math.floor((x - minX) / cell) + 1;
    cy[i] = Math.floor((y - minY) / cell) + 1;
    const key = cellKey(cx[i] as number, cy[i] as number);
    const h = head.get(key);
    if (h !== undefined) next[i] = h;
    head.set(key, i);
  }
  const tol2 = toleranceM * toleranceM;
  for (let i = 0; i < n; i++) {
    const x = xM[i] as number, y = yM[i] as number;
    if (!Number.isFinite(x) || !Number.isFinite(y) || flags[i]) continue;
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        for (let j = head.get(cellKey((cx[i] as number) + dx, (cy[i] as number) + dy)) ?? -1; j >= 0; j = next[j] as number) {
          if (j === i) continue;
          const ex = (xM[j] as number) - x, ey = (yM[j] as number) - y;
          if (ex * ex + ey * ey <= tol2) {
            flags[i] = true;
            flags[j] = true;
          }
        }
      }
    }
  }
  return flags;
}
