import { criticalLoad } from '../mechanics/criticalLoad.js';
import { modeShape } from '../mechanics/modeShape.js';
import { fibreColumn, type FibreColumn } from './fibreColumn.js';
import { fibreSection, type FibreSection } from './sectionFibres.js';
import type { PlasticZoneInput } from './types.js';

/**
 * Everything fixed for one column before the load is traced: the fibres, the mesh with its bow,
 * the supports (constrained dofs and springs) and the reference load (P = 1 with its end couples).
 */
export interface ColumnSetup {
  readonly column: FibreColumn;
  readonly fibres: FibreSection;
  /** 1 where a dof is held (support, rigid spring) */
  readonly held: Uint8Array;
  /** spring stiffness on each dof (0 when none) */
  readonly spring: Float64Array;
  /** external load for P = 1: axial −1 at the top, end couples P·e */
  readonly reference: Float64Array;
  /** elastic critical load of the continuous column with the fibre section's EI (N) */
  readonly Pcr: number;
  readonly squashLoad: number;
}

export const DEFAULT_ELEMENTS = 16;

export function columnSetup(input: PlasticZoneInput, overrideFy?: number): ColumnSetup {
  const fy = overrideFy ?? input.fy;
  const fibres = fibreSection(input.section, input.family, input.axis, input.fy, input.residualScale ?? 1);
  const EI = input.E * fibres.I;
  const L = input.L;
  const kL = input.frame === 'sway' ? input.kLateral ?? 0 : Infinity;
  const r = {
    bottom: input.kBottom === Infinity ? Infinity : (input.kBottom * L) / EI,
    top: input.kTop === Infinity ? Infinity : (input.kTop * L) / EI,
    lateral: kL === Infinity ? undefined : (kL * L ** 3) / EI,
  };
  const frame = input.frame === 'sway' && kL !== Infinity ? 'sway' : 'braced';
  const { Pcr, phi } = criticalLoad(EI, L, frame, frame === 'sway' ? r : { bottom: r.bottom, top: r.top });
  const e0 = input.e0;
  let bowSlope: (x: number) => number;
  if ((input.bowShape ?? 'mode') === 'half-sine' || !(phi > 0)) {
    bowSlope = (x) => ((e0 * Math.PI) / L) * Math.cos((Math.PI * x) / L);
  } else {
    const m = modeShape(frame, frame === 'sway' ? r : { bottom: r.bottom, top: r.top }, phi);
    bowSlope = (x) => {
      const s = x / L;
      return (e0 / L) * (m.A * m.phi * Math.cos(m.phi * s) - m.B * m.phi * Math.sin(m.phi * s) + m.C);
    };
  }
  const elements = input.elements ?? DEFAULT_ELEMENTS;
  const column = fibreColumn({ fibres, E: input.E, fy, hardening: input.hardening ?? 0, L, elements, bowSlope });
  const n = column.dofs;
  const top = 3 * elements;
  const held = new Uint8Array(n);
  const spring = new Float64Array(n);
  held[0] = 1; // base: no axial or lateral movement
  held[1] = 1;
  if (frame === 'braced') held[top + 1] = 1;
  else spring[top + 1] = kL;
  if (input.kBottom === Infinity) held[2] = 1;
  else spring[2] = input.kBottom;
  if (input.kTop === Infinity) held[top + 2] = 1;
  else spring[top + 2] = input.kTop;
  const reference = new Float64Array(n);
  reference[top] = -1;
  reference[top + 2] = input.eccentricity?.top ?? 0;
  reference[2] = -(input.eccentricity?.bottom ?? 0);
  return { column, fibres, held, spring, reference, Pcr, squashLoad: fibres.A * input.fy };
}

/** K and the internal forces with the springs added and the held dofs removed (unit diagonal, zero force). */
export function assembleSystem(s: ColumnSetup, d: Float64Array, K: Float64Array, fint: Float64Array): void {
  s.column.assemble(d, K, fint);
  const n = s.column.dofs;
  for (let i = 0; i < n; i++) {
    if (s.spring[i] !== 0) {
      K[i * n + i] += s.spring[i];
      fint[i] += s.spring[i] * d[i];
    }
  }
  for (let i = 0; i < n; i++) {
    if (!s.held[i]) continue;
    for (let j = Math.max(0, i - 5); j <= Math.min(n - 1, i + 5); j++) {
      K[i * n + j] = 0;
      K[j * n + i] = 0;
    }
    K[i * n + i] = 1;
    fint[i] = 0;
  }
}
