import type { BendingAxis, SectionDimensions } from './types.js';

/**
 * A, I and W = I / (half the extent in the bending plane) of the sharp-cornered plate shapes the
 * fibre model cuts up (no root fillets or corner radii), in closed form: what a corrosion loss does
 * to the section without cutting it into fibres again (limitState/plasticZoneStrength.ts).
 */
export function plateProperties(s: SectionDimensions, axis: BendingAxis): { A: number; I: number; W: number } {
  switch (s.shape) {
    case 'i': {
      const hw = s.h - 2 * s.tf;
      const A = 2 * s.b * s.tf + hw * s.tw;
      const I = axis === 'y' ? (s.b * s.h ** 3 - (s.b - s.tw) * hw ** 3) / 12 : (2 * s.tf * s.b ** 3 + hw * s.tw ** 3) / 12;
      return { A, I, W: I / ((axis === 'y' ? s.h : s.b) / 2) };
    }
    case 'rhs': {
      const [d, w] = axis === 'y' ? [s.h, s.b] : [s.b, s.h];
      const A = s.h * s.b - (s.h - 2 * s.t) * (s.b - 2 * s.t);
      const I = (w * d ** 3 - (w - 2 * s.t) * (d - 2 * s.t) ** 3) / 12;
      return { A, I, W: I / (d / 2) };
    }
    case 'chs': {
      const di = s.D - 2 * s.t;
      const I = (Math.PI * (s.D ** 4 - di ** 4)) / 64;
      return { A: (Math.PI * (s.D ** 2 - di ** 2)) / 4, I, W: I / (s.D / 2) };
    }
    case 'rect': {
      const [d, w] = axis === 'y' ? [s.h, s.b] : [s.b, s.h];
      const I = (w * d ** 3) / 12;
      return { A: s.h * s.b, I, W: I / (d / 2) };
    }
  }
}
