import { describe, expect, it } from 'vitest';
import { feFirstMode, feSecondOrder, type FeNodalShape } from '../../src/fe/feSecondOrder.js';
import { endSpringMoments } from '../../src/mechanics/endSpringMoments.js';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import type { EndRestraint, Frame } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const EI = 200e9 * 15.4e-6;
const L = 5.6;
const e0 = L / 1500;

function scaled(mode: FeNodalShape, s: number): FeNodalShape {
  return { w: mode.w.map((v) => v * s), slope: mode.slope.map((v) => v * s) };
}

// source: linear second-order finite elements (K − P Kg) v = P Kg w0 with Hermite cubics and the consistent geometric
// stiffness, Przemieniecki, Theory of Matrix Structural Analysis, 1968 (from memory); the finite-element mode comes from
// its own inverse iteration, so the check shares no formula with the closed form in mechanics/endSpringMoments.ts
describe('finite-element second-order solve vs the closed-form mode amplification', () => {
  const cases: [Frame, EndRestraint][] = [
    ['braced', { bottom: 0, top: 0 }],
    ['braced', { bottom: Infinity, top: Infinity }],
    ['braced', { bottom: 2, top: 0.5 }],
    ['braced', { bottom: Infinity, top: 0 }],
    ['braced', { bottom: 20, top: 3 }],
    ['sway', { bottom: Infinity, top: 0 }],
    ['sway', { bottom: 6, top: 0.6 }],
    ['sway', { bottom: 3, top: 1, lateral: 5 }],
    ['sway', { bottom: 0.5, top: 0, lateral: 2 }],
  ];
  it.each(cases)('%s %o: end moments, rotations, member maximum', (frame, r) => {
    const { Pcr } = criticalLoad(EI, L, frame, r);
    const P = 0.6 * Pcr;
    const exact = endSpringMoments(EI, L, frame, r, e0, P);
    const fe = feSecondOrder(EI, L, frame, r, P, scaled(feFirstMode(frame, r, 128), e0));
    const scale = exact.memberMax; // moments near zero are compared on the member's scale
    for (const end of ['bottom', 'top'] as const) {
      expect(Math.abs(fe.springMoment[end] - exact.springMoment[end]) / scale).toBeLessThan(1e-6);
      expect(Math.abs(fe.rotation[end] - exact.rotation[end]) / ((scale * L) / EI)).toBeLessThan(1e-6); // rotation scale M L / EI
    }
    expect(rel(fe.memberMax, exact.memberMax)).toBeLessThan(1e-6);
    // fixed–fixed has equal peaks at both ends and mid-span: no unique place to compare
    if (!(r.bottom === Infinity && r.top === Infinity)) expect(Math.abs(fe.memberMaxAt - exact.memberMaxAt)).toBeLessThan(1e-4 * L);
  });

  // common practice: nodal moments from element equilibrium, peak refined by a parabola: the error falls about 16-fold per halving
  it('member maximum converges at fourth order', () => {
    const r = { bottom: 2, top: 0.5 };
    const P = 0.6 * criticalLoad(EI, L, 'braced', r).Pcr;
    const exact = endSpringMoments(EI, L, 'braced', r, e0, P).memberMax;
    const err = (n: number) => rel(feSecondOrder(EI, L, 'braced', r, P, scaled(feFirstMode('braced', r, n), e0)).memberMax, exact);
    const order = Math.log2(err(16) / err(32));
    expect(order).toBeGreaterThan(3.5);
    expect(order).toBeLessThan(4.5);
  });
});
