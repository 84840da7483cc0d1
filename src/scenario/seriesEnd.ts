/**
 * A rotational end made of flexibilities in series: the connection, the beam end it frames into,
 * the foundation's rotation. Springs in series add their flexibilities, 1/k = Σ 1/k_i (common
 * practice; EN 1993-1-8 §6.3.1 assembles a joint's rotational stiffness from its components the
 * same way, from memory). A rigid component adds nothing; a component of zero stiffness makes the
 * whole end pinned.
 */
import { meanOf } from './readScalar.js';
import type { End, Scalar, SeriesComponent } from './types.js';

/** 1/Σ(1/k_i) over the first `count` values (Infinity when there are none, 0 when one is 0). */
export function seriesStiffness(k: ArrayLike<number>, count = k.length): number {
  if (count === 1) return k[0]; // one spring is itself, bit for bit (1/(1/k) may differ in the last bit)
  let flexibility = 0;
  for (let i = 0; i < count; i++) flexibility += 1 / k[i];
  return 1 / flexibility;
}

/** The contract path of a component's variable. */
export function seriesComponentPath(endPath: string, name: string): string {
  return `${endPath}.series.${name}`;
}

/** The components that carry a value (rigid ones add no flexibility and have no variable). */
export function flexibleComponents(components: readonly SeriesComponent[]): { name: string; k: Scalar }[] {
  const out: { name: string; k: Scalar }[] = [];
  for (const c of components) if (c.k !== 'rigid') out.push({ name: c.name, k: c.k });
  return out;
}

/** The end's effective stiffness with every component at its mean (N·m/rad). */
export function seriesStiffnessAtMeans(end: Extract<End, { type: 'series' }>): number {
  return seriesStiffness(flexibleComponents(end.components).map((c) => meanOf(c.k)));
}

/**
 * Which components a restraint study scales: the one named `connection` when there is one (the
 * component a reviewer argues about; the beam and the foundation are taken as given), else every
 * component by the same factor (which scales the effective stiffness by that factor).
 */
export function scaledComponents(end: Extract<End, { type: 'series' }>): string[] {
  const flexible = flexibleComponents(end.components).map((c) => c.name);
  return flexible.includes('connection') ? ['connection'] : flexible;
}
