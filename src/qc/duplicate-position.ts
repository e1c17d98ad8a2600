/**
 * duplicate_position: two or more stations within a horizontal tolerance of each other (a
 * station entered twice, or a reoccupation under a new id). Hashing on cells of the tolerance
 * size and checking the 3 x 3 block around each station: O(n) expected.
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
  const cell = toleranceM > 0 ? toleranceM : 1;
  const buckets = new Map<string, number[]>();
  const key = (ix: number, iy: number): string => `${ix},${iy}`;
  for (let i = 0; i < n; i++) {
    const x = xM[i] as number, y = yM[i] as number;
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    const k = key(Math.floor(x / cell), Math.floor(y / cell));
    const b = buckets.get(k);
    if (b) b.push(i);
    else buckets.set(k, [i]);
  }
  const tol2 = toleranceM * toleranceM;
  for (let i = 0; i < n; i++) {
    const x = xM[i] as number, y = yM[i] as number;
    if (!Number.isFinite(x) || !Number.isFinite(y) || flags[i]) continue;
    const ix = Math.floor(x / cell), iy = Math.floor(y / cell);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        for (const j of buckets.get(key(ix + dx, iy + dy)) ?? []) {
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
