import { describe, expect, it } from 'vitest';
import { overlappingTexts, svgTextBoxes } from './svgTextBoxes.js';

describe('text boxes of a rendered SVG', () => {
  const svg = (a: string, b: string) => `<svg><g transform="translate(10,20)"><text transform="translate(0,0)" font-size="11px">${a}</text></g><text ${b} font-size="11px">second label</text></svg>`;
  it('finds two labels drawn on top of each other, and none when they are apart', () => {
    expect(overlappingTexts(svg('first label', 'transform="translate(15,22)"'))).toEqual([['first label', 'second label']]);
    expect(overlappingTexts(svg('first label', 'transform="translate(15,60)"'))).toEqual([]);
  });
  it('applies rotation and anchors: a vertical label beside a horizontal one does not touch it', () => {
    const boxes = svgTextBoxes('<svg><text text-anchor="end" transform="translate(100,0) rotate(270)" font-size="10px">vertical</text></svg>');
    // rotate(270) turns the text upwards: an end-anchored label hangs below its anchor
    expect(Math.min(...boxes[0].corners.map((c) => c[1]))).toBeGreaterThanOrEqual(-1e-9);
    expect(overlappingTexts('<svg><text text-anchor="end" transform="translate(100,0) rotate(270)" font-size="10px">vertical</text><text transform="translate(120,10)" font-size="10px">apart</text></svg>')).toEqual([]);
  });
});
