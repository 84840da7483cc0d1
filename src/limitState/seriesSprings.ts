/**
 * The components of each series end at a point x, and the effective stiffness they make
 * (1/k = Σ 1/k_i, scenario/seriesEnd.ts): what `check` prints so a reviewer sees which flexibility
 * governs. Allocates: for reports, not for hot loops.
 */
import { seriesComponentPath, seriesStiffness } from '../scenario/seriesEnd.js';
import type { ColumnModel } from './columnModel.js';

export interface SeriesComponentValue {
  name: string;
  /** N·m/rad; null for a rigid component */
  stiffness: number | null;
  random: boolean;
}

export interface SeriesSpringSummary {
  components: SeriesComponentValue[];
  /** N·m/rad; the stiffness the end's R = kL/EI uses */
  effective_stiffness: number;
}

export type SeriesSprings = { bottom: SeriesSpringSummary | null; top: SeriesSpringSummary | null };

export function seriesSpringsAt(model: ColumnModel, x: Float64Array): SeriesSprings {
  const summary = (key: 'bottom' | 'top'): SeriesSpringSummary | null => {
    const end = model.scenario.column.ends[key];
    if (end.type !== 'series') return null;
    const components = end.components.map((c): SeriesComponentValue => {
      if (c.k === 'rigid') return { name: c.name, stiffness: null, random: false };
      if (c.k.kind === 'fixed') return { name: c.name, stiffness: c.k.value, random: false };
      const i = model.names.indexOf(seriesComponentPath(`column.ends.${key}`, c.name));
      return { name: c.name, stiffness: x[i], random: true };
    });
    const flexible = components.filter((c) => c.stiffness !== null).map((c) => c.stiffness as number);
    return { components, effective_stiffness: seriesStiffness(flexible) };
  };
  return { bottom: summary('bottom'), top: summary('top') };
}
