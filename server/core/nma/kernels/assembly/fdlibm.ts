// exp and ln as fdlibm computes them (Sun Microsystems, 1993; FreeBSD msun e_exp.c and e_log.c), in
// the form @stdlib/math-base-special-exp and -ln 0.2.5 port them: the same operations, so the same
// results to the bit (tests/unit/core/nma/kernels.test.ts). The normal generator's tables and its
// rare draws depend on them.

const LN2_HI: f64 = 6.9314718036912381649e-1;
const LN2_LO: f64 = 1.90821492927058770002e-10;
const LOG2_E: f64 = 1.442695040888963387;
const OVERFLOW: f64 = 7.09782712893383973096e2;
const UNDERFLOW: f64 = -7.4513321910194110842e2;
const NEAR_ZERO: f64 = 1.0 / <f64>(1 << 28);

/**
 * y·2^k as stdlib's ldexp computes it for a normal y: the exponent set directly, a subnormal result
 * rounded once, and a result below 2⁻¹⁰⁷⁴ flushed to zero rather than rounded.
 */
function scale(y: f64, k: i32): f64 {
  if (k == 0 || y == 0.0 || !isFinite(y)) return y;
  const bits = reinterpret<u64>(y);
  const e = k + <i32>((bits >>> 52) & 0x7ff) - 1023;
  if (e < -1074) return y < 0.0 ? -0.0 : 0.0;
  if (e > 1023) return y < 0.0 ? -Infinity : Infinity;
  const significand = bits & 0x800fffffffffffff;
  if (e <= -1023) return 2.220446049250313e-16 * reinterpret<f64>(significand | (<u64>(e + 52 + 1023) << 52));
  return reinterpret<f64>(significand | (<u64>(e + 1023) << 52));
}

export function exp(x: f64): f64 {
  if (isNaN(x) || x == Infinity) return x;
  if (x == -Infinity) return 0.0;
  if (x > OVERFLOW) return Infinity;
  if (x < UNDERFLOW) return 0.0;
  if (x > -NEAR_ZERO && x < NEAR_ZERO) return 1.0 + x;
  const k = x < 0.0 ? Math.trunc(LOG2_E * x - 0.5) : Math.trunc(LOG2_E * x + 0.5);
  const hi = x - k * LN2_HI;
  const lo = k * LN2_LO;
  const r = hi - lo;
  const t = r * r;
  // P(t) = P1 + t(P2 + t(P3 + t(P4 + t P5))), zero at t = 0 as stdlib writes it.
  const p = t == 0.0 ? 0.16666666666666602 : 0.16666666666666602 + t * (-0.0027777777777015593 + t * (0.00006613756321437934 + t * (-0.0000016533902205465252 + t * 4.1381367970572385e-8)));
  const c = r - t * p;
  const y = 1.0 - (lo - (r * c) / (2.0 - c) - hi);
  return scale(y, <i32>k);
}

@inline function highWord(x: f64): i32 {
  return <i32>(reinterpret<u64>(x) >>> 32);
}
@inline function withHighWord(x: f64, high: i32): f64 {
  return reinterpret<f64>((<u64>(<u32>high) << 32) | (reinterpret<u64>(x) & 0xffffffff));
}

export function ln(x: f64): f64 {
  if (x == 0.0) return -Infinity;
  if (isNaN(x) || x < 0.0) return NaN;
  let hx = highWord(x);
  let k: i32 = 0;
  if (hx < 0x00100000) {
    // Subnormal: scale up by 2⁵⁴.
    k -= 54;
    x *= 1.8014398509481984e16;
    hx = highWord(x);
  }
  if (hx >= 0x7ff00000) return x + x;
  k += (hx >> 20) - 1023;
  hx &= 0x000fffff;
  let i = (hx + 0x95f64) & 0x100000;
  x = withHighWord(x, hx | (i ^ 0x3ff00000));
  k += i >> 20;
  const f = x - 1.0;
  const dk = <f64>k;
  if ((0x000fffff & (2 + hx)) < 3) {
    if (f == 0.0) {
      if (k == 0) return 0.0;
      return dk * LN2_HI + dk * LN2_LO;
    }
    const R = f * f * (0.5 - 0.33333333333333333 * f);
    if (k == 0) return f - R;
    return dk * LN2_HI - (R - dk * LN2_LO - f);
  }
  const s = f / (2.0 + f);
  const z = s * s;
  i = hx - 0x6147a;
  const w = z * z;
  const j = 0x6b851 - hx;
  const t1 = w * (w == 0.0 ? 0.3999999999940942 : 0.3999999999940942 + w * (0.22222198432149784 + w * 0.15313837699209373));
  const t2 = z * (w == 0.0 ? 0.6666666666666735 : 0.6666666666666735 + w * (0.2857142874366239 + w * (0.1818357216161805 + w * 0.14798198605116586)));
  i |= j;
  const R = t2 + t1;
  if (i > 0) {
    const hfsq = 0.5 * f * f;
    if (k == 0) return f - (hfsq - s * (hfsq + R));
    return dk * LN2_HI - (hfsq - (s * (hfsq + R) + dk * LN2_LO) - f);
  }
  if (k == 0) return f - s * (f - R);
  return dk * LN2_HI - (s * (f - R) - dk * LN2_LO - f);
}
