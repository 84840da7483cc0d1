/**
 * Convergence diagnostics of several Markov chains of one scalar quantity (Gelman, Carlin, Stern,
 * Dunson, Vehtari, Rubin, Bayesian Data Analysis, 3rd ed., 2013):
 *
 * - split R̂ (§11.4): each chain is cut in half (m = 2·chains sequences of n draws);
 *   B = n/(m−1) Σ (ψ̄_j − ψ̄)², W = mean of the within-sequence variances s_j²,
 *   var⁺ = (n−1)/n W + B/n, R̂ = √(var⁺/W). Near 1 when the chains have mixed (BDA suggests < 1.1).
 * - effective sample size (§11.5, eqs. 11.7–11.8): V_t = 1/(m(n−t)) Σ_j Σ_i (ψ_{i,j} − ψ_{i−t,j})²,
 *   ρ̂_t = 1 − V_t/(2 var⁺), n_eff = mn/(1 + 2 Σ_{t=1}^{T} ρ̂_t), where T is the first odd t at which
 *   ρ̂_{t+1} + ρ̂_{t+2} < 0 (the sum stops before the estimated autocorrelations turn to noise).
 */

export interface ChainDiagnostics {
  /** split R̂ */
  rhat: number;
  /** effective number of independent draws over all chains */
  ess: number;
}

/** `chains[j][i]`: draw i of chain j (equal lengths, at least 4 draws each). */
export function chainDiagnostics(chains: readonly Float64Array[]): ChainDiagnostics {
  const half = Math.floor(chains[0].length / 2);
  if (chains.length < 1 || half < 2) throw new RangeError('chainDiagnostics: needs at least one chain of 4 draws');
  // split sequences: first and second half of every chain (an odd middle draw is dropped)
  const seqs: Float64Array[] = [];
  for (const c of chains) {
    if (Math.floor(c.length / 2) !== half) throw new RangeError('chainDiagnostics: chains must have equal lengths');
    seqs.push(c.subarray(0, half), c.subarray(c.length - half));
  }
  const m = seqs.length;
  const n = half;
  const means = seqs.map((s) => s.reduce((a, b) => a + b, 0) / n);
  const grand = means.reduce((a, b) => a + b, 0) / m;
  let B = 0;
  for (const mu of means) B += (mu - grand) * (mu - grand);
  B *= n / (m - 1);
  let W = 0;
  for (let j = 0; j < m; j++) {
    let ss = 0;
    for (let i = 0; i < n; i++) ss += (seqs[j][i] - means[j]) ** 2;
    W += ss / (n - 1);
  }
  W /= m;
  const varPlus = ((n - 1) / n) * W + B / n;
  if (!(varPlus > 0)) return { rhat: 1, ess: m * n }; // a constant quantity: nothing to mix
  const rhat = W > 0 ? Math.sqrt(varPlus / W) : Infinity;
  const rho = (t: number): number => {
    let v = 0;
    for (const s of seqs) for (let i = t; i < n; i++) v += (s[i] - s[i - t]) ** 2;
    v /= m * (n - t);
    return 1 - v / (2 * varPlus);
  };
  let sum = 0;
  let t = 1;
  let rt = rho(1);
  for (; t < n - 2; t += 2) {
    const r1 = rho(t + 1);
    const r2 = rho(t + 2);
    sum += rt;
    if (r1 + r2 < 0) break;
    sum += r1;
    rt = r2;
  }
  const ess = (m * n) / (1 + 2 * sum);
  return { rhat, ess };
}
