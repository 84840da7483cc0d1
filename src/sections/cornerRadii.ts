/**
 * Corner radii of rectangular hollow sections when the user gives none: the values the product
 * standards use for calculating section properties (from memory):
 * - hot-finished, EN 10210-2: outer ro = 1.5 t, inner ri = 1.0 t;
 * - cold-formed, EN 10219-2: ro = 2 t (t ≤ 6 mm), 2.5 t (6 < t ≤ 10 mm), 3 t (t > 10 mm); ri = ro − t.
 */
export type HollowFinish = 'hot' | 'cold';

export function defaultCornerRadii(finish: HollowFinish, t: number): { ro: number; ri: number } {
  if (finish === 'hot') return { ro: 1.5 * t, ri: t };
  const ro = t <= 0.006 + 1e-12 ? 2 * t : t <= 0.01 + 1e-12 ? 2.5 * t : 3 * t;
  return { ro, ri: ro - t };
}
