import { describe, expect, it } from 'vitest';
import { fibreSection } from '../../src/plasticZone/sectionFibres.js';
import type { SectionDimensions, SectionFamily } from '../../src/plasticZone/types.js';

const fy = 355e6;
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
// dimensions of standard shapes, EN 10365 / EN 10210-2 tables (from memory)
const IPE300: SectionDimensions = { shape: 'i', h: 0.3, b: 0.15, tw: 0.0071, tf: 0.0107 };
const HEB300: SectionDimensions = { shape: 'i', h: 0.3, b: 0.3, tw: 0.011, tf: 0.019 };

function resultants(s: SectionDimensions, family: SectionFamily, axis: 'y' | 'z'): { N: number; M: number; maxAbs: number } {
  const f = fibreSection(s, family, axis, fy);
  let N = 0;
  let M = 0;
  let maxAbs = 0;
  for (let i = 0; i < f.area.length; i++) {
    N += f.residual[i] * f.area[i];
    M += f.residual[i] * f.lever[i] * f.area[i];
    maxAbs = Math.max(maxAbs, Math.abs(f.residual[i]));
  }
  return { N, M, maxAbs };
}

describe('fibre sections', () => {
  // plate geometry (common practice): A = 2 b tf + (h − 2 tf) tw; I_y = [b h³ − (b − tw)(h − 2tf)³]/12; I_z = [2 tf b³ + (h − 2tf) tw³]/12
  it('reproduce area and second moments of an I section (no fillets)', () => {
    const { h, b, tw, tf } = IPE300 as { h: number; b: number; tw: number; tf: number };
    const A = 2 * b * tf + (h - 2 * tf) * tw;
    const Iy = (b * h ** 3 - (b - tw) * (h - 2 * tf) ** 3) / 12;
    const Iz = (2 * tf * b ** 3 + (h - 2 * tf) * tw ** 3) / 12;
    const y = fibreSection(IPE300, 'rolled', 'y', fy);
    const z = fibreSection(IPE300, 'rolled', 'z', fy);
    expect(rel(y.A, A)).toBeLessThan(1e-12);
    // midpoint fibres miss each patch's own I: 2 layers through tf, 16 across b
    expect(rel(y.I, Iy)).toBeLessThan(2e-3);
    expect(rel(z.I, Iz)).toBeLessThan(5e-3);
  });

  // hollow and solid sections (common practice): A = π(D² − d²)/4, I = π(D⁴ − d⁴)/64; RHS by plates; b h³/12
  it('reproduce hollow and solid sections', () => {
    const chs = fibreSection({ shape: 'chs', D: 0.2191, t: 0.008 }, 'hollow', 'y', fy);
    const d = 0.2191 - 0.016;
    expect(rel(chs.A, (Math.PI * (0.2191 ** 2 - d ** 2)) / 4)).toBeLessThan(1e-12);
    expect(rel(chs.I, (Math.PI * (0.2191 ** 4 - d ** 4)) / 64)).toBeLessThan(2e-3);
    const rhs = fibreSection({ shape: 'rhs', h: 0.3, b: 0.2, t: 0.01 }, 'hollow', 'y', fy);
    expect(rel(rhs.A, 0.3 * 0.2 - 0.28 * 0.18)).toBeLessThan(1e-12);
    expect(rel(rhs.I, (0.2 * 0.3 ** 3 - 0.18 * 0.28 ** 3) / 12)).toBeLessThan(2e-3);
    const rect = fibreSection({ shape: 'rect', h: 0.2, b: 0.1 }, 'solid', 'y', fy);
    // 16 layers at their midpoints: Σ = (b h³/12)(1 − 1/16²) exactly
    expect(rel(rect.I, ((0.1 * 0.2 ** 3) / 12) * (1 - 1 / 256))).toBeLessThan(1e-12);
    expect(rel(rect.W, ((0.1 * 0.2 ** 2) / 6) * (1 - 1 / 256))).toBeLessThan(1e-12);
  });

  it('carry self-equilibrated residual stresses (∫σ_r dA = 0, ∫σ_r y dA = 0) within ±fy', () => {
    for (const s of [IPE300, HEB300]) {
      for (const family of ['rolled', 'welded'] as const) {
        for (const axis of ['y', 'z'] as const) {
          const r = resultants(s, family, axis);
          expect(Math.abs(r.N)).toBeLessThan(1e-9 * fy * 0.01);
          expect(Math.abs(r.M)).toBeLessThan(1e-9 * fy * 1e-3);
          expect(r.maxAbs).toBeLessThanOrEqual(fy * (1 + 1e-12));
        }
      }
    }
  });

  // ECCS (1976), the pattern behind the European column curves (Beer & Schulz 1970): peak 0.3 fy for h/b > 1.2, 0.5 fy for h/b ≤ 1.2
  it('uses the rolled peak 0.3 fy or 0.5 fy by h/b, compression at the flange tips', () => {
    const ipe = fibreSection(IPE300, 'rolled', 'z', fy);
    const heb = fibreSection(HEB300, 'rolled', 'z', fy);
    const tip = (f: ReturnType<typeof fibreSection>): number => {
      let k = 0;
      for (let i = 1; i < f.lever.length; i++) if (Math.abs(f.lever[i]) > Math.abs(f.lever[k])) k = i;
      return f.residual[k];
    };
    // the outermost patch is 1/32 of the flange width in from the tip: σ = −σ0 (1 − 2·(1/16))
    expect(rel(tip(ipe), -0.3 * fy * (1 - 2 / 16))).toBeLessThan(1e-9);
    expect(rel(tip(heb), -0.5 * fy * (1 - 2 / 16))).toBeLessThan(1e-9);
    expect(resultants({ shape: 'rhs', h: 0.2, b: 0.2, t: 0.01 }, 'hollow', 'y').maxAbs).toBe(0);
  });

  it('refuses a welded or rolled pattern on a hollow section', () => {
    expect(() => fibreSection({ shape: 'rhs', h: 0.2, b: 0.2, t: 0.01 }, 'rolled', 'y', fy)).toThrow(/I\/H sections/);
  });
});
