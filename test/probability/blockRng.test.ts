import { describe, expect, it } from 'vitest';
import { BlockRng } from '../../src/probability/blockRng.js';

describe('BlockRng (xoshiro128**)', () => {
  it('follows the published xoshiro128** recurrence', () => {
    // Blackman & Vigna 2021 reference algorithm, state (1, 2, 3, 4); the five outputs were
    // recomputed independently from that recurrence (from memory of the reference code).
    const rng = new BlockRng(0, 0);
    rng.state.set([1, 2, 3, 4]);
    const words = new Uint32Array(5);
    rng.fillWords(words, 5);
    expect(Array.from(words)).toEqual([11520, 0, 5927040, 70819200, 2031721883]);
    const one = new BlockRng(0, 0);
    one.state.set([1, 2, 3, 4]);
    expect([one.nextWord(), one.nextWord(), one.nextWord()]).toEqual([11520, 0, 5927040]);
  });

  it('gives the same numbers for the same (seed, stream), others for another', () => {
    const draw = (seed: number, stream: number): number[] => {
      const out = new Float64Array(64);
      new BlockRng(seed, stream).fillUniform(out, 64);
      return Array.from(out);
    };
    expect(draw(20261201, 3)).toEqual(draw(20261201, 3));
    expect(draw(20261201, 3)).not.toEqual(draw(20261201, 4));
    expect(draw(20261201, 3)).not.toEqual(draw(20261202, 3));
    // stream indices above 2^32 (the IS and subset ranges) are distinct too
    expect(draw(7, 2 ** 32)).not.toEqual(draw(7, 0));
    expect(draw(7, 2 ** 33 + 1)).not.toEqual(draw(7, 1));
  });

  it('fills in pieces exactly as in one go; nextUniform continues the same stream', () => {
    const whole = new Float64Array(1000);
    new BlockRng(5, 1).fillUniform(whole, 1000);
    const rng = new BlockRng(5, 1);
    const a = new Float64Array(300);
    const b = new Float64Array(700);
    rng.fillUniform(a, 300);
    rng.fillUniform(b, 700);
    expect([...a, ...b]).toEqual(Array.from(whole));
    const single = new BlockRng(5, 1);
    expect(single.nextUniform()).toBe(whole[0]);
    expect(single.nextUniform()).toBe(whole[1]);
  });

  it('uniforms lie in (0, 1) and are uniform (chi-square on 100 bins, 53-bit grid)', () => {
    const n = 500_000;
    const u = new Float64Array(n);
    new BlockRng(42, 0).fillUniform(u, n);
    const bins = new Array<number>(100).fill(0);
    let offGrid = 0;
    let outside = 0;
    for (const v of u) {
      if (!(v > 0 && v < 1)) outside++;
      bins[Math.floor(v * 100)]++;
      if (!Number.isInteger(v * 2 ** 53)) offGrid++;
    }
    expect(outside).toBe(0);
    expect(offGrid).toBe(0);
    const e = n / 100;
    const chi2 = bins.reduce((s, o) => s + ((o - e) * (o - e)) / e, 0);
    // common practice: chi-square with 99 degrees of freedom, 0.1 % upper point ≈ 148.2
    expect(chi2).toBeLessThan(148.2);
    // the low bits vary too: the parity of the 53-bit integer is a fair coin (4σ)
    let odd = 0;
    for (const v of u) odd += (v * 2 ** 53) % 2;
    expect(Math.abs(odd - n / 2)).toBeLessThan(4 * Math.sqrt(n / 4));
  });

  it('refuses a non-finite seed or a bad stream', () => {
    expect(() => new BlockRng(NaN, 0)).toThrow(/seed/);
    expect(() => new BlockRng(1, -1)).toThrow(/stream/);
    expect(() => new BlockRng(1, 0.5)).toThrow(/stream/);
  });
});
