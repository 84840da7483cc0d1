import { ratioText } from './ratioText.js';
import { deterministicCheck, checkJson, type AxisCheck, type CheckResult } from '../limitState/deterministicCheck.js';
import { axisCautions } from '../limitState/axisCautions.js';
import { buildColumnModel } from '../limitState/columnModel.js';
import { loadScenario } from '../scenario/loadScenario.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { End, Scenario } from '../scenario/types.js';
import { formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import { readScenarioText } from './readScenarioText.js';
import { CAUTION, textTable } from './textTable.js';
import { connectionBasis, connectionLines } from './connectionText.js';
import { strengthUsesBow } from '../mechanics/strengthModelKind.js';

export interface CheckOptions {
  json?: boolean;
  units?: UnitSystem;
}

function endLabel(end: End, system: UnitSystem): string {
  switch (end.type) {
    case 'pinned':
      return 'pinned';
    case 'fixed':
      return 'fixed';
    case 'rotation':
      return end.k.kind === 'fixed'
        ? `spring ${formatQuantity(end.k.value, 'rotationalStiffness', system)}`
        : `spring, mean ${formatQuantity(makeDistribution(end.k.spec).mean, 'rotationalStiffness', system)} (${end.k.spec.dist})`;
    case 'ratio':
      return `${end.from === 'fixity' ? 'fixity factor' : 'alignment-chart G'} given`;
    case 'series':
      return `${end.components.length} springs in series`;
  }
}

function num(v: number | null, digits = 3): string {
  if (v === null || !Number.isFinite(v)) return '∞';
  return v.toPrecision(digits);
}

/** K with three decimals; a near-mechanism's K ~ 1e150 in three significant digits instead. */
function kText(K: number): string {
  return Number.isFinite(K) && K < 1e6 ? K.toFixed(3) : num(K);
}

/** The section from its dimensions and both axes at the means (nothing for a one-axis section by properties). */
function axisLines(s: Scenario, c: CheckResult, system: UnitSystem): string[] {
  const q = (v: number, kind: Parameters<typeof formatQuantity>[1]) => formatQuantity(v, kind, system);
  const lines: string[] = [];
  const p = c.sectionProperties;
  if (p !== null) {
    const m = p.at_mean_loss;
    lines.push('');
    lines.push(`  section from its dimensions (${p.shape}): A = ${q(m.A, 'area')}, Iy = ${q(m.Iy, 'inertia')}, Iz = ${q(m.Iz, 'inertia')}, Wel,y = ${q(m.Wel_y, 'sectionModulus')}, Wel,z = ${q(m.Wel_z, 'sectionModulus')}`);
    if (p.corrosion !== null) {
      const k = p.corrosion;
      const loss = k.per_plate ? `flanges ${q(k.loss_per_face.primary, 'length')}, web ${q(k.loss_per_face.secondary, 'length')}` : q(k.loss_per_face.primary, 'length');
      lines.push(`    at the mean corrosion loss per face (${loss}${k.zone_height !== null ? `, zone up to ${q(k.zone_height, 'length')} above the base` : ''}); sound section A = ${q(p.gross.A, 'area')}, Iy = ${q(p.gross.Iy, 'inertia')}, Iz = ${q(p.gross.Iz, 'inertia')}`);
    }
  }
  const a = c.axes;
  const z = s.column.axisZ;
  if (a === null || z === undefined) return lines;
  lines.push('');
  lines.push('  buckling about each principal axis (the capacity is the smaller):');
  const row = (x: AxisCheck, ends: string): string[] => [
    x.axis === a.governing ? `${x.axis} (governs)` : x.axis, ends, x.strength, num(x.restraint_ratio.bottom), num(x.restraint_ratio.top), q(x.critical_load, 'force'), kText(x.effective_length_factor), q(x.capacity, 'force'), ratioText(x.utilization),
  ];
  lines.push(
    textTable(
      [
        ['axis', 'ends (bottom / top)', 'strength', 'R bottom', 'R top', 'Pcr', 'K', 'capacity', 'ratio'],
        row(a.y, `${endLabel(s.column.ends.bottom, system)} / ${endLabel(s.column.ends.top, system)}`),
        row(a.z, `${endLabel(z.ends.bottom, system)} / ${endLabel(z.ends.top, system)}`),
      ],
      '    ',
    ),
  );
  lines.push('  the end table above and the connection moments below are about y');
  return lines;
}

export function formatCheck(s: Scenario, c: CheckResult, system: UnitSystem): string {
  const q = (v: number, kind: Parameters<typeof formatQuantity>[1]) => formatQuantity(v, kind, system);
  const L = s.column.length;
  const lines: string[] = [];
  // the end table is about y; with two axes the top-level values are the governing axis'
  const yEnds = c.axes !== null ? c.axes.y : c;
  lines.push(`stanchion check: ${s.title}`);
  lines.push(
    `  ${s.column.frame} column, L = ${q(L, 'length')}, strength model ${s.strength}; every random variable at its mean`,
  );
  lines.push('');
  lines.push(
    textTable([
      ['end', 'restraint', 'R = kL/EI', 'fixity X = R/(R+3)'],
      ['bottom', endLabel(s.column.ends.bottom, system), num(yEnds.restraint_ratio.bottom), yEnds.fixity_factor.bottom.toFixed(3)],
      ['top', endLabel(s.column.ends.top, system), num(yEnds.restraint_ratio.top), yEnds.fixity_factor.top.toFixed(3)],
    ]),
  );
  for (const key of ['bottom', 'top'] as const) {
    const series = c.seriesSprings[key];
    if (!series) continue;
    const parts = series.components.map((p) => `${p.name} ${p.stiffness === null ? 'rigid' : q(p.stiffness, 'rotationalStiffness')}${p.random ? ' (mean)' : ''}`);
    lines.push(`  ${key} end, springs in series (1/k = Σ 1/k_i): ${parts.join(' + ')} → effective k = ${q(series.effective_stiffness, 'rotationalStiffness')}`);
  }
  if (c.lateral_ratio !== null) lines.push(`  lateral spring at the top: T = kT L³/EI = ${num(c.lateral_ratio)}`);
  lines.push(...axisLines(s, c, system));
  lines.push('');
  const m1 = c.modes[0];
  const rows: string[][] = [
    ['critical load Pcr', q(c.critical_load, 'force')],
    ['effective length factor K', `${kText(c.effective_length_factor)}  (K L = ${q(c.effective_length_factor * L, 'length')})`],
  ];
  if (m1) {
    const infl = m1.inflection_points.length ? m1.inflection_points.map((x) => q(x, 'length')).join(', ') : 'none inside the column';
    rows.push(['inflection points (above base)', infl]);
    rows.push([
      'distance between inflections',
      m1.effective_length_from_inflections ? q(m1.effective_length, 'length') : `— (equivalent pinned length ${q(m1.effective_length, 'length')})`,
    ]);
  }
  rows.push(['curvature factor c', c.curvature_factor.toFixed(3)]);
  if (c.axes !== null) rows.unshift(['governing axis', `${c.axes.governing} (the values below are about ${c.axes.governing})`]);
  rows.push(['capacity', q(c.capacity, 'force')]);
  rows.push(['demand (sum of loads)', q(c.demand, 'force')]);
  rows.push(['mean-value ratio', `${ratioText(c.utilization)}  = demand / (model factor ${c.model_factor.toPrecision(3)} × capacity), every value at its mean`]);
  lines.push(textTable(rows));
  lines.push('');
  lines.push('  connection moments under the mean loads (second order; the values to check each joint\'s moment resistance M_j,Rd against):');
  lines.push(...connectionLines(c.connections, system, c.jointClasses, '    '));
  lines.push(connectionBasis(c.connections, 'the mean loads', system) + (c.connections.stable && c.connections.bow > 0 ? '. A serviceability-level value, not the capacity: `assess` gives them at the FORM design point.' : ''));
  if (!strengthUsesBow(s.strength) && c.connections.bow > 0) lines.push('  (the bow is the geometric bow of the scenario; the strength curve itself does not use it)');
  if (c.modes.length > 1) {
    lines.push('');
    lines.push('  higher modes:');
    lines.push(
      textTable(
        c.modes.slice(1).map((m) => [`mode ${m.mode}`, q(m.critical_load, 'force'), `K = ${kText(m.effective_length_factor)}`]),
        '    ',
      ),
    );
  }
  lines.push('');
  for (const caution of axisCautions(s)) lines.push(`Caution: ${caution}`);
  lines.push(CAUTION);
  lines.push('');
  // every value at its mean, no partial factor: this is not a design check, and the line says so
  lines.push(`result: mean-value ratio ${ratioText(c.utilization)} (demand / resistance at the means; not a design check: use assess for the reliability against a target), K = ${kText(c.effective_length_factor)}`);
  return lines.join('\n') + '\n';
}

export function runCheck(file: string, opts: CheckOptions): void {
  const { text, fileName } = readScenarioText(file);
  const scenario = loadScenario(text, fileName);
  const model = buildColumnModel(scenario);
  const result = deterministicCheck(model);
  if (opts.json) {
    const cautions = axisCautions(scenario);
    process.stdout.write(JSON.stringify({ check: { ...checkJson(result), ...(cautions.length > 0 ? { cautions } : {}) } }, null, 2) + '\n');
    return;
  }
  process.stdout.write(formatCheck(scenario, result, opts.units ?? scenario.displayUnits));
}
