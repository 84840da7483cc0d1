/**
 * Hollow and solid sections: rectangular/square hollow (h, b, t and the outer and inner corner
 * radii ro, ri), circular hollow (D, t) and the solid rectangle (b, h, e.g. sawn timber).
 * y is the strong axis: h is the depth in the direction of bending about y (docs/sections.md).
 */
import { roundedRectangle } from './roundedRectangle.js';
import { writeDerived } from './sectionProperties.js';

const scratch = new Float64Array(10); // outer then inner rounded rectangle; module level: no allocation per call

export function writeRectangularHollow(out: Float64Array, h: number, b: number, t: number, ro: number, ri: number): void {
  roundedRectangle(scratch, 0, b, h, ro);
  roundedRectangle(scratch, 5, b - 2 * t, h - 2 * t, ri);
  writeDerived(out, scratch[0] - scratch[5], scratch[1] - scratch[6], scratch[2] - scratch[7], h / 2, b / 2, scratch[3] - scratch[8], scratch[4] - scratch[9]);
}

export function writeCircularHollow(out: Float64Array, D: number, t: number): void {
  const d = D - 2 * t;
  const D2 = D * D, d2 = d * d;
  const A = (Math.PI / 4) * (D2 - d2);
  const I = (Math.PI / 64) * (D2 * D2 - d2 * d2);
  const Wpl = (D2 * D - d2 * d) / 6;
  writeDerived(out, A, I, I, D / 2, D / 2, Wpl, Wpl);
}

export function writeSolidRectangle(out: Float64Array, b: number, h: number): void {
  writeDerived(out, b * h, (b * h * h * h) / 12, (h * b * b * b) / 12, h / 2, b / 2, (b * h * h) / 4, (h * b * b) / 4);
}
