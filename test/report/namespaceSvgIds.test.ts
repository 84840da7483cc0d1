// common practice: inline SVGs share one id space in an HTML page, so ids must be made unique.
import { describe, expect, it } from 'vitest';
import { namespaceSvgIds } from '../../src/report/namespaceSvgIds.js';

describe('namespaceSvgIds', () => {
  it('prefixes ids and the references to them, and nothing else', () => {
    const svg = '<svg><defs><clipPath id="clip1"><rect/></clipPath></defs><g clip-path="url(#clip1)"><use href="#clip1"/><use href="#other"/></g><rect fill="url(#paint)"/></svg>';
    const out = namespaceSvgIds(svg, 'a-');
    expect(out).toContain('id="a-clip1"');
    expect(out).toContain('clip-path="url(#a-clip1)"');
    expect(out).toContain('href="#a-clip1"');
    expect(out).toContain('href="#other"'); // not an id of this SVG
    expect(out).toContain('url(#paint)');
  });

  it('leaves an SVG without ids untouched', () => {
    const svg = '<svg><path d="M0,0"/></svg>';
    expect(namespaceSvgIds(svg, 'x-')).toBe(svg);
  });
});
