/**
 * Gauss-Legendre nodes and weights on [-1, 1] by Newton iteration on the Legendre recurrence
 * (Golub-Welsch-free textbook method, e.g. Press et al., Numerical Recipes, "gauleg"), used by
 * the tests as an independent numerical integrator (kernels, cap, curvature).
 */
export interface GaussRule {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

export function gaussLegendre(n: number): GaussRule {
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 1;
    for (let iter = 0; iter < 100; iter++) {
      let p1 = 1;
      let p2 = 0;
      for (let j = 1; j <= n; j++) {
        const p3 = p2;
        p2 = p1;
        p1 = ((2 * j - 1) * z * p2 - (j - 1) * p3) / j;
      }
      dp = (n * (z * p1 - p2)) / (z * z - 1);
      const prev = z;
      z = prev - p1 / dp;
      if (Math.abs(z - prev) < 1e-16) break;
    }
    nodes[i] = z;
    weights[i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { nodes, weights };
}

/** ∫_a^b f by `panels` equal panels of the n-point rule. */
export function integrate1d(f: (t: number) => number, a: number, b: number, rule: GaussRule, panels = 1): number {
  const h = (b - a) / panels;
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * h;
    for (let i = 0; i < rule.nodes.length; i++) {
      sum += (rule.weights[i] as number) * f(mid + 0.5 * h * (rule.nodes[i] as number));
    }
  }
  return 0.5 * h * sum;
}

/**
 * Prism geometric factor by an independent route: the exact vertical integral of z / r^3,
 * (1/R1 - 1/R2) in its cancellation-free form, integrated over x and y with panelled Gauss-Legendre. Accurate when the
 * integrand is smooth on the panels (prism not touching the station, or panels split there).
 */
export function prismByQuadrature(
  x1: number,
  x2: number,
  y1: number,
  y2: number,
  z1: number,
  z2: number,
  rule: GaussRule,
  panels = 1,
): number {
  return integrate1d(
    (x) =>
      integrate1d(
        (y) => {
          const s2 = x * x + y * y;
          const r1 = Math.sqrt(s2 + z1 * z1);
          const r2 = Math.sqrt(s2 + z2 * z2);
          return ((z2 - z1) * (z2 + z1)) / (r1 * r2 * (r1 + r2)); // = 1/R1 - 1/R2 without cancellation
        },
        y1,
        y2,
        rule,
        panels,
      ),
    x1,
    x2,
    rule,
    panels,
  );
}
