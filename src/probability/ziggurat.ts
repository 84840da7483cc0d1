/**
 * Standard normal deviates by the ziggurat method (Marsaglia & Tsang, "The ziggurat method for
 * generating random variables", J. Statistical Software 5(8), 2000): 256 layers of equal area
 * v under f(x) = exp(−x²/2), x ≥ 0; the base layer carries the tail beyond r. The method is
 * exact (rejection sampling): almost every deviate costs two 32-bit words, a compare and a
 * multiply; wedges (~1 %) and the tail use the exact tests of the paper.
 *
 * Unlike the paper's 32-bit version, the layer index, the sign and the abscissa come from
 * separate bits (index: 8 low bits of word 1; sign: bit 8; abscissa: the top 21 bits of word 1
 * and all 32 of word 2, i.e. 53 bits), so the index and the value are not correlated.
 */
import type { BlockRng } from './blockRng.js';

const LAYERS = 256;
/** Right edge of the base layer and the common layer area, 256 layers (Marsaglia & Tsang 2000; from memory, checked by test/probability/ziggurat.test.ts). */
export const ZIGGURAT_R = 3.6541528853610088;
export const ZIGGURAT_V = 0.00492867323399;
const TWO_POW_32 = 4294967296;
const TWO_POW_53 = 9007199254740992;

/** k < KN[i] (k the 53-bit abscissa integer) lies inside the curve: accept at once. */
const KN = new Float64Array(LAYERS);
/** Layer width / 2^53: x = k · WN[i]. */
const WN = new Float64Array(LAYERS);
/** f at each layer's right edge. */
const FN = new Float64Array(LAYERS);
/** Right edges x_i of the layers (x_{255} = r), for the consistency test. */
export const ZIGGURAT_EDGES = new Float64Array(LAYERS);

(function buildTables(): void {
  let dn = ZIGGURAT_R;
  let tn = dn;
  const q = ZIGGURAT_V / Math.exp(-0.5 * dn * dn);
  KN[0] = (dn / q) * TWO_POW_53;
  KN[1] = 0;
  WN[0] = q / TWO_POW_53;
  WN[LAYERS - 1] = dn / TWO_POW_53;
  FN[0] = 1;
  FN[LAYERS - 1] = Math.exp(-0.5 * dn * dn);
  ZIGGURAT_EDGES[LAYERS - 1] = dn;
  for (let i = LAYERS - 2; i >= 1; i--) {
    dn = Math.sqrt(-2 * Math.log(ZIGGURAT_V / dn + Math.exp(-0.5 * dn * dn)));
    KN[i + 1] = (dn / tn) * TWO_POW_53;
    tn = dn;
    FN[i] = Math.exp(-0.5 * dn * dn);
    WN[i] = dn / TWO_POW_53;
    ZIGGURAT_EDGES[i] = dn;
  }
})();

/** The slow path: wedge or tail of layer i, abscissa x; NaN means "draw again". */
function edgeSample(rng: BlockRng, i: number, x: number): number {
  if (i === 0) {
    // Tail beyond r (Marsaglia 1964): x = −ln(U1)/r, accept when −2 ln U2 > x².
    let t: number;
    let y: number;
    do {
      t = -Math.log(rng.nextUniform()) / ZIGGURAT_R;
      y = -Math.log(rng.nextUniform());
    } while (y + y < t * t);
    return ZIGGURAT_R + t;
  }
  if (FN[i] + rng.nextUniform() * (FN[i - 1] - FN[i]) < Math.exp(-0.5 * x * x)) return x;
  return NaN;
}

/**
 * Fill out[0 … count) with independent standard normal deviates from rng. The generator's
 * state is kept in locals here (xoshiro128**, as in blockRng.ts) and written back around the
 * rare slow path, so the common path is a few integer operations and one table compare.
 */
export function fillNormal(rng: BlockRng, out: Float64Array, count: number): void {
  const st = rng.state;
  let s0 = st[0], s1 = st[1], s2 = st[2], s3 = st[3];
  let i = 0;
  while (i < count) {
    let r = Math.imul(s1, 5);
    const w1 = Math.imul((r << 7) | (r >>> 25), 9) >>> 0;
    let t = s1 << 9;
    s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t;
    s3 = (s3 << 11) | (s3 >>> 21);
    r = Math.imul(s1, 5);
    const w2 = Math.imul((r << 7) | (r >>> 25), 9) >>> 0;
    t = s1 << 9;
    s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t;
    s3 = (s3 << 11) | (s3 >>> 21);
    const layer = w1 & 255;
    const k = (w1 >>> 11) * TWO_POW_32 + w2;
    let x = k * WN[layer];
    if (k >= KN[layer]) {
      st[0] = s0; st[1] = s1; st[2] = s2; st[3] = s3;
      x = edgeSample(rng, layer, x);
      s0 = st[0]; s1 = st[1]; s2 = st[2]; s3 = st[3];
      if (x !== x) continue;
    }
    out[i++] = x * (1 - ((w1 >>> 7) & 2)); // sign from bit 8, without a branch (it is a coin toss)
  }
  st[0] = s0; st[1] = s1; st[2] = s2; st[3] = s3;
}
