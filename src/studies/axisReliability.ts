/**
 * The failure probability of each principal axis on its own (docs/sections.md): FORM on
 * g_y = θ·capacity_y − demand and on g_z, with the same variables, combination and transform as
 * the column's g = θ·min(capacity_y, capacity_z) − demand. The column fails when either axis does,
 * so pf ≥ max(pf_y, pf_z); the axis with the lower β governs.
 */
import { buildColumnModel, type AxisName, type ColumnModel } from '../limitState/columnModel.js';
import { problemFromModel } from '../limitState/columnRecipe.js';
import { form } from '../reliability/form.js';

export interface AxisReliability {
  readonly beta: number;
  readonly pf: number;
  readonly method: 'form';
  readonly calls: number;
  readonly converged: boolean;
}

export interface AxesReliability {
  readonly y: AxisReliability;
  readonly z: AxisReliability;
  /** the axis with the lower β */
  readonly governing: AxisName;
  /** the axis with the smaller capacity at the means (the check's) */
  readonly governingAtMeans: AxisName;
}

/** null for a one-axis column. */
export function axesReliability(model: ColumnModel, governingAtMeans: AxisName): AxesReliability | null {
  if (model.axes.length < 2) return null;
  const one = (axis: AxisName): AxisReliability => {
    const f = form(problemFromModel(buildColumnModel(model.scenario, model.combination, axis)));
    return { beta: f.beta, pf: f.pf, method: 'form', calls: f.calls, converged: f.converged };
  };
  const y = one('y');
  const z = one('z');
  return { y, z, governing: z.beta < y.beta ? 'z' : 'y', governingAtMeans };
}

/** One line for people: which axis governs and how reliable each is. */
export function axesSentence(a: AxesReliability): string {
  const b = (r: AxisReliability) => `β = ${r.beta.toFixed(2)} (pf = ${r.pf.toPrecision(2)})`;
  const means = a.governingAtMeans === a.governing ? 'also the smaller capacity at the means' : `while at the means axis ${a.governingAtMeans} has the smaller capacity`;
  return `Axis ${a.governing} governs: about y ${b(a.y)}, about z ${b(a.z)} (FORM about each axis alone; ${means}). The column fails when either axis does.`;
}
