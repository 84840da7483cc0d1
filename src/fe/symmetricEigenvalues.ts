/**
 * All eigenvalues of a dense real symmetric matrix: Householder reduction to tridiagonal form, then the
 * implicit QL algorithm with Wilkinson-type shifts (Wilkinson & Reinsch, Handbook for Automatic
 * Computation II, 1971, tred2/tql2; as in Press et al., Numerical Recipes, §11.2–11.3).
 * a: n×n row-major, destroyed. Returns the eigenvalues in increasing order.
 */
export function symmetricEigenvalues(a: Float64Array, n: number): Float64Array {
  if (a.length !== n * n) throw new Error('symmetricEigenvalues: matrix size mismatch');
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  tridiagonalize(a, n, d, e);
  tridiagonalQL(d, e, n);
  return d.sort();
}

function tridiagonalize(a: Float64Array, n: number, d: Float64Array, e: Float64Array): void {
  for (let i = n - 1; i > 0; i--) {
    const l = i - 1;
    let h = 0;
    if (l > 0) {
      let scale = 0;
      for (let k = 0; k <= l; k++) scale += Math.abs(a[i * n + k]);
      if (scale === 0) {
        e[i] = a[i * n + l];
      } else {
        for (let k = 0; k <= l; k++) {
          a[i * n + k] /= scale;
          h += a[i * n + k] * a[i * n + k];
        }
        let f = a[i * n + l];
        let g = f >= 0 ? -Math.sqrt(h) : Math.sqrt(h);
        e[i] = scale * g;
        h -= f * g;
        a[i * n + l] = f - g;
        f = 0;
        for (let j = 0; j <= l; j++) {
          g = 0;
          for (let k = 0; k <= j; k++) g += a[j * n + k] * a[i * n + k];
          for (let k = j + 1; k <= l; k++) g += a[k * n + j] * a[i * n + k];
          e[j] = g / h;
          f += e[j] * a[i * n + j];
        }
        const hh = f / (h + h);
        for (let j = 0; j <= l; j++) {
          f = a[i * n + j];
          g = e[j] - hh * f;
          e[j] = g;
          for (let k = 0; k <= j; k++) a[j * n + k] -= f * e[k] + g * a[i * n + k];
        }
      }
    } else {
      e[i] = a[i * n + l];
    }
    d[i] = h;
  }
  e[0] = 0;
  for (let i = 0; i < n; i++) d[i] = a[i * n + i];
}

function tridiagonalQL(d: Float64Array, e: Float64Array, n: number): void {
  for (let i = 1; i < n; i++) e[i - 1] = e[i];
  if (n > 0) e[n - 1] = 0;
  const EPS = 2.220446049250313e-16;
  for (let l = 0; l < n; l++) {
    let iter = 0;
    let m: number;
    do {
      for (m = l; m < n - 1; m++) {
        const dd = Math.abs(d[m]) + Math.abs(d[m + 1]);
        if (Math.abs(e[m]) <= EPS * dd) break;
      }
      if (m !== l) {
        if (iter++ === 60) throw new Error('symmetricEigenvalues: QL did not converge');
        let g = (d[l + 1] - d[l]) / (2 * e[l]);
        let r = Math.hypot(g, 1);
        g = d[m] - d[l] + e[l] / (g + (g >= 0 ? r : -r));
        let s = 1;
        let c = 1;
        let p = 0;
        let i: number;
        for (i = m - 1; i >= l; i--) {
          let f = s * e[i];
          const b = c * e[i];
          r = Math.hypot(f, g);
          e[i + 1] = r;
          if (r === 0) {
            d[i + 1] -= p;
            e[m] = 0;
            break;
          }
          s = f / r;
          c = g / r;
          g = d[i + 1] - p;
          r = (d[i] - g) * s + 2 * c * b;
          p = s * r;
          d[i + 1] = g + p;
          g = c * r - b;
        }
        if (r === 0 && i >= l) continue;
        d[l] -= p;
        e[l] = g;
        e[m] = 0;
      }
    } while (m !== l);
  }
}
