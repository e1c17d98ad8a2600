/**
 * Kernel throughput: ns per call for the prism, line element, 2x2 Gauss line elements and the
 * radial column, over 1e6 station-relative random inputs each (pre-generated into flat typed
 * arrays so the timing is the kernel only), after a warm-up pass.
 * Run: node --import tsx test/bench/kernels.bench.ts
 */
import { prismGzFactor } from '../../src/kernels/prism.js';
import { sumPrismsGzFactor } from '../../src/kernels/prism-batch.js';
import { lineElementGzFactor, lineElementGauss2x2GzFactor } from '../../src/kernels/line-element.js';
import { radialColumnGzFactor } from '../../src/kernels/radial-column.js';
import { pointMassGzFactor } from '../../src/kernels/point-mass.js';

const N = 1_000_000;
const ROUNDS = 5;
let state = 12345;
const uniform = (): number => {
  state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
  return state / 4294967296;
};

// 30 m cells within 20 km of the station, terrain -500..1500 m relative to it.
const cx = new Float64Array(N);
const cy = new Float64Array(N);
const top = new Float64Array(N);
const bottom = new Float64Array(N);
const x1 = new Float64Array(N);
const x2 = new Float64Array(N);
const y1 = new Float64Array(N);
const y2 = new Float64Array(N);
const dist = new Float64Array(N);
const cosPsi = new Float64Array(N);
const r1 = new Float64Array(N);
const r2 = new Float64Array(N);
const R = 6_371_000;
for (let i = 0; i < N; i++) {
  cx[i] = -20_000 + 40_000 * uniform();
  cy[i] = -20_000 + 40_000 * uniform();
  x1[i] = (cx[i] as number) - 15;
  x2[i] = (cx[i] as number) + 15;
  y1[i] = (cy[i] as number) - 15;
  y2[i] = (cy[i] as number) + 15;
  top[i] = -1500 + 1000 * uniform();
  bottom[i] = 0;
  dist[i] = Math.hypot(cx[i] as number, cy[i] as number);
  cosPsi[i] = Math.cos(1e-3 + 0.025 * uniform()); // 6 to 166 km
  r1[i] = R;
  r2[i] = R + 2000 * uniform();
}

function time(name: string, body: () => number): number {
  body(); // warm-up: lets the optimising compiler settle
  let best = Infinity;
  let sink = 0;
  for (let k = 0; k < ROUNDS; k++) {
    const t0 = process.hrtime.bigint();
    sink += body();
    const ns = Number(process.hrtime.bigint() - t0) / N;
    best = Math.min(best, ns);
  }
  process.stdout.write(`${name.padEnd(34)} ${best.toFixed(1).padStart(7)} ns/call  (checksum ${sink.toExponential(3)})\n`);
  return best;
}

const tPrism = time('prism (closed form)', () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += prismGzFactor(x1[i]!, x2[i]!, y1[i]!, y2[i]!, top[i]!, bottom[i]!);
  return s;
});
time('prism batch (Neumaier)', () => sumPrismsGzFactor(x1, x2, y1, y2, top, bottom, N));
const tLine = time('line element', () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += lineElementGzFactor(900, dist[i]!, top[i]!, bottom[i]!);
  return s;
});
const tGauss = time('2x2 Gauss line elements', () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += lineElementGauss2x2GzFactor(30, 30, cx[i]!, cy[i]!, top[i]!, bottom[i]!);
  return s;
});
time('point mass', () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += pointMassGzFactor(cx[i]!, cy[i]!, top[i]!);
  return s;
});
const tRadial = time('radial column (closed form)', () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += radialColumnGzFactor(2.2e-11, R + 500, r1[i]!, r2[i]!, cosPsi[i]!);
  return s;
});
process.stdout.write(
  `ratios to the prism: line ${(tPrism / tLine).toFixed(1)}x, 2x2 Gauss ${(tPrism / tGauss).toFixed(1)}x, radial ${(tPrism / tRadial).toFixed(1)}x faster\n`,
);
