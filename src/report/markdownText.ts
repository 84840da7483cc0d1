/**
 * Text → Markdown that shows exactly that text. The report document holds plain text (titles,
 * sources and descriptions come straight from the scenario), so summary.md must not let a title
 * become a heading, a link, an image, a table break or raw HTML. HTML's three specials become
 * entities; Markdown's punctuation gets a backslash (CommonMark §2.4 backslash escapes); line
 * breaks become spaces, since every block is one line.
 */

const ASCII_WORD = /[A-Za-z0-9]/;

/** Escaped for a place inside a line (a table cell, after other markup). */
export function markdownInline(text: string): string {
  let out = '';
  const s = text.replace(/\r\n?|\n/g, ' ');
  for (let i = 0; i < s.length; i++) {
    const c = s[i]!;
    switch (c) {
      case '&':
        out += '&amp;';
        break;
      case '<':
        out += '&lt;';
        break;
      case '>':
        out += '&gt;';
        break;
      case '\\':
      case '`':
      case '*':
      case '[':
      case ']':
      case '|':
      case '~':
        out += `\\${c}`;
        break;
      case '_':
        // inside a word (model_factor) an underscore never starts emphasis: keep it readable
        out += ASCII_WORD.test(s[i - 1] ?? '') && ASCII_WORD.test(s[i + 1] ?? '') ? '_' : '\\_';
        break;
      default:
        out += c;
    }
  }
  return out;
}

/** Escaped for the start of a line too: nothing may open a heading, list or thematic break. */
export function markdownText(text: string): string {
  // leading spaces would make an indented code block; they mean nothing in plain text
  return markdownInline(text.trimStart()).replace(/^([#+=-])/, '\\$1').replace(/^(\d+)([.)])/, '$1\\$2');
}

/** A fence longer than any run of backticks in `text`, so the text cannot close it. */
export function codeFence(text: string): string {
  const longest = Math.max(0, ...[...text.matchAll(/`+/g)].map((m) => m[0].length));
  return '`'.repeat(Math.max(3, longest + 1));
}
