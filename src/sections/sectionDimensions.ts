/**
 * A section by its shape and dimensions (SI, m), and the writer that turns it, less a corrosion
 * loss, into properties per sample (docs/sections.md).
 *
 * Corrosion loss is a depth of material lost from each exposed face:
 * - I/H: `primary` from every face of the flanges (both faces and the tips: tf − 2d, b − 2d, h − 2d),
 *   `secondary` from both faces of the web (tw − 2d_w); the fillet surfaces recede with them, so the
 *   root radius grows to r + (d_f + d_w)/2 (exact when the two are equal);
 * - RHS/SHS and CHS: `primary` from the outer face only (a sealed hollow section does not corrode
 *   inside): t − d, outer sizes − 2d, outer corner radius ro − d, the inside unchanged;
 * - solid rectangle: `primary` from all four faces (b − 2d, h − 2d), e.g. decay of timber.
 * A loss that eats through a plate leaves no section: every property 0.
 */
import { writeCircularHollow, writeRectangularHollow, writeSolidRectangle } from './hollowSections.js';
import { writeISection } from './iSection.js';
import { writeLostSection } from './sectionProperties.js';

export type SectionShape = 'i' | 'rhs' | 'chs' | 'rect';
export const SECTION_SHAPES: readonly SectionShape[] = ['i', 'rhs', 'chs', 'rect'];

export type SectionDimensions =
  | { readonly shape: 'i'; readonly h: number; readonly b: number; readonly tw: number; readonly tf: number; readonly r: number }
  | { readonly shape: 'rhs'; readonly h: number; readonly b: number; readonly t: number; readonly ro: number; readonly ri: number }
  | { readonly shape: 'chs'; readonly D: number; readonly t: number }
  | { readonly shape: 'rect'; readonly b: number; readonly h: number };

/** Writes the properties of `d` less the losses (per exposed face; `secondary` is the web's, I/H only). */
export type SectionWriter = (out: Float64Array, primaryLoss: number, secondaryLoss: number) => void;

export function sectionWriter(d: SectionDimensions): SectionWriter {
  switch (d.shape) {
    case 'i': {
      const { h, b, tw, tf, r } = d;
      return (out, df, dw) => {
        const tf1 = tf - 2 * df, tw1 = tw - 2 * dw, b1 = b - 2 * df;
        if (!(tf1 > 0 && tw1 > 0 && b1 > tw1)) return writeLostSection(out);
        writeISection(out, h - 2 * df, b1, tw1, tf1, r > 0 ? r + (df + dw) / 2 : 0);
      };
    }
    case 'rhs': {
      const { h, b, t, ro, ri } = d;
      return (out, loss) => {
        const t1 = t - loss;
        if (!(t1 > 0)) return writeLostSection(out);
        writeRectangularHollow(out, h - 2 * loss, b - 2 * loss, t1, Math.max(ro - loss, 0), ri);
      };
    }
    case 'chs': {
      const { D, t } = d;
      return (out, loss) => {
        if (!(t - loss > 0)) return writeLostSection(out);
        writeCircularHollow(out, D - 2 * loss, t - loss);
      };
    }
    case 'rect': {
      const { b, h } = d;
      return (out, loss) => {
        if (!(b - 2 * loss > 0 && h - 2 * loss > 0)) return writeLostSection(out);
        writeSolidRectangle(out, b - 2 * loss, h - 2 * loss);
      };
    }
  }
}

/**
 * Why the dimensions cannot make a section (the dimension's name and what is wrong), or null.
 * Checked once when a scenario is read; the writer itself assumes sound input.
 */
export function dimensionProblem(d: SectionDimensions): { field: string; message: string } | null {
  const positive = (field: string, v: number) => (v > 0 ? null : { field, message: 'must be greater than zero' });
  switch (d.shape) {
    case 'i':
      return (
        positive('h', d.h) ?? positive('b', d.b) ?? positive('tw', d.tw) ?? positive('tf', d.tf) ??
        (d.r >= 0 ? null : { field: 'r', message: 'must not be negative' }) ??
        (2 * d.tf < d.h ? null : { field: 'tf', message: 'two flanges must be thinner than the depth h' }) ??
        (d.tw < d.b ? null : { field: 'tw', message: 'the web must be thinner than the flange width b' }) ??
        (d.tw + 2 * d.r <= d.b && 2 * d.tf + 2 * d.r <= d.h ? null : { field: 'r', message: 'the root radius does not fit between the web, the flanges and the flange tips' })
      );
    case 'rhs':
      return (
        positive('h', d.h) ?? positive('b', d.b) ?? positive('t', d.t) ??
        (2 * d.t < Math.min(d.h, d.b) ? null : { field: 't', message: 'the wall must be thinner than half the smaller outer size' }) ??
        (d.ri >= 0 ? null : { field: 'ri', message: 'must not be negative' }) ??
        (d.ro >= d.t ? null : { field: 'ro', message: 'the outer corner radius must be at least the wall thickness t' }) ??
        (2 * d.ro <= Math.min(d.h, d.b) ? null : { field: 'ro', message: 'the outer corner radius must be at most half the smaller outer size' }) ??
        (2 * d.ri <= Math.min(d.h, d.b) - 2 * d.t ? null : { field: 'ri', message: 'the inner corner radius must be at most half the smaller inner size' })
      );
    case 'chs':
      return positive('D', d.D) ?? positive('t', d.t) ?? (2 * d.t < d.D ? null : { field: 't', message: 'the wall must be thinner than half the diameter D' });
    case 'rect':
      return positive('b', d.b) ?? positive('h', d.h);
  }
}

/** The loss (per face) that removes a plate entirely: the bound a random loss must stay below. */
export function lossThrough(d: SectionDimensions, plate: 'primary' | 'secondary'): number {
  switch (d.shape) {
    case 'i':
      return plate === 'primary' ? d.tf / 2 : d.tw / 2;
    case 'rhs':
    case 'chs':
      return d.t;
    case 'rect':
      return Math.min(d.b, d.h) / 2;
  }
}
