/**
 * Gauss–Hermite quadrature for the standard normal weight: Σ wᵢ f(uᵢ) ≈ E[f(U)], U ~ N(0,1).
 *
 * Nodes are the zeros of Hₙ (weight e^{−x²}), found by scanning the orthonormal recurrence
 * for sign changes and refining each by bisection + Newton; weights are the Christoffel
 * numbers 1/Σ_{j<n} p̃ⱼ(x)² (Golub & Welsch 1969 relation). Then u = √2 x, w ← w/√π.
 */
const cache = new Map<number, { nodes: Float64Array; weights: Float64Array }>();

/** Orthonormal Hermite value p̃ₙ(x) and Σ_{j<n} p̃ⱼ(x)². */
function orthonormalHermite(n: number, x: number): { pn: number; sumSquares: number } {
  let prev = 0;
  let curr = Math.pow(Math.PI, -0.25);
  let sumSquares = 0;
  for (let j = 0; j < n; j++) {
    sumSquares += curr * curr;
    const next = x * Math.sqrt(2 / (j + 1)) * curr - Math.sqrt(j / (j + 1)) * prev;
    prev = curr;
    curr = next;
  }
  return { pn: curr, sumSquares };
}

export function gaussHermiteNormal(n: number): { nodes: Float64Array; weights: Float64Array } {
  const cached = cache.get(n);
  if (cached) return cached;
  if (!Number.isInteger(n) || n < 1 || n > 200) throw new Error(`gaussHermiteNormal: n must be 1..200, got ${n}`);
  const roots: number[] = [];
  const limit = Math.sqrt(2 * n + 1) + 0.5; // all zeros of Hₙ lie inside ±√(2n+1)
  const steps = 400 * n;
  const h = (2 * limit) / steps;
  let xa = -limit;
  let fa = orthonormalHermite(n, xa).pn;
  for (let s = 1; s <= steps; s++) {
    const xb = -limit + s * h;
    const fb = orthonormalHermite(n, xb).pn;
    if (fb === 0) {
      roots.push(xb);
    } else if (fa * fb < 0) {
      let lo = xa;
      let hi = xb;
      let flo = fa;
      for (let k = 0; k < 200 && hi - lo > 1e-16 * Math.max(1, Math.abs(lo)); k++) {
        const mid = 0.5 * (lo + hi);
        const fm = orthonormalHermite(n, mid).pn;
        if (fm === 0) { lo = hi = mid; break; }
        if (flo * fm < 0) hi = mid;
        else { lo = mid; flo = fm; }
      }
      roots.push(0.5 * (lo + hi));
    }
    xa = xb;
    fa = fb;
  }
  if (roots.length !== n) throw new Error(`gaussHermiteNormal: found ${roots.length} of ${n} nodes`);
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    nodes[i] = Math.SQRT2 * roots[i];
    weights[i] = 1 / orthonormalHermite(n, roots[i]).sumSquares / Math.sqrt(Math.PI);
  }
  // symmetrize: the exact rule is symmetric, so average the mirrored pairs
  for (let i = 0; i < n >> 1; i++) {
    const j = n - 1 - i;
    const u = 0.5 * (nodes[j] - nodes[i]);
    const w = 0.5 * (weights[i] + weights[j]);
    nodes[i] = -u; nodes[j] = u;
    weights[i] = w; weights[j] = w;
  }
  if (n % 2 === 1) nodes[n >> 1] = 0;
  const result = { nodes, weights };
  cache.set(n, result);
  return result;
}
