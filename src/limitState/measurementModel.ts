/**
 * What the column model predicts for each measurement on the structure at a point x of the
 * scenario's random variables (docs/evidence.md §7):
 *
 * - rotation test of an end's spring: θ = M / k, with k = R·EI/L the end's rotational stiffness
 *   at x (whatever form the end is written in: rotation, series, fixity, alignment G);
 * - first natural frequency at the measured axial load and mass per length, from the exact
 *   characteristic equation (mechanics/naturalFrequency.ts) with the springs at x.
 *
 * The likelihood of the readings is composed in studies/measurementUpdate.ts.
 */
import { naturalFrequency } from '../mechanics/naturalFrequency.js';
import type { Measurement } from '../scenario/types.js';
import type { ColumnModel } from './columnModel.js';

/** The model value of the measured quantity at x: rad for a rotation test, Hz for a frequency. */
export function predictedReading(model: ColumnModel, m: Measurement, x: Float64Array): number {
  const s = model.state(x);
  const EI = s.E * s.I;
  if (m.type === 'rotation_test') {
    const R = m.end === 'bottom' ? s.r.bottom : s.r.top;
    const k = (R * EI) / s.L;
    return k > 0 ? m.moment / k : Infinity;
  }
  if (!(EI > 0)) return 0;
  return naturalFrequency(EI, s.L, m.massPerLength, m.axialLoad, s.frame, s.r).hertz;
}

/** The measured value, in the unit of predictedReading. */
export function measuredReading(m: Measurement): number {
  return m.type === 'rotation_test' ? m.rotation : m.value;
}
