/**
 * The standard normal distribution: density, Φ, its complement and inverses.
 *
 * Φ follows W. J. Cody, "Rational Chebyshev approximations for the error function",
 * Math. Comp. 23 (1969) 631–637, in the arrangement of his ANORM routine (ACM TOMS
 * Algorithm 715, 1993): three rational approximations on |x| ≤ 0.66291, ≤ √32 and beyond,
 * each returning the SMALLER tail so that Φ(−x) keeps full relative accuracy down to
 * the underflow limit (x ≈ −37.5, Φ ≈ 1e-307).
 *
 * Φ⁻¹ is Wichura's PPND16, Applied Statistics Algorithm AS 241 (1988), ~1e-16 relative.
 */

const INV_SQRT_2PI = 0.39894228040143267794; // 1/√(2π)
const SQRT32 = 5.656854248;
const CENTRAL_LIMIT = 0.66291;

// Cody: |x| ≤ 0.66291, Φ(x) = 1/2 + x·A(x²)/B(x²)
const A0 = 2.2352520354606839287;
const A1 = 1.6102823106855587881e2;
const A2 = 1.0676894854603709582e3;
const A3 = 1.8154981253343561249e4;
const A4 = 6.5682337918207449113e-2;
const B0 = 4.7202581904688241870e1;
const B1 = 9.7609855173777669322e2;
const B2 = 1.0260932208618978205e4;
const B3 = 4.5507789335026729956e4;

// Cody: 0.66291 < |x| ≤ √32, tail = exp(−x²/2)·C(|x|)/D(|x|)
const C0 = 3.9894151208813466764e-1;
const C1 = 8.8831497943883759412;
const C2 = 9.3506656132177855979e1;
const C3 = 5.9727027639480026226e2;
const C4 = 2.4945375852903726711e3;
const C5 = 6.8481904505362823326e3;
const C6 = 1.1602651437647350124e4;
const C7 = 9.8427148383839780218e3;
const C8 = 1.0765576773720192317e-8;
const D0 = 2.2266688044328115691e1;
const D1 = 2.3538790178262499861e2;
const D2 = 1.5193775994075548050e3;
const D3 = 6.4855582982667607550e3;
const D4 = 1.8615571640885098091e4;
const D5 = 3.4900952721145977266e4;
const D6 = 3.8912003286093271411e4;
const D7 = 1.9685429676859990727e4;

// Cody: |x| > √32, asymptotic form tail = exp(−x²/2)/|x|·(1/√(2π) − P(1/x²)/(x²Q(1/x²)))
const P0 = 2.1589853405795699e-1;
const P1 = 1.274011611602473639e-1;
const P2 = 2.2235277870649807e-2;
const P3 = 1.421619193227893466e-3;
const P4 = 2.9112874951168792e-5;
const P5 = 2.307344176494017303e-2;
const Q0 = 1.28426009614491121;
const Q1 = 4.68238212480865118e-1;
const Q2 = 6.59881378689285515e-2;
const Q3 = 3.78239633202758244e-3;
const Q4 = 7.29751555083966205e-5;

/**
 * exp(−y²/2) without the rounding error of y² for large y: y is split into a part with
 * only 4 fractional bits (whose square is exact) and a small remainder (Cody's device).
 */
function expHalfSquare(y: number): number {
  const head = Math.trunc(y * 16) / 16;
  const rest = (y - head) * (y + head);
  return Math.exp(-head * head * 0.5) * Math.exp(-rest * 0.5);
}

/** The smaller tail min(Φ(x), 1 − Φ(x)) for |x| > 0.66291, given y = |x|. */
function smallTail(y: number): number {
  let ratio: number;
  if (y <= SQRT32) {
    let num = C8 * y;
    let den = y;
    num = (num + C0) * y; den = (den + D0) * y;
    num = (num + C1) * y; den = (den + D1) * y;
    num = (num + C2) * y; den = (den + D2) * y;
    num = (num + C3) * y; den = (den + D3) * y;
    num = (num + C4) * y; den = (den + D4) * y;
    num = (num + C5) * y; den = (den + D5) * y;
    num = (num + C6) * y; den = (den + D6) * y;
    ratio = (num + C7) / (den + D7);
  } else {
    const z = 1 / (y * y);
    let num = P5 * z;
    let den = z;
    num = (num + P0) * z; den = (den + Q0) * z;
    num = (num + P1) * z; den = (den + Q1) * z;
    num = (num + P2) * z; den = (den + Q2) * z;
    num = (num + P3) * z; den = (den + Q3) * z;
    ratio = (INV_SQRT_2PI - (z * (num + P4)) / (den + Q4)) / y;
  }
  return expHalfSquare(y) * ratio;
}

/** x·A(x²)/B(x²) = Φ(x) − 1/2 for |x| ≤ 0.66291. */
function centralOffset(x: number): number {
  const s = x * x;
  let num = A4 * s;
  let den = s;
  num = (num + A0) * s; den = (den + B0) * s;
  num = (num + A1) * s; den = (den + B1) * s;
  num = (num + A2) * s; den = (den + B2) * s;
  return (x * (num + A3)) / (den + B3);
}

/** φ(x) = exp(−x²/2)/√(2π). */
export function normalPdf(x: number): number {
  const y = Math.abs(x);
  if (y > 40) return y === y ? 0 : NaN; // exp(−800) underflows; also keeps ±∞ from giving NaN
  return INV_SQRT_2PI * expHalfSquare(y);
}

/** Φ(x), full relative accuracy for x ≤ 0 down to underflow (≈ −37.5). */
export function normalCdf(x: number): number {
  if (Number.isNaN(x)) return NaN;
  const y = Math.abs(x);
  if (y <= CENTRAL_LIMIT) return 0.5 + centralOffset(x);
  if (y > 40) return x < 0 ? 0 : 1; // exp(−800) underflows; Cody's form would give 0·∞ at Infinity
  const tail = smallTail(y);
  return x < 0 ? tail : 1 - tail;
}

/** 1 − Φ(x) = Φ(−x), computed without cancellation. */
export function normalSf(x: number): number {
  return normalCdf(-x);
}

// Wichura AS 241 (PPND16) coefficients.
const SPLIT1 = 0.425;
const SPLIT2 = 5;
const CONST1 = 0.180625;
const CONST2 = 1.6;
const WA0 = 3.3871328727963666080;
const WA1 = 1.3314166789178437745e2;
const WA2 = 1.9715909503065514427e3;
const WA3 = 1.3731693765509461125e4;
const WA4 = 4.5921953931549871457e4;
const WA5 = 6.7265770927008700853e4;
const WA6 = 3.3430575583588128105e4;
const WA7 = 2.5090809287301226727e3;
const WB1 = 4.2313330701600911252e1;
const WB2 = 6.8718700749205790830e2;
const WB3 = 5.3941960214247511077e3;
const WB4 = 2.1213794301586595867e4;
const WB5 = 3.9307895800092710610e4;
const WB6 = 2.8729085735721942674e4;
const WB7 = 5.2264952788528545610e3;
const WC0 = 1.42343711074968357734;
const WC1 = 4.63033784615654529590;
const WC2 = 5.76949722146069140550;
const WC3 = 3.64784832476320460504;
const WC4 = 1.27045825245236838258;
const WC5 = 2.41780725177450611770e-1;
const WC6 = 2.27238449892691845833e-2;
const WC7 = 7.74545014278341407640e-4;
const WD1 = 2.05319162663775882187;
const WD2 = 1.67638483018380384940;
const WD3 = 6.89767334985100004550e-1;
const WD4 = 1.48103976427480074590e-1;
const WD5 = 1.51986665636164571966e-2;
const WD6 = 5.47593808499534494600e-4;
const WD7 = 1.05075007164441684324e-9;
const WE0 = 6.65790464350110377720;
const WE1 = 5.46378491116411436990;
const WE2 = 1.78482653991729133580;
const WE3 = 2.96560571828504891230e-1;
const WE4 = 2.65321895265761230930e-2;
const WE5 = 1.24266094738807843860e-3;
const WE6 = 2.71155556874348757815e-5;
const WE7 = 2.01033439929228813265e-7;
const WF1 = 5.99832206555887937690e-1;
const WF2 = 1.36929880922735805310e-1;
const WF3 = 1.48753612908506148525e-2;
const WF4 = 7.86869131145613259100e-4;
const WF5 = 1.84631831751005468180e-5;
const WF6 = 1.42151175831644588870e-7;
const WF7 = 2.04426310338993978564e-15;

/** The positive z with Φ(−z) = tail, for 0 < tail < 0.075 (AS 241 tail branches). */
function tailDeviate(tail: number): number {
  let r = Math.sqrt(-Math.log(tail));
  if (r <= SPLIT2) {
    r -= CONST2;
    return (
      (((((((WC7 * r + WC6) * r + WC5) * r + WC4) * r + WC3) * r + WC2) * r + WC1) * r + WC0) /
      (((((((WD7 * r + WD6) * r + WD5) * r + WD4) * r + WD3) * r + WD2) * r + WD1) * r + 1)
    );
  }
  r -= SPLIT2;
  return (
    (((((((WE7 * r + WE6) * r + WE5) * r + WE4) * r + WE3) * r + WE2) * r + WE1) * r + WE0) /
    (((((((WF7 * r + WF6) * r + WF5) * r + WF4) * r + WF3) * r + WF2) * r + WF1) * r + 1)
  );
}

/** Φ⁻¹(p) by Wichura's AS 241. p = 0 → −∞, p = 1 → +∞, outside [0,1] → NaN. */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  const q = p - 0.5;
  if (Math.abs(q) <= SPLIT1) {
    const r = CONST1 - q * q;
    return (
      (q * (((((((WA7 * r + WA6) * r + WA5) * r + WA4) * r + WA3) * r + WA2) * r + WA1) * r + WA0)) /
      (((((((WB7 * r + WB6) * r + WB5) * r + WB4) * r + WB3) * r + WB2) * r + WB1) * r + 1)
    );
  }
  // 1 − p is exact here (p > 0.5, Sterbenz), so the upper tail loses nothing.
  return q < 0 ? -tailDeviate(p) : tailDeviate(1 - p);
}

/** Φ⁻¹(1 − q) = −Φ⁻¹(q), accurate for tiny q (never forms 1 − q for small q). */
export function normalQuantileUpper(q: number): number {
  return 0 - normalQuantile(q); // 0 − x, not −x, so that q = 1/2 gives +0
}

const LN_SQRT_2PI = 0.91893853320467274178;
/** Below this, ln Φ(x) comes from the asymptotic series (Φ(−30) ≈ 4.9e−198 is still a normal double). */
const LOG_CDF_SERIES_BELOW = -30;

/**
 * ln Φ(x) for every finite x, also where Φ(x) underflows. For x < −30 the asymptotic expansion
 * Φ(x) = φ(x)/(−x) · (1 − 1/x² + 3/x⁴ − 15/x⁶ + 105/x⁸ − …) (Abramowitz and Stegun 26.2.12)
 * is used; its first omitted term is below 1e−13 there.
 */
export function logNormalCdf(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x >= LOG_CDF_SERIES_BELOW) return x > 0 ? Math.log1p(-normalCdf(-x)) : Math.log(normalCdf(x));
  if (x === -Infinity) return -Infinity;
  const r = 1 / (x * x);
  const series = 1 - r * (1 - r * (3 - r * (15 - r * 105)));
  // −x²/2 overflows only for |x| > 1.3e154; −(x/√2)² keeps the sign right until then.
  const h = x / Math.SQRT2;
  return -(h * h) - LN_SQRT_2PI - Math.log(-x) + Math.log(series);
}

/**
 * Φ⁻¹ of exp(logP): the x ≤ 0 with ln Φ(x) = logP, for any logP ≤ ln ½, also where exp(logP)
 * underflows. Newton steps on ln Φ from the leading term x ≈ −√(−2 logP).
 */
export function normalQuantileFromLog(logP: number): number {
  if (Number.isNaN(logP) || logP > 0) return NaN;
  if (logP === -Infinity) return -Infinity;
  if (logP > -600) return normalQuantile(Math.exp(logP));
  let x = -Math.sqrt(-2 * logP);
  // beyond |x| = 1e7 the leading term's relative error, about ln|x|/x², is below 2e−13
  if (x < -1e7) return x;
  for (let k = 0; k < 50; k++) {
    // d ln Φ / dx = φ(x)/Φ(x) = exp(ln φ − ln Φ), with ln φ(x) = −x²/2 − ln√(2π)
    const lp = logNormalCdf(x);
    const slope = Math.exp(-0.5 * x * x - LN_SQRT_2PI - lp);
    const step = (lp - logP) / slope;
    if (!Number.isFinite(step)) break;
    x -= step;
    if (Math.abs(step) <= 1e-15 * Math.abs(x)) break;
  }
  return x;
}
