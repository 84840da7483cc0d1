/**
 * The physical domain of each value by its contract path (the same rules the reader applies), so
 * that a study which perturbs a distribution can tell whether the perturbed one is still admissible.
 */
import type { Domain } from './readScalar.js';

export function fieldDomain(path: string): Domain {
  if (path.startsWith('loads.') && path.includes('.eccentricity.')) return 'any';
  // transverse actions may act on either side (their sign is their direction)
  if (/^loads\.[^.]+\.(transverse|horizontal|moments\.(top|bottom))$/.test(path)) return 'any';
  if (path === 'column.imperfection.out_of_plumb') return 'any';
  if (path.startsWith('loads.')) return 'load';
  if (path.endsWith('.fixity')) return 'fixity';
  if (path.endsWith('.alignment_g')) return 'alignment';
  if (path.endsWith('.rotation') || /^column\.(axis_z\.)?ends\.(bottom|top)\.series\./.test(path) || /^column\.(axis_z\.)?ends\.lateral$/.test(path)) return 'nonnegative';
  if (path.startsWith('column.section.corrosion.')) return 'nonnegative';
  if (path === 'column.imperfection.bow' || path === 'column.axis_z.imperfection.bow') return 'any';
  return 'positive'; // section, material, model_factor
}
