/**
 * ReportInput → ReportDocument: the words and tables of every section. Numbers are only
 * formatted and compared here, never computed.
 */
import type { EndDescription, InputRow, MethodName, ReportInput, StrengthModelName } from './reportInput.js';
import { displayUnit, formatBeta, formatNumber, formatProbability, formatQuantity, type UnitSystem } from './displayUnits.js';
import { SECTION_TITLES, type Block, type ReportDocument, type Section, type SectionId } from './reportDocument.js';
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
};

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
  return section('column', blocks);
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
  ]);
  const blocks: Block[] = [
    withoutEmptyColumns({
      kind: 'table',
      head: ['variable', 'description', 'distribution', 'mean or value', 'sd', 'CoV', 'min', 'max'],
      rows,
      numeric: [false, false, false, true, true, true, true, true],
    }),
  ];
  blocks.push({
    kind: 'paragraph',
    text:
      input.correlation.length === 0
        ? 'The random variables are independent.'
        : `Correlation (Pearson, physical variables; Nataf transformation): ${input.correlation.map((c) => `${c.a} with ${c.b}: ρ = ${formatNumber(c.rho, 2)}`).join('; ')}. All other pairs are independent.`,
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
      ['utilization = demand / (mean θ × capacity)', formatNumber(k.utilization, 3)],
      ...(modes ? [['critical loads of the modes shown', modes]] : []),
    ],
    numeric: [false, true],
  };
  return section('model', [{ kind: 'list', items }, table, ...chartBlock(charts, 'mode-shapes')]);
}

function methodsSection(input: ReportInput, charts: ChartSpec[]): Section {
  const r = input.reliability;
  const rows: string[][] = [];
  if (r.form) rows.push(['FORM', formatBeta(r.form.beta), formatProbability(r.form.pf), 'none (approximation)', formatNumber(r.form.calls, 6), r.form.converged ? `converged in ${r.form.iterations} iterations` : Number.isFinite(r.form.beta) ? `NOT converged after ${r.form.iterations} iterations` : `no design point (searched ${r.form.iterations} iterations)`]);
  if (r.sorm) rows.push([r.sorm.formula ? `SORM (${r.sorm.formula})` : METHOD_LABELS.sorm, formatBeta(r.sorm.beta), formatProbability(r.sorm.pf), 'none (approximation)', formatNumber(r.sorm.calls, 6), 'curvature correction at the FORM design point']);
  if (r.is) rows.push([METHOD_LABELS.is, formatBeta(r.is.beta), formatProbability(r.is.pf), `CoV ${(100 * r.is.cov).toFixed(1)} %`, formatNumber(r.is.calls, 6), 'centred on the design point']);
  if (r.mc) rows.push([METHOD_LABELS.mc, formatBeta(r.mc.beta), formatProbability(r.mc.pf), `CoV ${(100 * r.mc.cov).toFixed(1)} %; 95 % CI ${formatProbability(r.mc.ci95[0])} to ${formatProbability(r.mc.ci95[1])}`, formatNumber(r.mc.samples, 6), `${formatNumber(r.mc.failures, 6)} failures`]);
  if (r.subset) rows.push([METHOD_LABELS.subset, formatBeta(r.subset.beta), formatProbability(r.subset.pf), `CoV ${(100 * r.subset.cov).toFixed(1)} %`, formatNumber(r.subset.calls, 6), r.subset.levels !== undefined ? `${r.subset.levels} levels` : '']);
  return section('methods', [
    {
      kind: 'table',
      caption: 'β of the sampling methods is the generalised index −Φ⁻¹(pf)',
      head: ['method', 'β', 'pf', 'uncertainty', 'limit-state calls', 'note'],
      rows,
      numeric: [false, true, true, false, true, false],
    },
    { kind: 'callout', tone: r.agreement.consistent ? 'ok' : 'warn', text: `Agreement: ${r.agreement.text}` },
    ...chartBlock(charts, 'samples-histogram'),
    ...chartBlock(charts, 'mc-convergence'),
  ]);
}

function targetSection(input: ReportInput): Section {
  const r = input.reliability;
  const g = r.governing;
  const meets = g.beta >= r.target.beta;
  const text =
    `β = ${formatBeta(g.beta)} (${METHOD_LABELS[g.method]}, pf = ${formatProbability(g.pf)}) against the target β = ${formatBeta(r.target.beta)} ` +
    `from ${r.target.source}${r.target.note ? ` (${r.target.note})` : ''}: the column ${meets ? 'MEETS' : 'FALLS SHORT OF'} the target` +
    `${meets ? '' : ` by Δβ = ${formatBeta(r.target.beta - g.beta)}`}.`;
  return section('target', [
    { kind: 'callout', tone: meets ? 'ok' : 'warn', text },
    {
      kind: 'paragraph',
      text: 'The target is a reference value for the consequence class and reference period stated; which target applies to this structure is for the responsible engineer to decide.',
    },
  ]);
}

function sensitivitySection(input: ReportInput, charts: ChartSpec[]): Section {
  const s = input.sensitivity;
  const top = [...s.importance].sort((a, b) => b.alphaSquared - a.alphaSquared)[0];
  const blocks: Block[] = [];
  if (top) blocks.push({ kind: 'paragraph', text: `The variable that matters most is ${top.variable}, with ${(100 * top.alphaSquared).toFixed(0)} % of the importance (α²). Better statistics for the leading variables change the answer most.` });
  blocks.push(...chartBlock(charts, 'tornado-utilization'), ...chartBlock(charts, 'tornado-capacity'), ...chartBlock(charts, 'conditional-beta'), ...chartBlock(charts, 'importance'));
  if (s.elasticities.length > 0) {
    blocks.push({
      kind: 'table',
      caption: 'Elasticities of β (FORM): relative change of β per relative change of the mean or standard deviation',
      head: ['variable', 'mean elasticity', 'sd elasticity'],
      rows: s.elasticities.map((e) => [e.variable, formatNumber(e.mean, 3), formatNumber(e.sd, 3)]),
      numeric: [false, true, true],
    });
  }
  if (s.sobol) {
    const ci = (c: [number, number]) => `${formatNumber(c[0], 2)} to ${formatNumber(c[1], 2)}`;
    blocks.push({
      kind: 'table',
      caption: `Sobol indices of g (${formatNumber(s.sobol.samples, 6)} samples; 95 % confidence intervals)`,
      head: ['variable', 'first order', '95 % CI', 'total', '95 % CI'],
      rows: s.sobol.rows.map((r) => [r.variable, formatNumber(r.first, 2), ci(r.firstCi95), formatNumber(r.total, 2), ci(r.totalCi95)]),
      numeric: [false, true, true, true, true],
    });
  }
  return section('sensitivity', blocks);
}

function restraintSection(input: ReportInput, system: UnitSystem, charts: ChartSpec[]): Section {
  const st = input.restraint;
  if (!st) return section('restraint', [{ kind: 'paragraph', text: 'No end is given as a rotational spring, so no restraint study was made.' }]);
  const rows = st.ends.map((e) => {
    const req = st.required[e];
    return [
      e,
      req === null || req === undefined ? 'not reachable (even rigid ends fall short)' : formatQuantity(req, 'rotationalStiffness', system),
      st.fixityFactor[e] === undefined ? '' : formatNumber(st.fixityFactor[e] as number, 3),
    ];
  });
  return section('restraint', [
    { kind: 'callout', tone: 'info', text: st.sentence },
    {
      kind: 'table',
      caption: `Mean rotational stiffness at which FORM β equals the target ${formatBeta(st.targetBeta)}`,
      head: ['end', 'required mean stiffness', 'fixity factor'],
      rows,
      numeric: [false, true, true],
    },
    {
      kind: 'paragraph',
      text: `At the required stiffness K = ${st.effectiveLengthFactor === null ? '—' : formatNumber(st.effectiveLengthFactor, 3)}; a deterministic check that takes the connections as known exactly reaches the same target with K = ${st.equivalentK === null ? '—' : formatNumber(st.equivalentK, 3)} (the effective length factor a code check may use at most).`,
    },
    ...chartBlock(charts, 'restraint-curve'),
  ]);
}

function partialFactorsSection(input: ReportInput, system: UnitSystem): Section {
  const rows = input.partialFactors.map((p) => [
    p.variable,
    p.role,
    p.note === undefined ? p.basis : p.note.startsWith(p.basis) ? p.note : `${p.basis} (${p.note})`,
    formatQuantity(p.referenceValue, p.kind, system, 4),
    formatQuantity(p.designValue, p.kind, system, 4),
    formatNumber(p.factor, 3),
  ]);
  return section('partialFactors', [
    {
      kind: 'paragraph',
      text: 'The FORM design point gives the value of each variable at the most likely failure. The implied partial factor is reference ÷ design value where low values are adverse (strengths, stiffnesses, model factor) and design ÷ reference value where high values are adverse (loads, bow). A factor below 1 means the design value is milder than the reference value.',
    },
    { kind: 'table', head: ['variable', 'role', 'basis', 'reference value', 'design value', 'implied factor'], rows, numeric: [false, false, false, true, true, true] },
  ]);
}

function sweepSection(input: ReportInput, system: UnitSystem, charts: ChartSpec[]): Section | null {
  const sw = input.sweep;
  if (!sw) return null;
  const head = [...sw.varied.map((v) => `${v.path} [${displayUnit(v.kind, system).label || '–'}]`), 'β', 'pf', 'utilization'];
  const rows = sw.rows.map((r) => [
    ...sw.varied.map((v) => formatNumber(r.values[v.path] / displayUnit(v.kind, system).siPerUnit, 4)),
    formatBeta(r.beta),
    formatProbability(r.pf),
    formatNumber(r.utilization, 3),
  ]);
  return section('sweep', [
    { kind: 'paragraph', text: `β by ${METHOD_LABELS[sw.method]} as ${joinWords(sw.varied.map((v) => v.path))} ${sw.varied.length > 1 ? 'vary' : 'varies'}, every other input as in the scenario.` },
    ...chartBlock(charts, 'sweep'),
    { kind: 'table', head, rows, numeric: head.map(() => true) },
  ]);
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
  const sections = [
    jobSection(input, system),
    columnSection(input, system),
    inputsSection(input, system),
    modelSection(input, system, charts),
    methodsSection(input, charts),
    targetSection(input),
    sensitivitySection(input, charts),
    restraintSection(input, system, charts),
    partialFactorsSection(input, system),
    sweepSection(input, system, charts),
    cautionsSection(input),
    reproducibilitySection(input),
  ].filter((s): s is Section => s !== null);
  return {
    title: input.meta.scenarioTitle,
    subtitle: `Column reliability assessment · stanchion ${input.meta.toolVersion} · ${input.meta.date}`,
    sections,
  };
}
