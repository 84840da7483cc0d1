import { describe, expect, it } from 'vitest';
import { criticalLoad, criticalPhi } from '../../src/mechanics/criticalLoad.js';
import type { EndRestraint, Frame } from '../../src/mechanics/types.js';

const PI = Math.PI;
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const K = (frame: Frame, r: EndRestraint, mode = 1): number => criticalLoad(1, 1, frame, r, mode).K;
const phi = (frame: Frame, r: EndRestraint, mode = 1): number => criticalPhi(frame, r, mode);

describe('ideal end conditions', () => {
  // source: Timoshenko & Gere, Theory of Elastic Stability, 2nd ed. 1961, ch. 2 (from memory); Chen & Lui 1987 §2.2; values verified in docs/verification.md §M1 [V]
  it('gives the classical effective length factors', () => {
    expect(rel(K('braced', { bottom: 0, top: 0 }), 1)).toBeLessThan(1e-12); // pinned–pinned
    expect(rel(K('braced', { bottom: Infinity, top: Infinity }), 0.5)).toBeLessThan(1e-12); // fixed–fixed
    expect(rel(phi('braced', { bottom: Infinity, top: 0 }), 4.4934094579)).toBeLessThan(1e-10); // fixed–pinned, tan φ = φ
    expect(rel(K('braced', { bottom: 0, top: Infinity }), 0.69915566)).toBeLessThan(1e-8);
    expect(rel(K('sway', { bottom: Infinity, top: 0 }), 2)).toBeLessThan(1e-12); // flagpole
    expect(rel(K('sway', { bottom: Infinity, top: Infinity }), 1)).toBeLessThan(1e-12); // fixed–guided
    expect(rel(K('sway', { bottom: 0, top: Infinity }), 2)).toBeLessThan(1e-12); // pinned–guided
  });

  // source: Timoshenko & Gere 1961 ch. 2 (from memory): Pcr = 4π²EI/L² for fixed–fixed; 20.1907 EI/L² fixed–pinned (docs/verification.md §M1 [V])
  it('gives Pcr in SI for a real column', () => {
    const EI = 200e9 * 25.1e-6;
    const L = 4.2;
    expect(rel(criticalLoad(EI, L, 'braced', { bottom: Infinity, top: Infinity }).Pcr, (4 * PI * PI * EI) / (L * L))).toBeLessThan(1e-12);
    expect(rel(criticalLoad(EI, L, 'braced', { bottom: Infinity, top: 0 }).Pcr, (20.1907286 * EI) / (L * L))).toBeLessThan(1e-8);
  });
});

describe('higher modes', () => {
  // source: Timoshenko & Gere 1961 ch. 2 (from memory); fixed–fixed factorisation 4 sin(φ/2)[sin(φ/2) − (φ/2)cos(φ/2)]; table in docs/verification.md §M1 [V]
  it('fixed–fixed modes 4, 8.182994, 16, 24.18720 × π²EI/L²', () => {
    const expected = [4, 8.182994, 16, 24.1872];
    expected.forEach((v, i) => {
      const { Pcr } = criticalLoad(1, 1, 'braced', { bottom: Infinity, top: Infinity }, i + 1);
      expect(rel(Pcr / (PI * PI), v)).toBeLessThan(1e-6);
    });
  });
  // source: Euler column, Timoshenko & Gere 1961 ch. 2 (from memory): P_n = n²π²EI/L²
  it('pinned–pinned modes n²', () => {
    for (let n = 1; n <= 5; n++) expect(rel(criticalLoad(1, 1, 'braced', { bottom: 0, top: 0 }, n).Pcr, n * n * PI * PI)).toBeLessThan(1e-12);
  });
  // source: second root of tan x = x, 7.72525184 (docs/verification.md §M1 [V]; classical, from memory)
  it('second fixed–pinned mode', () => {
    expect(rel(phi('braced', { bottom: Infinity, top: 0 }, 2), 7.72525184)).toBeLessThan(1e-8);
    expect(rel(K('braced', { bottom: Infinity, top: 0 }, 2), 0.406665)).toBeLessThan(2e-6);
  });
  // source: flagpole modes cos φ = 0 (Timoshenko & Gere 1961 ch. 2, from memory): φ_n = (2n−1)π/2
  it('flagpole and guided higher modes', () => {
    for (let n = 1; n <= 4; n++) {
      expect(rel(phi('sway', { bottom: Infinity, top: 0 }, n), ((2 * n - 1) * PI) / 2)).toBeLessThan(1e-12);
      expect(rel(phi('sway', { bottom: Infinity, top: Infinity }, n), n * PI)).toBeLessThan(1e-12);
    }
  });
  // common practice: the n-th root of a restrained column lies between the pinned and the fixed ones, and modes increase
  it('modes are increasing and interlace', () => {
    for (const frame of ['braced', 'sway'] as const) {
      for (const R of [0.3, 2, 40]) {
        const r = { bottom: R, top: 7 };
        let prev = 0;
        for (let n = 1; n <= 6; n++) {
          const p = phi(frame, r, n);
          expect(p).toBeGreaterThan(prev);
          const lo = frame === 'braced' ? n * PI : (n - 1) * PI;
          expect(p).toBeGreaterThanOrEqual(lo);
          expect(p).toBeLessThanOrEqual(lo + PI);
          prev = p;
        }
      }
    }
  });
});

// Table rows: R, symmetric K (kL), (R, 0) K (kL), (∞, R) K (kL).
// source: Timoshenko & Gere 1961 ch. 2 and Chen & Lui 1987 §2.3 (equations, from memory); values from docs/verification.md §M2 Tables 2a/2b [V, exact root and FE]
const TABLE_2A: [number, number, number, number, number, number, number][] = [
  [0, 1.0, 3.141593, 1.0, 3.141593, 0.699156, 4.493409],
  [0.5, 0.915645, 3.431014, 0.956052, 3.286007, 0.675035, 4.653969],
  [1, 0.855275, 3.673194, 0.922476, 3.405608, 0.655512, 4.792575],
  [2, 0.774265, 4.057516, 0.874881, 3.590881, 0.626042, 5.018185],
  [5, 0.65982, 4.761289, 0.803773, 3.908559, 0.577683, 5.438268],
  [10, 0.591935, 5.307325, 0.760244, 4.132347, 0.545616, 5.757886],
  [20, 0.548698, 5.725545, 0.732044, 4.291538, 0.524313, 5.991821],
  [50, 0.519903, 6.042646, 0.712834, 4.407186, 0.509951, 6.160583],
  [1e6, 0.500001, 6.283173, 0.699156, 4.493405, 0.5000005, 6.283179],
  [Infinity, 0.5, 6.283185, 0.699156, 4.493409, 0.5, 6.283185],
];
const TABLE_2B: [number, number, number, number, number, number, number][] = [
  [0.5, 3.27185, 0.9601889, 4.80902, 0.6532712, 1.71055, 1.836597],
  [1, 2.40451, 1.306542, 3.6516, 0.8603336, 1.54853, 2.028758],
  [2, 1.8258, 1.720667, 2.91733, 1.076874, 1.37252, 2.28893],
  [5, 1.37521, 2.284454, 2.39116, 1.313838, 1.18387, 2.653662],
  [10, 1.19558, 2.627675, 2.19866, 1.42887, 1.0974, 2.862773],
  [20, 1.09933, 2.85774, 2.09981, 1.496129, 1.04963, 2.993043],
  [50, 1.03995, 3.020903, 2.03999, 1.540006, 1.01997, 3.080069],
  [1e6, 1.000002, 3.141586, 2.000002, 1.570795, 1.000001, 3.14159],
  [Infinity, 1, 3.141593, 2, 1.570796, 1, 3.141593],
];

function checkRow(frame: Frame, row: [number, number, number, number, number, number, number]): void {
  const [R, k1, p1, k2, p2, k3, p3] = row;
  const cases: [EndRestraint, number, number][] = [
    [{ bottom: R, top: R }, k1, p1],
    [{ bottom: R, top: 0 }, k2, p2],
    [{ bottom: Infinity, top: R }, k3, p3],
  ];
  for (const [r, k, p] of cases) {
    expect(rel(K(frame, r), k)).toBeLessThan(1e-5);
    expect(rel(phi(frame, r), p)).toBeLessThan(1e-5);
    // the two ends are interchangeable
    expect(rel(phi(frame, { bottom: r.top, top: r.bottom }), phi(frame, r))).toBeLessThan(1e-13);
  }
}

describe('spring-restrained columns', () => {
  it('Table 2a (braced) all rows', () => TABLE_2A.forEach((row) => checkRow('braced', row)));
  it('Table 2b (sway) all rows', () => TABLE_2B.forEach((row) => checkRow('sway', row)));
  // source: docs/verification.md §M2 Table 2b row R = 0 [V]: flagpole K = 2 when the other end is fixed
  it('Table 2b row R = 0', () => {
    expect(rel(K('sway', { bottom: Infinity, top: 0 }), 2)).toBeLessThan(1e-12);
  });

  // source: symmetric factorisations of Δb, Δs (docs/verification.md §M2 [V]; Chen & Lui 1987 §2.3, from memory)
  it('symmetric springs satisfy tan(φ/2) = −φ/R (braced) and φ tan(φ/2) = R (sway)', () => {
    for (const R of [0.01, 0.7, 3, 25, 400]) {
      const pb = phi('braced', { bottom: R, top: R });
      expect(Math.abs(Math.tan(pb / 2) + pb / R)).toBeLessThan(1e-9 * (1 + pb / R));
      const ps = phi('sway', { bottom: R, top: R });
      expect(rel(ps * Math.tan(ps / 2), R)).toBeLessThan(1e-10);
    }
  });
  // source: half-column identities, docs/verification.md §M2 [V] (3.673194 = 2 × 1.836597; 1.306542 = 2 × 0.6532712)
  it('half-column identities', () => {
    for (const R of [0.5, 1, 4, 30]) {
      expect(rel(phi('braced', { bottom: R, top: R }), 2 * phi('sway', { bottom: Infinity, top: R / 2 }))).toBeLessThan(1e-12);
      expect(rel(phi('sway', { bottom: R, top: R }), 2 * phi('sway', { bottom: R / 2, top: 0 }))).toBeLessThan(1e-12);
    }
  });
  // source: docs/verification.md §M2 "large but finite springs" [V]: K ≈ K∞(1 + a/R), a = 2 braced symmetric, 1 braced other end fixed, 2 sway symmetric
  it('large finite springs approach the fixed limit as K∞(1 + a/R)', () => {
    const R = 1e6;
    expect(rel(K('braced', { bottom: R, top: R }), 0.5 * (1 + 2 / R))).toBeLessThan(1e-9);
    expect(rel(K('braced', { bottom: Infinity, top: R }), 0.5 * (1 + 1 / R))).toBeLessThan(1e-9);
    expect(rel(K('sway', { bottom: R, top: R }), 1 + 2 / R)).toBeLessThan(1e-9);
  });
  // source: docs/verification.md §M2 symmetric sway "for small R, φ² ≈ 2R" [V]
  it('tiny springs in sway give φ² ≈ 2R (no spurious φ = π)', () => {
    for (const R of [1e-12, 1e-8, 1e-4]) {
      const p = phi('sway', { bottom: R, top: R });
      expect(rel(p * p, 2 * R)).toBeLessThan(2 * R + 1e-12);
    }
  });
  // common practice: restraint can only raise the critical load (Rayleigh quotient)
  it('is monotone in each spring', () => {
    for (const frame of ['braced', 'sway'] as const) {
      let prev = -1;
      for (const R of [0.001, 0.01, 0.1, 1, 10, 100, 1e4, Infinity]) {
        const p = phi(frame, { bottom: R, top: 0.4 });
        expect(p).toBeGreaterThan(prev);
        prev = p;
      }
    }
  });
});

describe('mechanism', () => {
  // source: docs/verification.md §M2 Table 2b R = 0 row and limit checks [V]: sway (0, 0) is a mechanism, K = ∞ (not the braced root φ = π)
  it('sway with no restraint gives Pcr = 0 and K = Infinity', () => {
    const res = criticalLoad(5e6, 3, 'sway', { bottom: 0, top: 0 });
    expect(res.Pcr).toBe(0);
    expect(res.phi).toBe(0);
    expect(res.K).toBe(Infinity);
    expect(criticalLoad(5e6, 3, 'sway', { bottom: 0, top: 0, lateral: 0 }).Pcr).toBe(0);
  });
  // common practice: the second mode of a free mechanism is the braced pinned–pinned shape (zero drift, zero shear)
  it('higher modes of the mechanism are sin φ = 0', () => {
    expect(rel(phi('sway', { bottom: 0, top: 0 }, 2), PI)).toBeLessThan(1e-15);
    expect(rel(phi('sway', { bottom: 0, top: 0 }, 3), 2 * PI)).toBeLessThan(1e-15);
  });
});

describe('translational spring at the top (sway)', () => {
  // common practice: derived from EI y'''' + P y'' = 0 with EI y''' + P y' = kT y at the top (energy); limits T = 0 and T → ∞
  it('T = 0 is plain sway and T → ∞ is braced', () => {
    for (const [a, b] of [[0, 0.5], [2, 2], [Infinity, 3], [1, 0]] as const) {
      expect(phi('sway', { bottom: a, top: b, lateral: 0 })).toBe(phi('sway', { bottom: a, top: b }));
      expect(rel(phi('sway', { bottom: a, top: b, lateral: Infinity }), phi('braced', { bottom: a, top: b }))).toBeLessThan(1e-15);
      expect(rel(phi('sway', { bottom: a, top: b, lateral: 1e12 }), phi('braced', { bottom: a, top: b }))).toBeLessThan(1e-8);
    }
  });
  // common practice (statics): a pinned–pinned column on a top spring tilts rigidly at P = kT L, i.e. φ² = T, while T < π²
  it('both ends pinned: rigid tilt P = kT L, capped by the Euler load', () => {
    for (const T of [1e-6, 0.3, 4, 9.5]) expect(rel(phi('sway', { bottom: 0, top: 0, lateral: T }) ** 2, T)).toBeLessThan(1e-14);
    expect(rel(phi('sway', { bottom: 0, top: 0, lateral: 20 }), PI)).toBeLessThan(1e-15);
    expect(rel(criticalLoad(2e6, 4, 'sway', { bottom: 0, top: 0, lateral: (3e5 * 64) / 2e6 }).Pcr, 3e5 * 4)).toBeLessThan(1e-12);
  });
  // common practice: the root satisfies T Δb + φ³ Δs = 0 and rises monotonically with T between the sway and braced roots
  it('is monotone in T and satisfies its characteristic equation', () => {
    const r = { bottom: 2, top: 0.3 };
    let prev = phi('sway', r);
    for (const T of [0.1, 1, 5, 20, 100, 1e4]) {
      const p = phi('sway', { ...r, lateral: T });
      expect(p).toBeGreaterThan(prev);
      expect(p).toBeLessThan(phi('braced', r));
      const s = Math.sin(p);
      const c = Math.cos(p);
      const [A, B] = [r.bottom, r.top];
      const db = A * B * (2 * (1 - c) - p * s) + (A + B) * p * (s - p * c) + p ** 3 * s;
      const ds = (A * B - p * p) * s + (A + B) * p * c;
      expect(Math.abs(T * db + p ** 3 * ds)).toBeLessThan(1e-9 * (T * Math.abs(A * B * p ** 2) + p ** 4 * (A + B)));
      prev = p;
    }
  });
  // common practice: with equal springs the symmetric braced mode has no end shear, so a stiff lateral spring cannot raise Pcr above it
  it('equal springs: stiff lateral spring gives the symmetric braced root', () => {
    const r = { bottom: 2, top: 2, lateral: 50 };
    // source: docs/verification.md §M2 Table 2a, R = 2 symmetric: kL = 4.057516 [V]
    expect(rel(phi('sway', r), 4.057516)).toBeLessThan(1e-6);
    // a soft lateral spring leaves the antisymmetric sway mode lowest, between 1.720667 (T = 0, Table 2b) and 4.057516
    const soft = phi('sway', { ...r, lateral: 5 });
    expect(soft).toBeGreaterThan(1.720667);
    expect(soft).toBeLessThan(4.057516);
  });
});

describe('input checks', () => {
  // common practice: invalid arguments are rejected rather than producing NaN
  it('rejects bad arguments', () => {
    expect(() => criticalLoad(-1, 1, 'braced', { bottom: 0, top: 0 })).toThrow();
    expect(() => criticalLoad(1, 0, 'braced', { bottom: 0, top: 0 })).toThrow();
    expect(() => criticalLoad(1, 1, 'braced', { bottom: -1, top: 0 })).toThrow();
    expect(() => criticalLoad(1, 1, 'sway', { bottom: NaN, top: 0 })).toThrow();
    expect(() => criticalLoad(1, 1, 'braced', { bottom: 0, top: 0 }, 0)).toThrow();
    expect(() => criticalLoad(1, 1, 'braced', { bottom: 0, top: 0 }, 1.5)).toThrow();
  });
});
