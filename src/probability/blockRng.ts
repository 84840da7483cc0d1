/**
 * The block sampler's generator: xoshiro128** (Blackman & Vigna, "Scrambled linear pseudorandom
 * number generators", ACM TOMS 47(4), 2021), written on 32-bit integers and filling typed arrays
 * in tight loops (the state lives in locals while a block is filled, so there is no closure call
 * per number). Period 2^128 − 1.
 *
 * One generator per (seed, stream): the 4 state words are a hash (MurmurHash3's 32-bit
 * finaliser over the bits of seed and stream, common practice) of the pair, then 8 outputs are
 * discarded. Streams are distinct starting points on one long cycle; a chunk uses ~2^17 words,
 * so two chunks overlapping has a probability far below 2^-90.
 *
 * Uniforms: k/2^53, k = 1 … 2^53 − 1 from two words (27 + 26 bits); k = 0 is redrawn, so a
 * uniform is never 0 or 1.
 */

const TWO_POW_26 = 67108864;
const TWO_POW_32 = 4294967296;
const TWO_POW_MINUS_53 = 1 / 9007199254740992;

/** Which sampler a result came from; part of what a seed means (JSON `meta.sampler`). */
export const SAMPLER_VERSION = 'block-v2';

function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

const bits = new DataView(new ArrayBuffer(8));

export class BlockRng {
  /** xoshiro128** state, 4 words. */
  readonly state = new Uint32Array(4);

  constructor(seed: number, stream: number) {
    if (!Number.isFinite(seed)) throw new Error(`rng: seed must be a finite number, got ${seed}`);
    if (!Number.isSafeInteger(stream) || stream < 0) throw new Error(`rng: stream must be a non-negative integer, got ${stream}`);
    bits.setFloat64(0, seed);
    const words = [bits.getUint32(0), bits.getUint32(4), stream >>> 0, Math.floor(stream / TWO_POW_32) >>> 0];
    let h = 0x9e3779b9;
    for (const w of words) h = fmix32((h ^ w) + 0x7f4a7c15);
    for (let i = 0; i < 4; i++) {
      h = fmix32(h + 0x9e3779b9);
      this.state[i] = h;
    }
    if ((this.state[0] | this.state[1] | this.state[2] | this.state[3]) === 0) this.state[0] = 1;
    this.fillWords(new Uint32Array(8), 8);
  }

  /** The next 32-bit word (slow path: table set-up, rejections). */
  nextWord(): number {
    const s = this.state;
    const result = Math.imul(rotl(Math.imul(s[1], 5), 7), 9) >>> 0;
    const t = s[1] << 9;
    s[2] ^= s[0];
    s[3] ^= s[1];
    s[1] ^= s[2];
    s[0] ^= s[3];
    s[2] ^= t;
    s[3] = rotl(s[3], 11);
    return result;
  }

  /** One uniform in (0, 1) with 53 random bits. */
  nextUniform(): number {
    for (;;) {
      const k = (this.nextWord() >>> 5) * TWO_POW_26 + (this.nextWord() >>> 6);
      if (k !== 0) return k * TWO_POW_MINUS_53;
    }
  }

  fillWords(out: Uint32Array, count: number): void {
    const st = this.state;
    let s0 = st[0], s1 = st[1], s2 = st[2], s3 = st[3];
    for (let i = 0; i < count; i++) {
      const r = Math.imul(s1, 5);
      out[i] = Math.imul((r << 7) | (r >>> 25), 9);
      const t = s1 << 9;
      s2 ^= s0;
      s3 ^= s1;
      s1 ^= s2;
      s0 ^= s3;
      s2 ^= t;
      s3 = (s3 << 11) | (s3 >>> 21);
    }
    st[0] = s0; st[1] = s1; st[2] = s2; st[3] = s3;
  }

  /** Fill out[0 … count) with uniforms in (0, 1), 53 bits each. */
  fillUniform(out: Float64Array, count: number): void {
    const st = this.state;
    let s0 = st[0], s1 = st[1], s2 = st[2], s3 = st[3];
    let i = 0;
    while (i < count) {
      let r = Math.imul(s1, 5);
      const high = Math.imul((r << 7) | (r >>> 25), 9) >>> 5;
      let t = s1 << 9;
      s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t;
      s3 = (s3 << 11) | (s3 >>> 21);
      r = Math.imul(s1, 5);
      const low = Math.imul((r << 7) | (r >>> 25), 9) >>> 6;
      t = s1 << 9;
      s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t;
      s3 = (s3 << 11) | (s3 >>> 21);
      const k = high * TWO_POW_26 + low;
      if (k !== 0) out[i++] = k * TWO_POW_MINUS_53;
    }
    st[0] = s0; st[1] = s1; st[2] = s2; st[3] = s3;
  }
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}
