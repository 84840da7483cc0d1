/**
 * ReportDocument → a compact Markdown summary (charts linked as PNG files). Every text of the
 * document is plain text, much of it from the scenario: markdownText escapes it all, so only
 * the markup added here is markup.
 */
import type { Block, ReportDocument } from './reportDocument.js';
import { codeFence, markdownInline, markdownText as md } from './markdownText.js';

function table(b: Extract<Block, { kind: 'table' }>): string {
  const align = b.head.map((_, i) => (b.numeric?.[i] ? '---:' : '---'));
  const lines = [`| ${b.head.map(markdownInline).join(' | ')} |`, `| ${align.join(' | ')} |`, ...b.rows.map((r) => `| ${r.map(markdownInline).join(' | ')} |`)];
  return (b.caption ? `*${markdownInline(b.caption)}*\n\n` : '') + lines.join('\n');
}

function block(b: Block): string {
  switch (b.kind) {
    case 'paragraph':
      return md(b.text);
    case 'callout':
      return `> ${b.tone === 'warn' ? `**Attention:** ${markdownInline(b.text)}` : md(b.text)}`;
    case 'list':
      return b.items.map((i) => `- ${md(i)}`).join('\n');
    case 'table':
      return table(b);
    case 'code': {
      const fence = codeFence(b.text);
      return `${fence}\n${b.text}\n${fence}`;
    }
    case 'result':
      return [`> **${markdownInline(b.headline)}**`, '>', ...b.items.map((i) => `> - **${markdownInline(i.label)}:** ${markdownInline(i.text)}`)].join('\n');
    case 'sketch':
      return '![Column sketch](charts/column-sketch.png)';
    case 'chart':
      return `![${markdownInline(b.title)}](charts/${encodeURIComponent(b.name)}.png)`;
  }
}

export function renderMarkdown(doc: ReportDocument): string {
  const parts = [`# ${md(doc.title)}`, `*${markdownInline(doc.subtitle)}*`];
  for (const s of doc.sections) parts.push(`## ${md(s.title)}`, ...s.blocks.map(block));
  return parts.join('\n\n') + '\n';
}
