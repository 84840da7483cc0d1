/** ReportDocument → a compact Markdown summary (charts linked as PNG files). */
import type { Block, ReportDocument } from './reportDocument.js';

function cellText(s: string): string {
  return s.replace(/\|/g, '\\|').replace(/\n/g, ' ');
}

function table(b: Extract<Block, { kind: 'table' }>): string {
  const align = b.head.map((_, i) => (b.numeric?.[i] ? '---:' : '---'));
  const lines = [`| ${b.head.map(cellText).join(' | ')} |`, `| ${align.join(' | ')} |`, ...b.rows.map((r) => `| ${r.map(cellText).join(' | ')} |`)];
  return (b.caption ? `*${b.caption}*\n\n` : '') + lines.join('\n');
}

function block(b: Block): string {
  switch (b.kind) {
    case 'paragraph':
      return b.text;
    case 'callout':
      return `> ${b.tone === 'warn' ? '**Attention:** ' : ''}${b.text}`;
    case 'list':
      return b.items.map((i) => `- ${i}`).join('\n');
    case 'table':
      return table(b);
    case 'code':
      return '```\n' + b.text + '\n```';
    case 'sketch':
      return '![Column sketch](charts/column-sketch.png)';
    case 'chart':
      return `![${b.title}](charts/${b.name}.png)`;
  }
}

export function renderMarkdown(doc: ReportDocument): string {
  const parts = [`# ${doc.title}`, `*${doc.subtitle}*`];
  for (const s of doc.sections) parts.push(`## ${s.title}`, ...s.blocks.map(block));
  return parts.join('\n\n') + '\n';
}
