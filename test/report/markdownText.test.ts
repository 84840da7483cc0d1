// source: CommonMark spec 0.31 §2.4 (backslash escapes), §4.2 (ATX headings), §5.2 (list items),
// §6.5 (raw HTML); common practice: user text in a generated document shows as text.
import { describe, expect, it } from 'vitest';
import { codeFence, markdownInline, markdownText } from '../../src/report/markdownText.js';
import { renderMarkdown } from '../../src/report/markdownReport.js';

describe('markdownText', () => {
  it('turns HTML and Markdown punctuation into literal text', () => {
    expect(markdownInline('<script>alert(1)</script> & co')).toBe('&lt;script&gt;alert(1)&lt;/script&gt; &amp; co');
    expect(markdownInline('[x](http://e.invalid) ![i](y.png)')).toBe('\\[x\\](http://e.invalid) !\\[i\\](y.png)');
    expect(markdownInline('*a* **b** `c` ~d~ a|b \\')).toBe('\\*a\\* \\*\\*b\\*\\* \\`c\\` \\~d\\~ a\\|b \\\\');
    expect(markdownInline('_u_ model_factor')).toBe('\\_u\\_ model_factor');
    expect(markdownInline('two\nlines\r\nhere')).toBe('two lines here');
  });

  it('keeps a text from opening a block at the start of a line', () => {
    expect(markdownText('# title')).toBe('\\# title');
    expect(markdownText('- item')).toBe('\\- item');
    expect(markdownText('+ item')).toBe('\\+ item');
    expect(markdownText('=== ')).toBe('\\=== ');
    expect(markdownText('12. item')).toBe('12\\. item');
    expect(markdownText('> quote')).toBe('&gt; quote');
    expect(markdownText('    code')).toBe('code');
    expect(markdownInline('-0.90')).toBe('-0.90'); // a table cell keeps its negative number
  });

  it('fences code with more backticks than the code holds', () => {
    expect(codeFence('stanchion assess a.yaml')).toBe('```');
    expect(codeFence('a ```` b')).toBe('`````');
  });

  it('renders a document whose texts are hostile as plain text', () => {
    const md = renderMarkdown({
      title: '<img src=x onerror=alert(1)>\n# injected',
      subtitle: 'sub *x*',
      sections: [
        {
          id: 'job',
          title: 'The job',
          blocks: [
            { kind: 'paragraph', text: '## not a heading' },
            { kind: 'list', items: ['- nested?', '[link](http://e.invalid)'] },
            { kind: 'table', head: ['item', 'value'], rows: [['target source', 'a | b'], ['β', '-0.90']] },
            { kind: 'code', text: 'stanchion assess "```\n# x"' },
          ],
        },
      ],
    });
    expect(md).not.toMatch(/<img|^# injected|^## not/m);
    expect(md.split('\n')[0]).toBe('# &lt;img src=x onerror=alert(1)&gt; # injected');
    expect(md).toContain('\n\\## not a heading\n');
    expect(md).toContain('- \\- nested?\n- \\[link\\](http://e.invalid)');
    expect(md).toContain('| target source | a \\| b |\n| β | -0.90 |');
    expect(md).toContain('````\nstanchion assess "```\n# x"\n````');
  });
});
