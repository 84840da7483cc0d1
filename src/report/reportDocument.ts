/**
 * The report as a plain document tree: sections of blocks. Built once from ReportInput
 * (reportSections.ts), then rendered to HTML (htmlReport.ts) and Markdown
 * (markdownReport.ts), so both always say the same thing.
 */

export type Block =
  | { kind: 'paragraph'; text: string }
  | { kind: 'callout'; tone: 'ok' | 'warn' | 'info'; text: string }
  | { kind: 'list'; items: string[] }
  | { kind: 'table'; caption?: string; head: string[]; rows: string[][]; numeric?: boolean[] }
  | { kind: 'chart'; name: string; title: string } // charts/<name>.svg
  | { kind: 'sketch' } // the column sketch
  | { kind: 'code'; text: string }
  /** The result box that opens every report: a headline and labelled lines. */
  | { kind: 'result'; tone: 'ok' | 'warn'; headline: string; items: { label: string; text: string }[] };

export interface Section {
  id: string; // anchor
  title: string;
  blocks: Block[];
}

export interface ReportDocument {
  title: string;
  subtitle: string;
  sections: Section[];
}

/** Section headings; the order depends on the report's subject (sectionOrder). */
export const SECTION_TITLES = {
  result: 'Result',
  job: 'The job',
  column: 'The column',
  inputs: 'Appendix: scenario inputs',
  model: 'Model and assumptions',
  methods: 'Reliability by method',
  target: 'Reliability against the target',
  sensitivity: 'Sensitivity',
  restraint: 'Restraint justification',
  measurements: 'What the measurements changed',
  testPlans: 'Which test buys most',
  partialFactors: 'Characteristic values and implied partial factors',
  sweep: 'Parameter sweep',
  sweepCases: 'Appendix: sweep cases',
  cautions: 'Cautions',
  reproducibility: 'Appendix: reproducibility',
} as const;

export type SectionId = keyof typeof SECTION_TITLES;

/**
 * Reading order: the result, the report's own subject, the supporting details, then the
 * scenario appendix. Sections without content (no sweep, a short case list) are left out later.
 */
export function sectionOrder(subject: 'assessment' | 'restraint' | 'sweep'): SectionId[] {
  const details: SectionId[] = ['methods', 'sensitivity', 'partialFactors', 'job', 'column', 'model', 'cautions'];
  const appendix: SectionId[] = subject === 'sweep' ? ['inputs', 'sweepCases', 'reproducibility'] : ['inputs', 'reproducibility'];
  const subjectFirst: Record<typeof subject, SectionId[]> = {
    assessment: ['target', 'measurements', 'testPlans', 'restraint'],
    restraint: ['restraint', 'target'],
    sweep: ['sweep', 'target', 'restraint'],
  };
  return ['result', ...subjectFirst[subject], ...details, ...appendix];
}
