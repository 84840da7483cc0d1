/**
 * Every value of a scenario by its contract path (docs/scenario-format.md), in one stable order:
 * section, material, ends (bottom, top, lateral), bow, out-of-plumb (when given), loads in file order
 * (each followed by its eccentricities, applied moments, line load and top force when it has any), model factor.
 */
import { flexibleComponents, seriesComponentPath } from './seriesEnd.js';
import type { End, Load, RandomVariable, Scalar, Scenario, SectionGeometry } from './types.js';

/** The path prefix of everything about the second principal axis. */
export const AXIS_Z = 'column.axis_z';
export const CORROSION = 'column.section.corrosion';

/** The corrosion-loss scalars by path: one uniform loss, or the flanges' and the web's. */
export function corrosionScalars(g: SectionGeometry | undefined): NamedScalar[] {
  const c = g?.corrosion;
  if (c === undefined) return [];
  if (!c.perPlate) return [{ path: `${CORROSION}.loss`, scalar: c.primary }];
  return [
    { path: `${CORROSION}.flange`, scalar: c.primary },
    { path: `${CORROSION}.web`, scalar: c.secondary },
  ];
}

export interface NamedScalar {
  readonly path: string;
  readonly scalar: Scalar;
}

function endScalar(end: End, path: string): NamedScalar[] {
  if (end.type === 'rotation') return [{ path: `${path}.rotation`, scalar: end.k }];
  if (end.type === 'ratio') return [{ path: `${path}.${end.from}`, scalar: end.input }];
  if (end.type === 'series') return flexibleComponents(end.components).map((c) => ({ path: seriesComponentPath(path, c.name), scalar: c.k }));
  return [];
}

/** A load's applied moments, line load and top force by path (the actions converted in time with the load). */
export function loadActionScalars(load: Load): NamedScalar[] {
  const out: NamedScalar[] = [];
  if (load.moments !== undefined) {
    out.push({ path: `${load.path}.moments.top`, scalar: load.moments.top });
    out.push({ path: `${load.path}.moments.bottom`, scalar: load.moments.bottom });
  }
  if (load.transverse !== undefined) out.push({ path: `${load.path}.transverse`, scalar: load.transverse });
  if (load.horizontal !== undefined) out.push({ path: `${load.path}.horizontal`, scalar: load.horizontal });
  return out;
}

/** Every scalar (fixed or random), column length included as a fixed value. */
export function listScalars(s: Omit<Scenario, 'correlation'>): NamedScalar[] {
  const c = s.column;
  const list: NamedScalar[] = [
    { path: 'column.length', scalar: { kind: 'fixed', value: c.length } },
    { path: 'column.section.area', scalar: c.section.area },
    { path: 'column.section.inertia', scalar: c.section.inertia },
    { path: 'column.section.section_modulus', scalar: c.section.sectionModulus },
  ];
  if (c.section.inertiaZ !== undefined) list.push({ path: 'column.section.inertia_z', scalar: c.section.inertiaZ });
  if (c.section.sectionModulusZ !== undefined) list.push({ path: 'column.section.section_modulus_z', scalar: c.section.sectionModulusZ });
  list.push(...corrosionScalars(c.section.geometry));
  list.push(
    { path: 'column.material.E', scalar: c.material.E },
    { path: 'column.material.fy', scalar: c.material.fy },
    ...endScalar(c.ends.bottom, 'column.ends.bottom'),
    ...endScalar(c.ends.top, 'column.ends.top'),
  );
  if (c.ends.lateral !== null) list.push({ path: 'column.ends.lateral', scalar: c.ends.lateral });
  list.push({ path: 'column.imperfection.bow', scalar: c.bow });
  if (c.outOfPlumb !== undefined) list.push({ path: 'column.imperfection.out_of_plumb', scalar: c.outOfPlumb });
  const z = c.axisZ;
  if (z !== undefined) {
    list.push(...endScalar(z.ends.bottom, `${AXIS_Z}.ends.bottom`), ...endScalar(z.ends.top, `${AXIS_Z}.ends.top`));
    if (z.ends.lateral !== null) list.push({ path: `${AXIS_Z}.ends.lateral`, scalar: z.ends.lateral });
    list.push({ path: `${AXIS_Z}.imperfection.bow`, scalar: z.bow });
  }
  for (const load of s.loads) {
    list.push({ path: load.path, scalar: load.value });
    if (load.eccentricity !== undefined) {
      list.push({ path: `${load.path}.eccentricity.top`, scalar: load.eccentricity.top });
      list.push({ path: `${load.path}.eccentricity.bottom`, scalar: load.eccentricity.bottom });
    }
    for (const { path, scalar } of loadActionScalars(load)) list.push({ path, scalar });
  }
  list.push({ path: 'model_factor', scalar: s.modelFactor });
  return list;
}

/** The random variables by path, in the order of listScalars. */
export function randomVariables(s: Omit<Scenario, 'correlation'>): RandomVariable[] {
  const out: RandomVariable[] = [];
  for (const { path, scalar } of listScalars(s)) if (scalar.kind === 'random') out.push({ path, spec: scalar.spec });
  return out;
}

/** The scalar at a contract path, or undefined. */
export function scalarAt(s: Omit<Scenario, 'correlation'>, path: string): Scalar | undefined {
  return listScalars(s).find((n) => n.path === path)?.scalar;
}
