import type { QuantityKind } from '../report/reportInput.js';

/** What a scenario value measures, by its contract path, so it can be shown in display units. */
export function quantityKindOf(path: string): QuantityKind {
  if (path.startsWith('loads.')) {
    if (path.includes('.eccentricity.')) return 'length';
    if (path.endsWith('.transverse')) return 'lineLoad';
    if (path.includes('.moments.')) return 'moment';
    return 'force'; // the axial load and the horizontal force at the top
  }
  if (/^column\.(axis_z\.)?ends\.(bottom|top)\.(rotation$|series\.)/.test(path)) return 'rotationalStiffness';
  if (path.startsWith('column.section.corrosion.')) return 'length';
  switch (path) {
    case 'column.length':
    case 'column.imperfection.bow':
    case 'column.axis_z.imperfection.bow':
      return 'length';
    case 'column.imperfection.out_of_plumb':
      return 'dimensionless';
    case 'column.section.area':
      return 'area';
    case 'column.section.inertia':
    case 'column.section.inertia_z':
      return 'inertia';
    case 'column.section.section_modulus':
    case 'column.section.section_modulus_z':
      return 'sectionModulus';
    case 'column.axis_z.ends.lateral':
      return 'translationalStiffness';
    case 'column.material.E':
    case 'column.material.fy':
      return 'stress';
    case 'column.ends.lateral':
      return 'translationalStiffness';
    default:
      return 'dimensionless';
  }
}

/** Plain words for a path, for tables people read. */
export function describePath(path: string): string {
  const action = /^loads\.([^.]+)\.(transverse|horizontal|moments\.(?:top|bottom))$/.exec(path);
  if (action) {
    const what: Record<string, string> = {
      transverse: 'line load along the height',
      horizontal: 'horizontal force at the top',
      'moments.top': 'applied moment at the top',
      'moments.bottom': 'applied moment at the bottom',
    };
    return `load: ${action[1]}, ${what[action[2]!]}`;
  }
  if (path.startsWith('loads.')) return `load: ${path.slice(6)}`;
  if (path.startsWith('column.axis_z.')) return `${describePath(path.replace('column.axis_z.', 'column.'))} (about z)`;
  const series = /^column\.ends\.(bottom|top)\.series\.(.+)$/.exec(path);
  if (series) return `${series[1]} end, ${series[2].replace(/_/g, ' ')} rotational stiffness (in series)`;
  const words: Record<string, string> = {
    'column.length': 'column length',
    'column.section.area': 'cross-section area',
    'column.section.inertia': 'second moment of area',
    'column.section.section_modulus': 'elastic section modulus',
    'column.section.inertia_z': 'second moment of area about z',
    'column.section.section_modulus_z': 'elastic section modulus about z',
    'column.section.corrosion.loss': 'corrosion loss per face',
    'column.section.corrosion.flange': 'corrosion loss per face of the flanges',
    'column.section.corrosion.web': 'corrosion loss per face of the web',
    'column.material.E': 'elastic modulus',
    'column.material.fy': 'yield strength',
    'column.ends.bottom.rotation': 'bottom connection rotational stiffness',
    'column.ends.top.rotation': 'top connection rotational stiffness',
    'column.ends.bottom.fixity': 'bottom fixity factor',
    'column.ends.top.fixity': 'top fixity factor',
    'column.ends.bottom.alignment_g': 'bottom alignment-chart G',
    'column.ends.top.alignment_g': 'top alignment-chart G',
    'column.ends.lateral': 'lateral spring at the top',
    'column.imperfection.bow': 'bow imperfection',
    'column.imperfection.out_of_plumb': 'out-of-plumb angle',
    model_factor: 'model factor',
  };
  return words[path] ?? path;
}
