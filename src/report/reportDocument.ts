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
  | { kind: 'code'; text: string };

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

/** Section headings, in order; the sweep section appears only when a sweep ran. */
export const SECTION_TITLES = {
  job: 'The job',
  column: 'The column',
  inputs: 'Inputs',
  model: 'Model and assumptions',
  methods: 'Reliability by method',
  target: 'Reliability against the target',
  sensitivity: 'Sensitivity',
  restraint: 'Restraint justification',
  partialFactors: 'Characteristic values and implied partial factors',
  sweep: 'Parameter sweep',
  cautions: 'Cautions',
  reproducibility: 'Reproducibility',
} as const;

export type SectionId = keyof typeof SECTION_TITLES;
