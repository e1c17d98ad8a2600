import { describe, it, expect } from 'vitest';
import { createNeumaierState, neumaierAdd, neumaierReset, neumaierResult } from '../../src/kernels/compensated-sum.js';
import { sumPrismsGzFactor } from '../../src/kernels/prism-batch.js';
import { prismGzFactor } from '../../src/kernels/prism.js';
import { assertClose } from '../helpers/assert-close.js';
import { makeUniform } from '../helpers/seeded-random.js';

describe('Neumaier accumulator', () => {
  it('recovers the small terms that plain summation drops: [1, 1e100, 1, -1e100] → 2', () => {
    // Classic example for Neumaier's improvement over Kahan [Neumaier1974]; exact in binary.
    const state = createNeumaierState();
    for (const v of [1, 1e100, 1, -1e100]) neumaierAdd(state, v);
    expect(neumaierResult(state)).toBe(2);
    let plain = 0;
    for (const v of [1, 1e100, 1, -1e100]) plain += v;
    expect(plain).toBe(0);
    neumaierReset(state);
    expect(neumaierResult(state)).toBe(0);
  });

  it('sums 1e6 copies of 0.1 to the correctly rounded 100000 (error ≤ 1 ulp)', () => {
    // Exact value: 1e6 * double(0.1) = 100000.0000000000055511151231257827; nearest double 1e5.
    const state = createNeumaierState();
    for (let i = 0; i < 1_000_000; i++) neumaierAdd(state, 0.1);
    expect(neumaierResult(state)).toBe(100000);
  });
});

describe('sumPrismsGzFactor', () => {
  const n = 500;
  const uniform = makeUniform(99);
  const arrays = [0, 1, 2, 3, 4, 5].map(() => new Float64Array(n + 3)); // longer than count on purpose
  const [x1, x2, y1, y2, z1, z2] = arrays as [Float64Array, Float64Array, Float64Array, Float64Array, Float64Array, Float64Array];
  const weights = new Float64Array(n + 3);
  for (let i = 0; i < n + 3; i++) {
    x1[i] = -500 + 1000 * uniform();
    x2[i] = (x1[i] as number) + 1 + 30 * uniform();
    y1[i] = -500 + 1000 * uniform();
    y2[i] = (y1[i] as number) + 1 + 30 * uniform();
    z1[i] = -100 + 200 * uniform();
    z2[i] = (z1[i] as number) + 50 * uniform();
    weights[i] = 0.5 + uniform();
  }

  it('equals the compensated sum of single prisms, weighted or not, honouring count', () => {
    const plain = createNeumaierState();
    const weighted = createNeumaierState();
    for (let i = 0; i < n; i++) {
      const f = prismGzFactor(x1[i] as number, x2[i] as number, y1[i] as number, y2[i] as number, z1[i] as number, z2[i] as number);
      neumaierAdd(plain, f);
      neumaierAdd(weighted, f * (weights[i] as number));
    }
    // Same terms, same compensated algorithm: bit-identical.
    expect(sumPrismsGzFactor(x1, x2, y1, y2, z1, z2, n)).toBe(neumaierResult(plain));
    expect(sumPrismsGzFactor(x1, x2, y1, y2, z1, z2, n, weights)).toBe(neumaierResult(weighted));
    expect(sumPrismsGzFactor(x1, x2, y1, y2, z1, z2, 0)).toBe(0);
  });

  it('is independent of summation order to rounding (compensated): reversed arrays agree to 1e-15', () => {
    const rev = arrays.map((a) => a.slice(0, n).reverse());
    const [a, b, c, d, e, f] = rev as [Float64Array, Float64Array, Float64Array, Float64Array, Float64Array, Float64Array];
    const forward = sumPrismsGzFactor(x1, x2, y1, y2, z1, z2, n);
    // Neumaier's error bound is ~2 ulp of the total plus n ulp^2 of the term sizes: 1e-15.
    assertClose(sumPrismsGzFactor(a, b, c, d, e, f, n), forward, { rel: 1e-15 });
  });
});
