/**
 * ReportInput → ReportDocument: the words and tables of every section. Numbers are only
 * formatted and compared here, never computed.
 */
import { measurementsSection, testPlansSection } from './measurementSections.js';
import { groupedNotes } from './groupedNotes.js';
import type { ConnectionValues, EndDescription, EvidenceMoments, InputRow, JointClassRow, MethodName, ReportInput, StrengthModelName } from './reportInput.js';
import { displayUnit, formatBeta, formatFixedColumn, formatNumber, formatProbability, formatProbabilityColumn, formatQuantity, type UnitSystem } from './displayUnits.js';
import { SECTION_TITLES, sectionOrder, type Block, type ReportDocument, type Section, type SectionId } from './reportDocument.js';
import { variableNamer } from './variableNames.js';
import { sweptName } from './charts/sweep.js';
import type { ChartSpec } from './charts/chartSpec.js';
import { STANDING_CAUTIONS } from './standingCautions.js';

export const METHOD_LABELS: Record<MethodName, string> = {
  form: 'FORM',
  sorm: 'SORM',
  is: 'Importance sampling',
  mc: 'Monte Carlo',
  subset: 'Subset simulation',
};

const STRENGTH_TEXT: Record<StrengthModelName, string> = {
  'first-yield':
    'first yield of the extreme fibre of the imperfect column: the initial bow is affine to the first buckling mode and the bending moment is amplified by 1/(1 − P/Pcr); capacity is the smallest P with P/A + M/S = fy',
  'aisc360-e3': 'nominal strength A·Fcr of AISC 360 section E3 with Fe = Pcr/A and no resistance factor (the bow is not used)',
  'en1993-a0': 'χ·A·fy of EN 1993-1-1 clause 6.3.1.2, buckling curve a0, no partial factor (the bow is not used)',
  'en1993-a': 'χ·A·fy of EN 1993-1-1 clause 6.3.1.2, buckling curve a, no partial factor (the bow is not used)',
  'en1993-b': 'χ·A·fy of EN 1993-1-1 clause 6.3.1.2, buckling curve b, no partial factor (the bow is not used)',
  'en1993-c': 'χ·A·fy of EN 1993-1-1 clause 6.3.1.2, buckling curve c, no partial factor (the bow is not used)',
  'en1993-d': 'χ·A·fy of EN 1993-1-1 clause 6.3.1.2, buckling curve d, no partial factor (the bow is not used)',
  ...equivalentBowTexts(),
  'plastic-zone':
    'peak axial load of a plastic-zone simulation about each principal axis: nonlinear beam elements with fibre sections cut from the section\'s dimensions less any corrosion loss (elastic–perfectly plastic, no root fillets or corner radii), the residual stresses of the section family (rolled I/H with a root radius, welded without one, none for hollow and solid sections), the bow affine to the first buckling mode, the end springs and eccentricities (docs/plastic-zone.md)',
};

/** The first-yield forms with the equivalent bow of EN 1993-1-1 5.3.2(11), with and without the measured bow. */
function equivalentBowTexts(): Record<Extract<StrengthModelName, `first-yield-en1993-${string}`>, string> {
  const out: Record<string, string> = {};
  for (const curve of ['a0', 'a', 'b', 'c', 'd']) {
    const base = `first yield with the equivalent bow of EN 1993-1-1 5.3.2(11), Eqs. 5.9/5.10 (curve ${curve}, γ_M1 = 1), affine to the restrained buckling mode`;
    out[`first-yield-en1993-${curve}`] = `${base}; it reproduces χ of curve ${curve} for any restraint (the measured bow is not used)`;
    out[`first-yield-en1993-${curve}-plus-bow`] = `${base}, with the measured bow added on top (a cautious reading: the equivalent bow already allows for a standard bow)`;
  }
  return out as Record<Extract<StrengthModelName, `first-yield-en1993-${string}`>, string>;
}

function modelFactorText(m: NonNullable<ReportInput['modelFactor']>): string {
  const what = m.dist === 'fixed' ? `fixed at ${formatNumber(m.mean, 3)}` : `${m.dist}, mean ${formatNumber(m.mean, 3)}, CoV ${formatNumber(m.cov, 3)}`;
  return m.source === 'default'
    ? `Model factor θ: ${what}, the default of strength model ${m.strength}, since the scenario gives none (${m.reference}).`
    : `Model factor θ: ${what}, as given in the scenario.`;
}

function unitsNote(system: UnitSystem): string {
  return system === 'si'
    ? 'Units: SI (kN, m or mm, MPa, kN·m/rad, kN/m). result.json and the CSV files are in SI base units (N, m, Pa, N·m/rad).'
    : 'Units: US customary (kip, ft or in, ksi, kip·in/rad, kip/in). result.json and the CSV files are in SI base units (N, m, Pa, N·m/rad).';
}

function endPhrase(e: EndDescription, system: UnitSystem): string {
  if (e.type === 'pinned') return 'pinned';
  if (e.type === 'fixed') return 'fixed';
  const k = e.stiffness !== undefined ? ` of mean stiffness ${formatQuantity(e.stiffness, 'rotationalStiffness', system)}` : '';
  return `rotational spring${k}${e.random ? ' (uncertain)' : ''}`;
}

function methodsRun(input: ReportInput): MethodName[] {
  const r = input.reliability;
  return (['form', 'sorm', 'is', 'mc', 'subset'] as const).filter((m) => r[m] !== undefined);
}

function joinWords(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

function section(id: SectionId, blocks: Block[]): Section {
  return { id, title: SECTION_TITLES[id], blocks };
}

function chartBlock(charts: ChartSpec[], name: string): Block[] {
  const c = charts.find((x) => x.name === name);
  return c ? [{ kind: 'chart', name: c.name, title: c.title }] : [];
}

function jobSection(input: ReportInput, system: UnitSystem): Section {
  const c = input.column;
  const t = input.reliability.target;
  const methods = joinWords(methodsRun(input).map((m) => METHOD_LABELS[m]));
  const text =
    `This report assesses the structural reliability of “${input.meta.scenarioTitle}” (${input.meta.scenarioFile}): ` +
    `a ${formatQuantity(c.length, 'length', system)} column in a ${c.frame} frame, bottom end ${endPhrase(c.ends.bottom, system)}, ` +
    `top end ${endPhrase(c.ends.top, system)}, carrying a mean axial load of ${formatQuantity(input.check.demand, 'force', system)}. ` +
    'Because the end restraint of an existing column is uncertain, its stiffness is treated as a random variable together with the material, ' +
    `imperfection, load and model uncertainties. The probability that the demand exceeds the resistance is estimated by ${methods} ` +
    `and compared with the target reliability index β = ${formatBeta(t.beta)} (${t.source}${t.note ? `, ${t.note}` : ''}). ` +
    'The restraint study then states how much end stiffness the target needs.';
  return section('job', [{ kind: 'paragraph', text }, { kind: 'paragraph', text: unitsNote(system) }]);
}

function columnSection(input: ReportInput, system: UnitSystem): Section {
  const c = input.column;
  const endRow = (name: string, e: EndDescription, R: number | null): string[] => [
    name,
    e.type,
    e.stiffness !== undefined ? formatQuantity(e.stiffness, 'rotationalStiffness', system) : e.type === 'fixed' ? '∞' : '0',
    R === null ? '∞' : formatNumber(R),
    formatNumber(e.type === 'fixed' ? 1 : e.fixity ?? 0, 3),
  ];
  const rows = [
    endRow('bottom', c.ends.bottom, input.check.restraintRatio.bottom),
    endRow('top', c.ends.top, input.check.restraintRatio.top),
  ];
  const blocks: Block[] = [
    { kind: 'sketch' },
    {
      kind: 'table',
      caption: 'End restraint at the mean values (R = k L / (E I); fixity factor R / (R + 3))',
      head: ['end', 'type', 'mean stiffness k', 'restraint ratio R', 'fixity factor'],
      rows,
      numeric: [false, false, true, true, true],
    },
  ];
  if (c.frame === 'sway') {
    const k = c.lateralStiffness ?? 0;
    blocks.push({ kind: 'paragraph', text: k > 0 ? `Sway frame: the top is held sideways by a spring of ${formatQuantity(k, 'translationalStiffness', system)}.` : 'Sway frame: the top is free to move sideways.' });
  }
  blocks.push(...connectionBlocks(input, system));
  return section('column', blocks);
}

/** The moments the end connections carry and their joint classes (EN 1993-1-8 §5.2.2.5). */
function connectionBlocks(input: ReportInput, system: UnitSystem): Block[] {
  const j = input.connections;
  if (!j) return [];
  const moment = (v: number) => (Number.isFinite(v) ? formatQuantity(v, 'moment', system) : '∞');
  const mrad = (v: number) => (Number.isFinite(v) ? `${formatNumber(v * 1e3, 3)} mrad` : '∞');
  const cls = (c: JointClassRow | undefined, which: 'classAtMean' | 'classAtLow') => (c?.[which] ?? '—');
  const basis = (v: ConnectionValues, where: string) =>
    !v.stable
      ? `at ${where} the load ${formatQuantity(v.load, 'force', system)} reaches Pcr, so the moments are unbounded`
      : `at ${where} P = ${formatQuantity(v.load, 'force', system)}${actionText(v)}, bow ${formatQuantity(v.bow, 'length', system)}, amplification ${formatNumber(v.amplification, 3)}, largest member moment ${moment(v.memberMax)}${v.memberMaxAt === null ? '' : ` at ${formatQuantity(v.memberMaxAt, 'length', system)} above the base`}`;
  // the actions beyond the axial load the moments include (beam-column; all scaled with the loads)
  const actionText = (v: ConnectionValues): string => {
    const parts: string[] = [];
    if (v.endCouples) parts.push(`end couples ${formatQuantity(v.endCouples.bottom, 'moment', system)} (bottom) and ${formatQuantity(v.endCouples.top, 'moment', system)} (top)`);
    if (v.lineLoad !== undefined) parts.push(`a line load ${formatQuantity(v.lineLoad, 'lineLoad', system)} along the height`);
    if (v.topForce !== undefined) parts.push(`a horizontal force ${formatQuantity(v.topForce, 'force', system)} at the top`);
    return parts.length ? ` with ${parts.join(', ')}` : '';
  };
  const dp = j.atDesignPoint;
  const head = ['end', 'moment, mean loads', 'rotation, mean loads', ...(dp ? ['moment, design point', 'rotation, design point'] : []), 'class at mean k', 'class at 5 % k'];
  const rows = (['bottom', 'top'] as const).map((e) => {
    const c = j.classes.find((x) => x.end === e);
    return [e, moment(j.atMean.moment[e]), mrad(j.atMean.rotation[e]), ...(dp ? [moment(dp.moment[e]), mrad(dp.rotation[e])] : []), cls(c, 'classAtMean'), cls(c, 'classAtLow')];
  });
  const notes = j.classes.map((c) => {
    const limits: string[] = [];
    if (c.rigidFrom !== null && Number.isFinite(c.rigidFrom)) limits.push(`rigid from ${formatQuantity(c.rigidFrom, 'rotationalStiffness', system)}`);
    if (c.pinnedUpTo !== null && c.pinnedUpTo > 0) limits.push(`nominally pinned up to ${formatQuantity(c.pinnedUpTo, 'rotationalStiffness', system)}`);
    return `${c.end}: ${c.note}${limits.length ? ` (${limits.join(', ')})` : ''}.`;
  });
  const text =
    'Second-order moments k·θ the end connections carry (zero at a pinned end, the fixed-end moment at a fixed end): these are the values with which each joint\'s moment resistance M_j,Rd is checked. ' +
    (input.axes ? 'They are about y, the plane of the load eccentricities and transverse actions (the column has two principal axes; its ends about z carry no moment from these actions). ' : '') +
    'The bow is affine to the first buckling mode, so the whole shape is amplified by 1/(1 − P/Pcr). ' +
    (j.atMean.endCouples || j.atMean.lineLoad !== undefined || j.atMean.topForce !== undefined
      ? 'End couples, line load and top force enter through the exact second-order solution of the spring-restrained member, each scaled with the axial load. '
      : '') +
    `Mean loads: ${basis(j.atMean, 'the mean loads')}; a serviceability-level value, not the capacity. ` +
    (dp ? `FORM design point: ${basis(dp, 'the design point')}. ` : '') +
    (j.strengthUsesBow ? '' : 'The strength curve does not use the bow; the moments use the geometric bow of the scenario. ') +
    `Joint classes by stiffness (EN 1993-1-8 §5.2.2.5) at the mean stiffness and at its 5 % fractile — ${notes.join(' ')}`;
  return [
    { kind: 'table', caption: 'End connections: moments k·θ (magnitudes) and joint classes', head, rows, numeric: [false, true, true, ...(dp ? [true, true] : []), false, false] },
    { kind: 'paragraph', text },
  ];
}

type TableBlock = Extract<Block, { kind: 'table' }>;

/** Drop columns that are empty in every row (e.g. min/max when no bounded distribution is used). */
function withoutEmptyColumns(t: TableBlock): TableBlock {
  const keep = t.head.map((_, i) => t.rows.some((r) => r[i] !== ''));
  const pick = <T>(xs: T[]) => xs.filter((_, i) => keep[i]);
  return { ...t, head: pick(t.head), rows: t.rows.map(pick), numeric: t.numeric ? pick(t.numeric) : undefined };
}

function parameterCell(row: InputRow, key: 'mean' | 'sd' | 'min' | 'max', system: UnitSystem): string {
  const v = row.distribution === 'fixed' && key === 'mean' ? row.parameters.value : row.parameters[key];
  return v === undefined ? '' : formatQuantity(v, row.kind, system);
}

const EVIDENCE_DIST: Record<string, string> = { studentt: 'Student-t', logstudentt: 'log-Student-t' };

/** What the test results changed: the data as entered, and each updated distribution before and after. */
function evidenceBlocks(input: ReportInput, system: UnitSystem): Block[] {
  const rows = input.evidence ?? [];
  if (rows.length === 0) return [];
  const dist = (m: EvidenceMoments) => `${EVIDENCE_DIST[m.distribution] ?? m.distribution}${m.dof === undefined ? '' : ` (ν = ${formatNumber(m.dof, 4)})`}`;
  const cov = (c: number) => (Number.isFinite(c) ? formatNumber(c, 3) : 'not finite');
  const table: string[][] = [];
  for (const r of rows) {
    const q = (v: number) => formatQuantity(v, r.kind, system);
    table.push([r.description, String(r.tests.length), 'before', dist(r.prior), q(r.prior.mean), cov(r.prior.cov), q(r.prior.fractile05)]);
    table.push(['', '', 'after', dist(r.posterior), q(r.posterior.mean), cov(r.posterior.cov), q(r.posterior.fractile05)]);
  }
  const data = rows.map((r) => {
    const q = (v: number) => formatQuantity(v, r.kind, system);
    const error = r.measurementSd !== undefined ? `, measurement sd ${q(r.measurementSd)}` : r.measurementCov !== undefined ? `, measurement CoV ${formatNumber(r.measurementCov, 3)}` : '';
    return `${r.description} (${r.tested === 'this_one' ? 'tests of this item' : 'tests of similar items'}): ${r.tests.map(q).join(', ')}${error}. Update: ${r.method}.${r.source ? ` Source: ${r.source}.` : ''}`;
  });
  const blocks: Block[] = [
    {
      kind: 'table',
      caption: 'Updated by test results: the posterior predictive distribution replaces the distribution as written in every method (conjugate updating, docs/evidence.md).',
      head: ['variable', 'tests', '', 'distribution', 'mean', 'CoV', '5 % fractile'],
      rows: table,
      numeric: [false, true, false, false, true, true, true],
    },
    { kind: 'list', items: data },
  ];
  if (rows.some((r) => r.posterior.distribution === 'logstudentt')) {
    blocks.push({ kind: 'paragraph', text: 'A log-Student-t has no finite mean: its mean and CoV above are those of the lognormal with the same ln-location and ln-scale; its 5 % fractile and every probability are exact.' });
  }
  return blocks;
}

function inputsSection(input: ReportInput, system: UnitSystem): Section {
  const rows = input.inputs.map((r) => [
    r.path,
    r.description + (r.asWritten ? ` (given as ${r.asWritten})` : ''),
    r.distribution,
    parameterCell(r, 'mean', system),
    parameterCell(r, 'sd', system),
    r.parameters.cov === undefined ? '' : formatNumber(r.parameters.cov, 3),
    parameterCell(r, 'min', system),
    parameterCell(r, 'max', system),
    r.source ?? '',
  ]);
  const blocks: Block[] = [
    withoutEmptyColumns({
      kind: 'table',
      caption: 'Every value of the scenario under its path in the scenario file; sd and CoV are both given for each random variable, whichever the file stated.',
      head: ['variable', 'description', 'distribution', 'mean or value', 'sd', 'CoV', 'min', 'max', 'source of the statistics'],
      rows,
      numeric: [false, false, false, true, true, true, true, true, false],
    }),
  ];
  blocks.push(...evidenceBlocks(input, system));
  blocks.push({
    kind: 'paragraph',
    text:
      input.correlation.length === 0
        ? 'The random variables are independent.'
        : `Correlation (Pearson, physical variables; Nataf transformation): ${input.correlation.map((c) => `${variableNamer(input)(c.a)} with ${variableNamer(input)(c.b)}: ρ = ${formatNumber(c.rho, 2)}`).join('; ')}. All other pairs are independent.`,
  });
  return section('inputs', blocks);
}

function modelSection(input: ReportInput, system: UnitSystem, charts: ChartSpec[]): Section {
  const c = input.column;
  const k = input.check;
  const items = [
    `Prismatic column of length L = ${formatQuantity(c.length, 'length', system)}, bending stiffness E·I about the buckling axis, axial load applied at the top, concentric; the loads are summed.`,
    c.frame === 'braced'
      ? 'Braced frame: the two ends do not move sideways relative to each other.'
      : 'Sway frame: the top may move sideways, resisted only by the lateral spring.',
    'End restraint as elastic rotational springs; Pcr is the smallest positive elastic critical load of the restrained column and K = π / (L √(Pcr / E·I)).',
    `Strength (${c.strengthModel}): ${STRENGTH_TEXT[c.strengthModel]}.`,
    'Limit state g = θ × capacity − Σ loads, θ = model_factor; failure when g ≤ 0.',
    ...(input.modelFactor ? [modelFactorText(input.modelFactor)] : []),
    'Every random variable is mapped to independent standard normals by the Nataf transformation; the sampling methods draw from seeded streams, so a run is reproducible.',
  ];
  const modes = k.modeShapes.map((m) => `${m.mode}: ${formatQuantity(m.criticalLoad, 'force', system, 4)}`).join(', ');
  const table: Block = {
    kind: 'table',
    caption: 'Deterministic check, every random variable at its mean',
    head: ['quantity', 'value'],
    rows: [
      ['critical load Pcr', formatQuantity(k.criticalLoad, 'force', system, 4)],
      ['effective length factor K', formatNumber(k.effectiveLengthFactor, 3)],
      ['restraint ratio R (bottom / top)', `${k.restraintRatio.bottom === null ? '∞' : formatNumber(k.restraintRatio.bottom)} / ${k.restraintRatio.top === null ? '∞' : formatNumber(k.restraintRatio.top)}`],
      ['fixity factor (bottom / top)', `${formatNumber(k.fixityFactor.bottom, 3)} / ${formatNumber(k.fixityFactor.top, 3)}`],
      ['capacity', formatQuantity(k.capacity, 'force', system, 4)],
      ['demand (sum of mean loads)', formatQuantity(k.demand, 'force', system, 4)],
      ['mean-value ratio = demand / (mean θ × capacity), not a design check', formatNumber(k.utilization, 3)],
      ...(modes ? [['critical loads of the modes shown', modes]] : []),
    ],
    numeric: [false, true],
  };
  return section('model', [{ kind: 'list', items }, table, ...chartBlock(charts, 'mode-shapes')]);
}

function methodsSection(input: ReportInput, charts: ChartSpec[]): Section {
  const r = input.reliability;
  const rows: string[][] = [];
  const pfs: number[] = [];
  if (r.form) rows.push(['FORM', formatBeta(r.form.beta), formatProbability(r.form.pf), 'none (approximation)', formatNumber(r.form.calls, 6), r.form.converged ? `converged in ${r.form.iterations} iterations` : Number.isFinite(r.form.beta) ? `NOT converged after ${r.form.iterations} iterations` : `no design point (searched ${r.form.iterations} iterations)`]);
  if (r.sorm) rows.push([r.sorm.formula ? `SORM (${r.sorm.formula})` : METHOD_LABELS.sorm, formatBeta(r.sorm.beta), formatProbability(r.sorm.pf), 'none (approximation)', formatNumber(r.sorm.calls, 6), 'curvature correction at the FORM design point']);
  if (r.is) rows.push([METHOD_LABELS.is, formatBeta(r.is.beta), formatProbability(r.is.pf), `CoV ${(100 * r.is.cov).toFixed(1)} %`, formatNumber(r.is.calls, 6), 'centred on the design point']);
  const zb = r.mc?.zeroFailureBound;
  if (r.mc && zb) rows.push([METHOD_LABELS.mc, `> ${formatBeta(zb.beta)}`, `< ${formatProbability(zb.pf)}`, 'no failure: one-sided 95 % bound (exact binomial; about 3/n)', formatNumber(r.mc.samples, 6), '0 failures']);
  else if (r.mc) rows.push([METHOD_LABELS.mc, formatBeta(r.mc.beta), formatProbability(r.mc.pf), `CoV ${(100 * r.mc.cov).toFixed(1)} %; 95 % CI ${formatProbability(r.mc.ci95[0])} to ${formatProbability(r.mc.ci95[1])}`, formatNumber(r.mc.samples, 6), `${formatNumber(r.mc.failures, 6)} failures`]);
  if (r.subset) rows.push([METHOD_LABELS.subset, formatBeta(r.subset.beta), formatProbability(r.subset.pf), `CoV ${(100 * r.subset.cov).toFixed(1)} %`, formatNumber(r.subset.calls, 6), r.subset.levels !== undefined ? `${r.subset.levels} levels` : '']);
  // one form per pf column: re-format the plain numbers when any is scientific
  for (const m of ['form', 'sorm', 'is', 'mc', 'subset'] as const) if (r[m] && !(m === 'mc' && zb)) pfs.push(r[m]!.pf);
  const column = formatProbabilityColumn(pfs);
  let k = 0;
  for (const row of rows) if (!row[2].startsWith('<')) row[2] = column[k++] ?? row[2];
  const combos: Block[] = r.combinations
    ? [
        {
          kind: 'table',
          caption: "Load combinations (Turkstra's rule): the leading load at its reference-period maximum, the others at companion values; FORM β of each. The system β is that of their series system.",
          head: ['leading load', 'β', 'pf'],
          rows: [
            ...r.combinations.map((c) => [c.governing ? `${c.leading} (lowest β)` : c.leading, formatBeta(c.beta), formatProbability(c.pf)]),
            ...(r.system ? [[`series system (${METHOD_LABELS[r.system.method]})`, formatBeta(r.system.beta), formatProbability(r.system.pf)]] : []),
          ],
          numeric: [false, true, true],
        },
      ]
    : [];
  return section('methods', [
    ...combos,
    {
      kind: 'table',
      caption: 'β of the sampling methods is the generalised index −Φ⁻¹(pf)',
      head: ['method', 'β', 'pf', 'uncertainty', 'limit-state calls', 'note'],
      rows,
      numeric: [false, true, true, false, true, false],
    },
    { kind: 'callout', tone: r.agreement.consistent ? 'ok' : 'warn', text: `${methodsRun(input).length > 1 ? 'Agreement' : 'Estimate'}: ${r.agreement.text}` },
    ...chartBlock(charts, 'samples-histogram'),
    ...chartBlock(charts, 'mc-convergence'),
  ]);
}

function targetSection(input: ReportInput): Section {
  const r = input.reliability;
  const g = r.governing;
  const meets = g.beta >= r.target.beta;
  const text =
    `β ${g.lowerBound ? '>' : '='} ${formatBeta(g.beta)} (${g.basis ?? METHOD_LABELS[g.method]}, pf ${g.lowerBound ? '<' : '='} ${formatProbability(g.pf)}) against the target β = ${formatBeta(r.target.beta)} ` +
    `from ${r.target.source}${r.target.note ? ` (${r.target.note})` : ''}: the column ${meets ? 'MEETS' : 'FALLS SHORT OF'} the target` +
    `${meets ? '' : ` by Δβ = ${formatBeta(r.target.beta - g.beta)}`}.`;
  return section('target', [
    { kind: 'callout', tone: meets ? 'ok' : 'warn', text },
    {
      kind: 'paragraph',
      text: 'The target is a reference value for the consequence class and reference period stated; which target applies to this structure is for the responsible engineer to decide.',
    },
    ...strengthModelBlocks(input),
  ]);
}

function leadingDriver(input: ReportInput): { variable: string; share: number; side: string } | null {
  const top = [...input.sensitivity.importance].sort((a, b) => b.alphaSquared - a.alphaSquared)[0];
  if (!top) return null;
  return { variable: variableNamer(input)(top.variable), share: top.alphaSquared, side: top.alpha < 0 ? 'unfavourable when low' : 'unfavourable when high' };
}

function sensitivitySection(input: ReportInput, charts: ChartSpec[]): Section {
  const s = input.sensitivity;
  const name = variableNamer(input);
  const top = leadingDriver(input);
  const blocks: Block[] = [];
  if (top) blocks.push({ kind: 'paragraph', text: `The variable that matters most is the ${top.variable} (${top.side}), with ${(100 * top.share).toFixed(0)} % of the importance (α²). Better statistics for the leading variables change the answer most.` });
  blocks.push(...chartBlock(charts, 'tornado-utilization'), ...chartBlock(charts, 'tornado-capacity'), ...chartBlock(charts, 'conditional-beta'), ...chartBlock(charts, 'importance'));
  if (s.elasticities.length > 0) {
    blocks.push({
      kind: 'table',
      caption: 'Elasticities of β (FORM): relative change of β per relative change of the mean or standard deviation',
      head: ['variable', 'mean elasticity', 'sd elasticity'],
      rows: ((m, d) => s.elasticities.map((e, i) => [name(e.variable), m[i], d[i]]))(formatFixedColumn(s.elasticities.map((e) => e.mean), 3), formatFixedColumn(s.elasticities.map((e) => e.sd), 3)),
      numeric: [false, true, true],
    });
  }
  if (s.sobol) blocks.push(...sobolBlocks(input, s.sobol));
  return section('sensitivity', blocks);
}

function restraintSection(input: ReportInput, system: UnitSystem, charts: ChartSpec[]): Section {
  const st = input.restraint;
  if (!st) return section('restraint', [{ kind: 'paragraph', text: 'No end is given as a rotational spring, so no restraint study was made.' }]);
  const q = (v: number | undefined) => (v === undefined ? '' : formatQuantity(v, 'rotationalStiffness', system));
  const rows = st.ends.map((e) => {
    const req = st.required[e];
    const r = st.requirement?.[e];
    return [
      e,
      req === null || req === undefined ? 'not reachable by restraint' : formatQuantity(req, 'rotationalStiffness', system),
      r ? formatNumber(r.cov, 2) : '',
      q(r?.characteristic),
      q(r?.design),
      st.fixityFactor[e] === undefined ? '' : formatNumber(st.fixityFactor[e] as number, 3),
    ];
  });
  const ks: string[] = [];
  if (st.effectiveLengthFactor !== null) ks.push(`K at the required means: ${formatNumber(st.effectiveLengthFactor, 3)}.`);
  if (st.designK !== undefined && st.designK !== null) ks.push(`K_d at the design stiffness: ${formatNumber(st.designK, 3)}, the K to use with the other design values of the same method (EN 1990 Annex C).`);
  if (st.equivalentK !== null) ks.push(`K at which β reaches the target if the stiffness were known exactly (this scenario's statistics and strength model); not a partial-factor code check: ${formatNumber(st.equivalentK, 3)}.`);
  const ax = st.axis;
  if (ax) {
    ks.unshift(
      `The stiffnesses are about axis ${ax.axis} (${ax.basis === 'asked' ? 'as asked' : 'the governing axis'}); K is about ${ax.axis}. β is the whole column's; axis ${ax.otherAxis} alone has β = ${formatBeta(ax.otherBeta)} at every stiffness studied${ax.capsTarget ? `, below the target, so no stiffness about ${ax.axis} reaches it` : ''}.`,
    );
  }
  return section('restraint', [
    { kind: 'callout', tone: 'info', text: st.sentence },
    {
      kind: 'table',
      caption: `Stiffness${ax ? ` about ${ax.axis}` : ''} at which β equals the target ${formatBeta(st.targetBeta)}${st.method ? ` (solved with ${st.method.toUpperCase()}${st.confirmation ? `; assessed there, ${st.confirmation.method.toUpperCase()} gives β = ${formatBeta(st.confirmation.beta)}` : ''})` : ''}`,
      head: ['end', 'required mean', 'CoV', '5 % characteristic', 'design (EN 1990 Annex C)', 'fixity factor'],
      rows,
      numeric: [false, true, true, true, true, true],
    },
    ...(ks.length > 0 ? [{ kind: 'paragraph' as const, text: ks.join(' ') }] : []),
    ...chartBlock(charts, 'restraint-curve'),
    ...chartBlock(charts, 'restraint-contour'),
    ...chartBlock(charts, 'restraint-cov'),
  ]);
}

/** A Sobol index shown inside [0, 1], where it must lie; a clipped estimate is marked with *. */
function sobolCell(v: number): { text: string; clipped: boolean } {
  const c = Math.min(1, Math.max(0, v));
  return { text: `${c.toFixed(2)}${c !== v ? '*' : ''}`, clipped: c !== v };
}

function sobolBlocks(input: ReportInput, sobol: NonNullable<ReportInput['sensitivity']['sobol']>): Block[] {
  const name = variableNamer(input);
  let clipped = false;
  let inverted = false;
  const cell = (v: number) => {
    const c = sobolCell(v);
    clipped ||= c.clipped;
    return c.text;
  };
  const ci = (c: [number, number]) => `${cell(c[0])} to ${cell(c[1])}`;
  const rows = sobol.rows.map((r) => {
    if (r.first > r.total) inverted = true;
    return [name(r.variable), cell(r.first), ci(r.firstCi95), cell(r.total), ci(r.totalCi95)];
  });
  const widest = Math.max(0, ...sobol.rows.map((r) => r.totalCi95[1] - r.totalCi95[0]));
  const notes = [
    'Sobol indices split the variance of g over the whole range of the inputs; the importance factors α² weigh each variable at the design point, in the tail where failure happens. They answer different questions and may rank the variables differently: a variable that dominates the scatter of g can matter little at failure, and the reverse.',
    `With ${formatNumber(sobol.samples, 6)} samples the 95 % intervals are up to ${widest.toFixed(2)} wide: indices closer together than that are not told apart.`,
  ];
  if (clipped) notes.push('* An index cannot lie outside [0, 1]; the estimate fell outside by sampling error and is shown clipped.');
  if (inverted) notes.push('A first-order index above its total index is sampling error too: the exact first-order index never exceeds the total.');
  return [
    { kind: 'table', caption: `Sobol indices of g (${formatNumber(sobol.samples, 6)} samples; 95 % confidence intervals)`, head: ['variable', 'first order', '95 % CI', 'total', '95 % CI'], rows, numeric: [false, true, true, true, true] },
    { kind: 'paragraph', text: notes.join(' ') },
  ];
}

/** The β put against the target, as text: a bound reads '> 4.67'. */
function governingBeta(input: ReportInput): string {
  const g = input.reliability.governing;
  return `${g.lowerBound ? '> ' : ''}${formatBeta(g.beta)}`;
}

function restraintLine(input: ReportInput, system: UnitSystem): string {
  const st = input.restraint;
  if (!st) return 'no end is a rotational spring, so no restraint requirement applies';
  const parts = st.ends.map((e) => {
    const req = st.required[e];
    return req === null || req === undefined ? `${e}: not reachable, even rigid ends fall short of the target` : `${e}: at least ${formatQuantity(req, 'rotationalStiffness', system)} mean stiffness`;
  });
  const k = st.equivalentK === null ? '' : `; a deterministic check may then use K ≤ ${formatNumber(st.equivalentK, 3)}`;
  const ax = st.axis;
  if (ax?.capsTarget) return `none about ${ax.axis}: axis ${ax.otherAxis} alone has β = ${formatBeta(ax.otherBeta)}, below the target`;
  return `${ax ? `about ${ax.axis}: ` : ''}${parts.join('; ')}${k}`;
}

/** Which principal axis governs, with each axis's own β (FORM about that axis alone). */
function axesLine(a: NonNullable<ReportInput['axes']>): string {
  const other = a.governing === 'y' ? 'z' : 'y';
  const means = a.governingAtMeans === a.governing ? 'it also has the smaller capacity at the means' : `at the means axis ${a.governingAtMeans} has the smaller capacity`;
  return `${a.governing}: β ${formatBeta(a[a.governing].beta)} about ${a.governing} alone, ${formatBeta(a[other].beta)} about ${other} alone (FORM; the column fails when either axis does; ${means})`;
}

function resultSection(input: ReportInput, system: UnitSystem): Section {
  const r = input.reliability;
  const g = r.governing;
  const t = r.target;
  const meets = g.beta >= t.beta;
  const shortBy = formatBeta(t.beta - g.beta);
  const headline = meets
    ? `MEETS the target: β ${governingBeta(input)} ≥ ${formatBeta(t.beta)}`
    : g.lowerBound
      ? `NOT SHOWN to meet the target: only β ${governingBeta(input)} is known, below ${formatBeta(t.beta)}`
      : `FALLS SHORT of the target by Δβ = ${shortBy}: β ${governingBeta(input)} < ${formatBeta(t.beta)}`;
  const items: { label: string; text: string }[] = [
    { label: 'Reliability index', text: `β ${governingBeta(input)} (pf ${g.lowerBound ? '< ' : '= '}${formatProbability(g.pf)}) by ${METHOD_LABELS[g.method]}` },
    { label: 'Target', text: `β = ${formatBeta(t.beta)}, ${t.source}${t.note ? ` (${t.note})` : ''}` },
    { label: 'Governing method', text: `${g.basis ?? METHOD_LABELS[g.method]}: ${r.agreement.text}` },
    ...(input.axes ? [{ label: 'Governing axis', text: axesLine(input.axes) }] : []),
    { label: 'Restraint required', text: restraintLine(input, system) },
  ];
  const top = leadingDriver(input);
  if (top) items.push({ label: 'Leading driver', text: `${top.variable}, ${(100 * top.share).toFixed(0)} % of the importance α² (${top.side})` });
  const caution = { label: 'Caution', text: 'this supports, and does not replace, the judgement of a licensed engineer; local codes govern' };
  const sw = input.sweep;
  if (input.subject === 'sweep' && sw) {
    // a sweep answers "in which cases": the count leads, the scenario as written follows
    const all = sw.meeting.count === sw.meeting.total;
    return section('result', [
      {
        kind: 'result',
        tone: all ? 'ok' : 'warn',
        headline: `${sw.meeting.count} of ${sw.meeting.total} cases meet the target β = ${formatBeta(t.beta)}`,
        items: [
          { label: 'Sweep', text: `β by ${METHOD_LABELS[sw.method]}.${crossingText(input, system)}` },
          { label: 'Base scenario', text: `${headline}; the lines below are for the scenario as written` },
          ...items,
          caution,
        ],
      },
    ]);
  }
  items.push(caution);
  return section('result', [{ kind: 'result', tone: meets ? 'ok' : 'warn', headline, items }]);
}

function partialFactorsSection(input: ReportInput, system: UnitSystem): Section {
  const code = (c?: { symbol: string; value: number }) => (c ? `${c.symbol} = ${formatNumber(c.value, 3)}` : '');
  const name = variableNamer(input);
  const rows = input.partialFactors.map((p) => [
    name(p.variable),
    p.side ?? p.role,
    p.note === undefined ? p.basis : p.note.startsWith(p.basis) ? p.note : `${p.basis} (${p.note})`,
    formatQuantity(p.referenceValue, p.kind, system, 4),
    formatQuantity(p.designValue, p.kind, system, 4),
    p.factor === null ? '—' : formatNumber(p.factor, 3),
    code(p.code),
    p.designToMean === undefined ? '' : formatNumber(p.designToMean, 3),
  ]);
  const rf = input.resistanceFactor;
  if (rf) {
    rows.push(['resistance θ × capacity', 'resistance', 'every resistance-side variable and the bow at its characteristic value', formatQuantity(rf.characteristic, 'force', system, 4), formatQuantity(rf.design, 'force', system, 4), formatNumber(rf.factor, 3), code(rf.code), '']);
  }
  const sources = [...new Set([...input.partialFactors.flatMap((p) => (p.code ? [p.code.source] : [])), ...(rf?.code ? [rf.code.source] : [])])];
  return section('partialFactors', [
    {
      kind: 'paragraph',
      text: 'The FORM design point gives the value of each variable at the most likely failure. Characteristic values follow EN 1990 4.1.2: the 5 % fractile for resistance-side variables, the 95 % fractile for variable loads and the mean for permanent loads; the bow, an action-effect variable rather than a load, takes the fractile on the side its design value went. The implied partial factor is characteristic ÷ design value on the resistance side and design ÷ characteristic value for loads and the bow; a variable whose design value helps (a load below its mean) implies none. The design/mean ratio only says how far FORM moved a variable: it is not a partial factor.',
    },
    {
      kind: 'table',
      head: ['variable', 'side', 'characteristic value', 'characteristic', 'design value', 'implied partial factor', 'code factor', 'design/mean ratio'],
      rows,
      numeric: [false, false, false, true, true, true, false, true],
    },
    ...(sources.length > 0 ? [{ kind: 'paragraph' as const, text: `Code factors for comparison: ${sources.join('; ')}. ASCE 7 and AISC 360 apply their factors to nominal values, which are close to, but not defined as, these fractiles.` }] : []),
  ]);
}

/** β of the same column under each strength model: how much the verdict rests on that choice. */
function strengthModelBlocks(input: ReportInput): Block[] {
  const rows = input.strengthModels;
  if (!rows || rows.length === 0) return [];
  return [
    {
      kind: 'table',
      caption: ['β (FORM) of the same column under each strength model, each with its own model factor', ...groupedNotes(rows)].join('; ') + '.',
      head: ['strength model', 'β (FORM)', 'model factor mean', 'model factor CoV', 'model factor from'],
      rows: rows.map((r) => [
        `${r.strength}${r.chosen ? ' (chosen)' : ''}`,
        r.beta === null ? `— (${r.note ?? 'not evaluated'})` : formatBeta(r.beta),
        formatNumber(r.modelFactorMean, 3),
        formatNumber(r.modelFactorCov, 3),
        r.modelFactorSource === 'default' ? 'the model\'s default' : 'the scenario',
      ]),
      numeric: [false, true, true, true, false],
    },
  ];
}

/** The longest case list printed as an appendix; longer ones stay in sweep.csv. */
const MAX_PRINTED_CASES = 60;

function crossingText(input: ReportInput, system: UnitSystem): string {
  const sw = input.sweep!;
  if (sw.varied.length !== 1) return '';
  const v = sw.varied[0];
  if (sw.crossings.length === 0) return ` β does not cross the target within the range swept.`;
  const at = sw.crossings.map((x) => formatQuantity(x, v.kind, system, 4));
  return ` β crosses the target at ${sweptName(input, v.path)} = ${joinWords(at)} (interpolated linearly between neighbouring cases).`;
}

function sweepSection(input: ReportInput, system: UnitSystem, charts: ChartSpec[]): Section | null {
  const sw = input.sweep;
  if (!sw) return null;
  const names = sw.varied.map((v) => sweptName(input, v.path));
  const t = input.reliability.target;
  const listed = sw.rows.length <= MAX_PRINTED_CASES ? 'Every case is listed in the appendix and in sweep.csv.' : `The ${sw.rows.length} cases are in sweep.csv (too many to print).`;
  return section('sweep', [
    { kind: 'callout', tone: sw.meeting.count === sw.meeting.total ? 'ok' : 'warn', text: `${sw.meeting.count} of ${sw.meeting.total} cases meet the target β = ${formatBeta(t.beta)} (${t.source}).${crossingText(input, system)}` },
    { kind: 'paragraph', text: `β by ${METHOD_LABELS[sw.method]} as ${joinWords(names)} ${sw.varied.length > 1 ? 'vary' : 'varies'}, every other input as in the scenario. ${listed}` },
    ...chartBlock(charts, 'sweep'),
  ]);
}

function sweepCasesSection(input: ReportInput, system: UnitSystem): Section | null {
  const sw = input.sweep;
  if (!sw || sw.rows.length > MAX_PRINTED_CASES) return null;
  const head = [...sw.varied.map((v) => `${sweptName(input, v.path)} [${displayUnit(v.kind, system).label || '–'}]`), 'β', 'pf', 'mean-value ratio'];
  const pf = formatProbabilityColumn(sw.rows.map((r) => r.pf));
  const u = formatFixedColumn(sw.rows.map((r) => r.utilization), 3);
  const rows = sw.rows.map((r, i) => [
    ...sw.varied.map((v) => formatNumber(r.values[v.path] / displayUnit(v.kind, system).siPerUnit, 4)),
    formatBeta(r.beta),
    pf[i],
    u[i],
  ]);
  return section('sweepCases', [{ kind: 'table', caption: `Every case of the sweep (${METHOD_LABELS[sw.method]}); the same numbers, in SI, are in sweep.csv.`, head, rows, numeric: head.map(() => true) }]);
}

function cautionsSection(input: ReportInput): Section {
  const blocks: Block[] = [{ kind: 'list', items: [...STANDING_CAUTIONS] }];
  if (input.cautions.length > 0) blocks.push({ kind: 'paragraph', text: 'For this run:' }, { kind: 'list', items: input.cautions });
  return section('cautions', blocks);
}

function reproducibilitySection(input: ReportInput): Section {
  const m = input.meta;
  return section('reproducibility', [
    {
      kind: 'table',
      head: ['item', 'value'],
      rows: [
        ['tool version', `stanchion ${m.toolVersion}`],
        ['scenario file', m.scenarioFile],
        ['scenario SHA-256', m.scenarioSha256],
        ['seed', String(m.seed)],
        ['date', m.date],
      ],
    },
    { kind: 'code', text: m.commandLine },
    { kind: 'paragraph', text: 'Running this command with the same tool version, seed and scenario file (same SHA-256) reproduces every number in this report.' },
  ]);
}

export function buildReportDocument(input: ReportInput, system: UnitSystem, charts: ChartSpec[]): ReportDocument {
  const build: Record<SectionId, () => Section | null> = {
    result: () => resultSection(input, system),
    job: () => jobSection(input, system),
    column: () => columnSection(input, system),
    inputs: () => inputsSection(input, system),
    model: () => modelSection(input, system, charts),
    methods: () => methodsSection(input, charts),
    target: () => targetSection(input),
    sensitivity: () => sensitivitySection(input, charts),
    restraint: () => restraintSection(input, system, charts),
    measurements: () => measurementsSection(input, system, charts, (m) => METHOD_LABELS[m]),
    testPlans: () => testPlansSection(input, charts),
    partialFactors: () => partialFactorsSection(input, system),
    sweep: () => sweepSection(input, system, charts),
    sweepCases: () => sweepCasesSection(input, system),
    cautions: () => cautionsSection(input),
    reproducibility: () => reproducibilitySection(input),
  };
  const sections = sectionOrder(input.subject ?? 'assessment')
    .map((id) => build[id]())
    .filter((s): s is Section => s !== null);
  return {
    title: input.meta.scenarioTitle,
    subtitle: `Column reliability assessment · stanchion ${input.meta.toolVersion} · ${input.meta.date}`,
    sections,
  };
}
