import { criticalLoad } from './criticalLoad.js';
import { modeShape } from './modeShape.js';
import type { EndRestraint, Frame } from './types.js';

/**
 * Second-order elastic solution of the prismatic, spring-restrained beam-column under an axial load P
 * applied with end eccentricities e_B (bottom) and e_T (top), plus the mode-affine bow
 * (docs/beam-column.md). The end couples are M = P·e at each end; the same sign of e_B and e_T puts
 * the load on the same side at both ends (single curvature).
 *
 * Eccentric part: v(ξ) = A sin φξ + B cos φξ + Cξ + D, φ = L√(P/EI), solves EI v'''' + P v'' = 0
 * with (ξ = x/L, R = kL/EI, T = kT L³/EI, a = 1/(1+R), b = R/(1+R) so that R = ∞ needs no special case)
 *   braced:  v(0) = 0, v(1) = 0;  sway: v(0) = 0, v'''(1) + φ² v'(1) = T v(1)  (i.e. φ²C = T v(1))
 *   bottom:  b v'(0) − a v''(0) = a φ² e_B     (member moment M(0) = P e_B − k θ(0))
 *   top:     b v'(1) + a v''(1) = −a φ² e_T    (member moment M(L) = P e_T + k θ(L))
 * and the moment M = −EI v''/L² = P (A sin φξ + B cos φξ).
 * Transverse actions (docs/beam-column.md, "Transverse actions"): a uniform line load w along the
 * height adds the particular solution q ξ²/2, q = wL²/P, so M = P (A sin φξ + B cos φξ − q/φ²); a
 * horizontal force H at the top of a sway column enters the shear condition as h = HL/P:
 *   braced top: v(1) = 0 with the q ξ²/2 term;  sway: φ²(C + q) = T v(1) − φ² h.
 * Applied end moments need no term of their own: they add to the couples P·e (eB, eT are couple/P).
 * Bow part (mechanics/endSpringMoments.ts): the whole first mode amplified by 1/(1 − P/Pcr).
 * Signs as in endSpringMoments.ts: w positive on the side of a positive eccentricity, θ = dv/dx,
 * M positive when it bends the member towards +w, spring moment k·θ.
 * The bow's sign is free (|e0| is used): it is put on whichever side gives the larger max |M|.
 */

/** Scratch for the 4×4 solve and the results of `eccentricCoefficientsInto` (no allocation per call). */
export const ECC_LENGTH = 24;

/**
 * Coefficients (A, B, C, D) in m of the eccentric part at φ = L√(P/EI) > 0, written to out[0..3]
 * (out needs ECC_LENGTH entries; the rest is scratch). Gaussian elimination with partial pivoting.
 * q = wL²/P and h = HL/P (m) are the line load along the height and the horizontal force at the top
 * per unit axial load (0: none; h acts only in sway). With q = h = 0 every row is the same number as
 * without them (adding 0 is exact), so eccentric-only results do not change.
 */
export function eccentricCoefficientsInto(
  out: Float64Array, frame: Frame, r: EndRestraint, phi: number, eB: number, eT: number, q = 0, h = 0,
): Float64Array {
  const aB = 1 / (1 + r.bottom);
  const bB = r.bottom === Infinity ? 1 : r.bottom / (1 + r.bottom);
  const aT = 1 / (1 + r.top);
  const bT = r.top === Infinity ? 1 : r.top / (1 + r.top);
  const s = Math.sin(phi);
  const c = Math.cos(phi);
  const p2 = phi * phi;
  // augmented rows [A B C D | rhs] in out[4 ..]: 4 rows × 5
  const m = out;
  const o = 4;
  const set = (row: number, A: number, B: number, C: number, D: number, rhs: number) => {
    const k = o + row * 5;
    m[k] = A; m[k + 1] = B; m[k + 2] = C; m[k + 3] = D; m[k + 4] = rhs;
  };
  set(0, 0, 1, 0, 1, 0); // v(0) = 0
  if (frame === 'braced') {
    set(1, s, c, 1, 1, -0.5 * q); // v(1) = 0, the particular part q/2 moved to the right
  } else {
    const T = r.lateral ?? 0;
    const aL = 1 / (1 + T);
    const bL = T === Infinity ? 1 : T / (1 + T);
    // a φ² (C + q) − b v(1) = −a φ² h
    set(1, -bL * s, -bL * c, aL * p2 - bL, -bL, -aL * p2 * h - aL * p2 * q + bL * 0.5 * q);
  }
  // v''(0) and v'(1), v''(1) carry the particular part q (slope qξ, curvature q)
  set(2, bB * phi, aB * p2, bB, 0, aB * p2 * eB + aB * q);
  set(3, bT * phi * c - aT * p2 * s, -bT * phi * s - aT * p2 * c, bT, 0, -aT * p2 * eT - q);
  for (let col = 0; col < 4; col++) {
    let piv = col;
    for (let row = col + 1; row < 4; row++) if (Math.abs(m[o + row * 5 + col]) > Math.abs(m[o + piv * 5 + col])) piv = row;
    if (piv !== col) {
      for (let k = 0; k < 5; k++) {
        const t = m[o + col * 5 + k];
        m[o + col * 5 + k] = m[o + piv * 5 + k];
        m[o + piv * 5 + k] = t;
      }
    }
    const d = m[o + col * 5 + col];
    for (let row = col + 1; row < 4; row++) {
      const f = m[o + row * 5 + col] / d;
      if (f === 0) continue;
      for (let k = col; k < 5; k++) m[o + row * 5 + k] -= f * m[o + col * 5 + k];
    }
  }
  for (let row = 3; row >= 0; row--) {
    let t = m[o + row * 5 + 4];
    for (let k = row + 1; k < 4; k++) t -= m[o + row * 5 + k] * out[k];
    out[row] = t / m[o + row * 5 + row];
  }
  return out;
}

/**
 * Largest |P(Ae sin φξ + Be cos φξ) + Q(Am sin ψξ + Bm cos ψξ) − offset| over ξ ∈ [0, 1] and where:
 * a grid of 32 intervals brackets every sign change of the derivative (both frequencies are at most a
 * few π, so an interval is far shorter than half a period), each refined by safeguarded Newton steps.
 * Returns the value; the place goes to at[0].
 */
const GRID = 32;
export function maxAbsTwoSinusoids(
  P: number, Ae: number, Be: number, phi: number, Q: number, Am: number, Bm: number, psi: number, at: Float64Array, offset = 0,
): number {
  // offset: a constant moment (the line load's P q/φ²) subtracted; 0 leaves every value unchanged
  if (Q === 0 || (Am === 0 && Bm === 0)) return maxAbsSinusoid(P * Ae, P * Be, phi, offset, at);
  const val = (x: number) => P * (Ae * Math.sin(phi * x) + Be * Math.cos(phi * x)) + Q * (Am * Math.sin(psi * x) + Bm * Math.cos(psi * x)) - offset;
  // the derivative is a·cos + b·sin of each frequency; the curvature is −φ² (resp. −ψ²) times the sinusoid
  const pa = P * phi * Ae, pb = P * phi * Be, qa = Q * psi * Am, qb = Q * psi * Bm;
  let best = Math.abs(val(0));
  let bestAt = 0;
  const end = Math.abs(val(1));
  if (end > best) { best = end; bestAt = 1; }
  // the grid by rotation: (sin, cos) of φξ and ψξ advanced by the angle of one interval, four
  // products each, instead of four trigonometric calls per node (the drift over 32 steps is a few ulp,
  // far below any sign that matters: a bracket only has to contain the root, Newton's steps refine it)
  const cP = Math.cos(phi / GRID), sP = Math.sin(phi / GRID), cQ = Math.cos(psi / GRID), sQ = Math.sin(psi / GRID);
  let sp = 0, cp = 1, sq = 0, cq = 1;
  let x0 = 0;
  let d0 = pa + qa;
  for (let i = 1; i <= GRID; i++) {
    const x1 = i / GRID;
    const spNext = sp * cP + cp * sP;
    cp = cp * cP - sp * sP;
    sp = spNext;
    const sqNext = sq * cQ + cq * sQ;
    cq = cq * cQ - sq * sQ;
    sq = sqNext;
    const d1 = pa * cp - pb * sp + qa * cq - qb * sq;
    if ((d0 > 0 && d1 <= 0) || (d0 < 0 && d1 >= 0)) {
      // the zero of the derivative: Newton's steps on it (with its own derivative, the curvature),
      // kept inside the bracket and falling back to bisection (Press et al., Numerical Recipes,
      // 3rd ed., §9.4 rtsafe). At a step of 1e-12 the value is exact to far below rounding (it is
      // flat there to second order).
      let lo = x0, hi = x1, dlo = d0;
      let x = 0.5 * (lo + hi);
      for (let it = 0; it < 100; it++) {
        const s1 = Math.sin(phi * x), c1 = Math.cos(phi * x), s2 = Math.sin(psi * x), c2 = Math.cos(psi * x);
        const dm = pa * c1 - pb * s1 + qa * c2 - qb * s2;
        if (dm === 0) break;
        if ((dm > 0) === (dlo > 0)) { lo = x; dlo = dm; } else hi = x;
        const curvature = -phi * (pa * s1 + pb * c1) - psi * (qa * s2 + qb * c2);
        let next = x - dm / curvature;
        if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
        const step = Math.abs(next - x);
        x = next;
        if (step <= 1e-12 || hi - lo <= 1e-15) break;
      }
      const v = Math.abs(val(x));
      if (v > best) { best = v; bestAt = x; }
    }
    x0 = x1;
    d0 = d1;
  }
  at[0] = bestAt;
  return best;
}

/**
 * Largest |a sin φξ + b cos φξ − offset| over ξ ∈ [0, 1] and where (to at[0]), in closed form: with
 * a sin θ + b cos θ = ρ sin(θ + δ), ρ = √(a² + b²), δ = atan2(b, a), the interior extremes are at
 * φξ + δ = π/2 + kπ, worth ±ρ − offset; the ends are the other candidates. The one-frequency case of
 * maxAbsTwoSinusoids (no bow, or no second term), which otherwise brackets and refines.
 */
export function maxAbsSinusoid(a: number, b: number, phi: number, offset: number, at: Float64Array): number {
  let best = Math.abs(b - offset);
  let bestAt = 0;
  const end = Math.abs(a * Math.sin(phi) + b * Math.cos(phi) - offset);
  if (end > best) { best = end; bestAt = 1; }
  const rho = Math.hypot(a, b);
  if (phi > 0 && rho > 0) {
    const delta = Math.atan2(b, a);
    // θ_k = π/2 + kπ inside (δ, φ + δ): sin(θ_k) = (−1)^k
    for (let k = Math.ceil((delta - 0.5 * Math.PI) / Math.PI); ; k++) {
      const x = (0.5 * Math.PI + k * Math.PI - delta) / phi;
      if (x >= 1) break;
      if (x <= 0) continue;
      const v = Math.abs((k % 2 === 0 ? rho : -rho) - offset);
      if (v > best) { best = v; bestAt = x; }
    }
  }
  at[0] = bestAt;
  return best;
}

export interface BeamColumnResponse {
  /** false when P ≥ Pcr (or a mechanism): no equilibrium, every value is Infinity */
  stable: boolean;
  load: number;
  Pcr: number;
  /** end rotations θ (rad) */
  rotation: { bottom: number; top: number };
  /** moment taken by each end spring, k·θ (N·m); at a fixed end the support moment */
  springMoment: { bottom: number; top: number };
  /** largest |M| over the height (N·m) and where (m above the base) */
  memberMax: number;
  memberMaxAt: number;
  /** the top's added sideways displacement v(L) (m); 0 when braced */
  drift: number;
  /** +1 or −1: the side of the bow that gives memberMax */
  bowSide: number;
  /** bending moment M(x) (N·m) at x (m above the base), with the bow on bowSide */
  moment(x: number): number;
}

/** Transverse actions in the buckling plane: a uniform line load along the height (N/m) and a horizontal force at the top (N, sway only). */
export interface TransverseActions {
  line: number;
  top: number;
}

/**
 * The full response at P (N, 0 < P). EI (N·m²), L (m), r as in criticalLoad, bow e0 (m, either sign),
 * eB/eT end eccentricities (m; an applied end moment M enters as M/P), `actions` the transverse load
 * and top force (positive towards +v, the side of a positive eccentricity). P = 0 gives the zero
 * response; transverse actions need P > 0.
 */
export function beamColumnResponse(
  EI: number, L: number, frame: Frame, r: EndRestraint, bow: number, eB: number, eT: number, P: number,
  actions: TransverseActions = { line: 0, top: 0 },
): BeamColumnResponse {
  for (const [name, v] of [['axial load', P], ['bow', bow], ['bottom eccentricity', eB], ['top eccentricity', eT], ['line load', actions.line], ['top force', actions.top]] as const) {
    if (!Number.isFinite(v)) throw new RangeError(`${name} must be finite (got ${v})`);
  }
  if (P <= 0 && (actions.line !== 0 || actions.top !== 0)) throw new RangeError(`transverse actions need a positive axial load (got ${P})`);
  const { Pcr, phi: phiCr } = criticalLoad(EI, L, frame, r);
  if (!(Pcr > 0) || P >= Pcr) {
    return {
      stable: false, load: P, Pcr, rotation: { bottom: Infinity, top: Infinity }, springMoment: { bottom: Infinity, top: Infinity },
      memberMax: Infinity, memberMaxAt: NaN, drift: Infinity, bowSide: 1, moment: () => Infinity,
    };
  }
  if (P <= 0) {
    return {
      stable: true, load: P, Pcr, rotation: { bottom: 0, top: 0 }, springMoment: { bottom: 0, top: 0 },
      memberMax: 0, memberMaxAt: 0, drift: 0, bowSide: 1, moment: () => 0,
    };
  }
  const phi = L * Math.sqrt(P / EI);
  const q = (actions.line * L * L) / P;
  const h = frame === 'sway' ? (actions.top * L) / P : 0;
  const k = eccentricCoefficientsInto(new Float64Array(ECC_LENGTH), frame, r, phi, eB, eT, q, h);
  const [A, B, C, D] = [k[0], k[1], k[2], k[3]];
  const offset = (P * q) / (phi * phi);
  const mode = modeShape(frame, r, phiCr);
  // bow: added deflection a·ŵ, a = |e0| (P/Pcr)/(1 − P/Pcr); its moment Pcr·a·(Am sin ψξ + Bm cos ψξ)
  const ratio = P / Pcr;
  const a = (Math.abs(bow) * ratio) / (1 - ratio);
  const at = new Float64Array(1);
  const up = maxAbsTwoSinusoids(P, A, B, phi, Pcr * a, mode.A, mode.B, phiCr, at, offset);
  const upAt = at[0];
  const down = maxAbsTwoSinusoids(P, A, B, phi, -Pcr * a, mode.A, mode.B, phiCr, at, offset);
  const side = down > up ? -1 : 1;
  const slopeE = (xi: number) => A * phi * Math.cos(phi * xi) - B * phi * Math.sin(phi * xi) + C + q * xi;
  const slopeM = (xi: number) => mode.A * phiCr * Math.cos(phiCr * xi) - mode.B * phiCr * Math.sin(phiCr * xi) + mode.C;
  const thetaB = (slopeE(0) + side * a * slopeM(0)) / L;
  const thetaT = (slopeE(1) + side * a * slopeM(1)) / L;
  const moment = (x: number) => {
    const xi = x / L;
    return P * (A * Math.sin(phi * xi) + B * Math.cos(phi * xi)) + side * Pcr * a * (mode.A * Math.sin(phiCr * xi) + mode.B * Math.cos(phiCr * xi)) - offset;
  };
  // spring moment k·θ from the end conditions: P e_B − M(0) at the bottom, M(L) − P e_T at the top; 0 at a pinned end
  return {
    stable: true,
    load: P,
    Pcr,
    rotation: { bottom: thetaB, top: thetaT },
    springMoment: {
      bottom: r.bottom === 0 ? 0 : P * eB - moment(0),
      top: r.top === 0 ? 0 : moment(L) - P * eT,
    },
    memberMax: Math.max(up, down),
    memberMaxAt: (side === 1 ? upAt : at[0]) * L,
    drift: frame === 'sway' ? A * Math.sin(phi) + B * Math.cos(phi) + C + D + 0.5 * q + side * a * mode.sample(1) : 0,
    bowSide: side,
    moment,
  };
}
