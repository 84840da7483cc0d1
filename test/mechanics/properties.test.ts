import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { CLOSED_FORM_STRENGTH_MODELS, type Frame } from '../../src/mechanics/types.js';

// Property tests of the solver over generated restraint (fast-check, fixed seed).
const R = fc.oneof(fc.constant(0), fc.double({ min: 1e-3, max: 1e4, noNaN: true }), fc.constant(Infinity));
const runs = { numRuns: 400, seed: 20261201 };

describe('restrained-column properties', () => {
  it('braced: K lies between the fixed–fixed 0.5 and the pinned 1.0 bounds', () => {
    // source: Timoshenko & Gere 1961, ch. 2 (from memory): rotational restraint moves K from 1 (pinned) to 0.5 (fixed)
    fc.assert(
      fc.property(R, R, (a, b) => {
        const { K } = criticalLoad(1, 1, 'braced', { bottom: a, top: b });
        return K >= 0.5 - 1e-12 && K <= 1 + 1e-12;
      }),
      runs,
    );
  });

  it('sway: K is at least 1 (fixed–guided) and finite once an end is restrained', () => {
    // common practice: a sway column never buckles shorter than the fixed–guided K = 1
    fc.assert(
      fc.property(R, R, (a, b) => {
        fc.pre(a > 0 || b > 0);
        const { K } = criticalLoad(1, 1, 'sway', { bottom: a, top: b });
        return K >= 1 - 1e-12 && Number.isFinite(K);
      }),
      runs,
    );
  });

  it.each(['braced', 'sway'] as Frame[])('%s: K falls as either end gets stiffer', (frame) => {
    // common practice: more restraint never lengthens the buckled wave
    fc.assert(
      fc.property(R, fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1.01, max: 100, noNaN: true }), (b, a, m) => {
        const r1 = criticalLoad(1, 1, frame, { bottom: a, top: b }).K;
        const r2 = criticalLoad(1, 1, frame, { bottom: a * m, top: b }).K;
        return r2 <= r1 * (1 + 1e-9);
      }),
      runs,
    );
  });

  it('Pcr scales with EI/L² at fixed restraint ratios', () => {
    // source: Euler's formula Pcr = π²EI/(KL)² (Timoshenko & Gere 1961, from memory)
    fc.assert(
      fc.property(R, R, fc.double({ min: 1e3, max: 1e8, noNaN: true }), fc.double({ min: 0.5, max: 20, noNaN: true }), (a, b, EI, L) => {
        const unit = criticalLoad(1, 1, 'braced', { bottom: a, top: b }).Pcr;
        const scaled = criticalLoad(EI, L, 'braced', { bottom: a, top: b }).Pcr;
        return Math.abs(scaled / ((unit * EI) / (L * L)) - 1) < 1e-12;
      }),
      runs,
    );
  });

  it('no strength model gives more than the squash load A·fy', () => {
    // common practice: a column's axial resistance never exceeds A·fy
    fc.assert(
      fc.property(
        fc.constantFrom(...CLOSED_FORM_STRENGTH_MODELS),
        fc.constantFrom<Frame>('braced', 'sway'),
        R,
        R,
        fc.double({ min: 1, max: 15, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        (model, frame, a, b, L, bow) => {
          fc.pre(frame === 'braced' || a > 0 || b > 0);
          const s = { E: 200e9, fy: 300e6, A: 6e-3, I: 2e-5, S: 2.5e-4, L, bow, frame, r: { bottom: a, top: b } };
          const { capacity } = columnCapacity(model, s);
          return capacity >= 0 && capacity <= s.A * s.fy * (1 + 1e-12);
        },
      ),
      runs,
    );
  });
});
