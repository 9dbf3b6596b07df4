// Generalised least squares at a given τ² and the REML criterion with its derivatives: the kernel of
// ../../model.ts's fitAt (METHODS.md §3), which documents the formulas and lays out the arrays. The
// order of every sum is fitAt's before decision 0049, so that its results are the same to the bit.
import { at, cholesky, index, inverseFromCholesky, multiply, product, put, symmetrise, trace } from "./linear";

@external("math", "log") declare function log(x: f64): f64;

/** target += Xᵢᵀ S Xᵢ for a study of m contrasts whose parameter columns are plus[·] and minus[·] (−1: reference). */
function addProjected(target: usize, p: i32, S: usize, m: i32, plus: usize, minus: usize): void {
  for (let r = 0; r < m; r++) {
    for (let s = 0; s < m; s++) {
      const w = at(S, r * m + s);
      if (w == 0) continue;
      const pr = index(plus, r), mr = index(minus, r), ps = index(plus, s), ms = index(minus, s);
      if (pr >= 0 && ps >= 0) put(target, pr * p + ps, at(target, pr * p + ps) + w);
      if (pr >= 0 && ms >= 0) put(target, pr * p + ms, at(target, pr * p + ms) - w);
      if (mr >= 0 && ps >= 0) put(target, mr * p + ps, at(target, mr * p + ps) - w);
      if (mr >= 0 && ms >= 0) put(target, mr * p + ms, at(target, mr * p + ms) + w);
    }
  }
}

/** xᵀ S x. */
function quadratic(S: usize, x: usize, m: i32): f64 {
  let sum = 0.0;
  for (let r = 0; r < m; r++) for (let s = 0; s < m; s++) sum += at(x, r) * at(S, r * m + s) * at(x, s);
  return sum;
}

/**
 * Fits the model at tau2 to `blocks` studies of sizes[b] contrasts each, whose y, V (m × m), plus and
 * minus follow one another. Writes beta (p), covariance (p × p) and results [residual, restricted
 * log-likelihood, score, information]. Returns −1, or the first study whose covariance is not
 * positive definite, or −2 when XᵀWX is not (the network is not connected).
 * Scratch: W and WPW (Σ m² each: every study's weights), A, M, N, L, H (p × p each), c (p), and
 * `small` (6 m² for the largest m: Σ, its factor, P, WP, WPWP and WPWPW) with `r` (the largest m).
 */
export function fitAt(
  tau2: f64,
  blocks: i32,
  p: i32,
  sizes: usize,
  y: usize,
  V: usize,
  plus: usize,
  minus: usize,
  beta: usize,
  covariance: usize,
  results: usize,
  W: usize,
  WPW: usize,
  A: usize,
  M: usize,
  N: usize,
  L: usize,
  H: usize,
  c: usize,
  small: usize,
  r: usize,
): i32 {
  for (let i = 0; i < p * p; i++) {
    put(A, i, 0);
    put(M, i, 0);
    put(N, i, 0);
  }
  for (let i = 0; i < p; i++) put(c, i, 0);
  let logDetSigma = 0.0;
  let traceWP = 0.0;
  let traceWPWP = 0.0;

  let contrast = 0; // the study's first contrast among all
  let square = 0; // its first entry among all m × m matrices
  for (let b = 0; b < blocks; b++) {
    const m = index(sizes, b);
    const yb = y + (<usize>contrast << 3);
    const plusB = plus + (<usize>contrast << 2);
    const minusB = minus + (<usize>contrast << 2);
    const Wb = W + (<usize>square << 3);
    const WPWb = WPW + (<usize>square << 3);
    if (m == 1) {
      // A two-arm study: every matrix is one number, P = [1], WP = W, WPW = W², WPWPW = W³.
      const sigma = at(V + (<usize>square << 3), 0) + tau2;
      const w = 1 / sigma;
      logDetSigma += log(sigma);
      put(Wb, 0, w);
      put(WPWb, 0, w * w);
      addProjected(A, p, Wb, 1, plusB, minusB);
      const plus0 = index(plusB, 0), minus0 = index(minusB, 0);
      if (plus0 >= 0) put(c, plus0, at(c, plus0) + w * at(yb, 0));
      if (minus0 >= 0) put(c, minus0, at(c, minus0) - w * at(yb, 0));
      traceWP += w;
      traceWPWP += w * w;
      addProjected(M, p, WPWb, 1, plusB, minusB);
      put(small, 0, w * w * w);
      addProjected(N, p, small, 1, plusB, minusB);
    } else {
      const mm = m * m;
      const sigma = small;
      const Lb = small + (<usize>mm << 3);
      const P = small + (<usize>(2 * mm) << 3);
      const WP = small + (<usize>(3 * mm) << 3);
      const WPWP = small + (<usize>(4 * mm) << 3);
      const WPWPW = small + (<usize>(5 * mm) << 3);
      const Vb = V + (<usize>square << 3);
      for (let j = 0; j < m; j++) for (let k = 0; k < m; k++) put(P, j * m + k, j == k ? 1 : 0.5);
      for (let i = 0; i < mm; i++) put(sigma, i, at(Vb, i) + tau2 * at(P, i));
      if (!cholesky(sigma, Lb, m)) return b;
      let logDet = 0.0;
      for (let i = 0; i < m; i++) logDet += 2 * log(at(Lb, i * m + i));
      inverseFromCholesky(Lb, Wb, m);
      symmetrise(Wb, Wb, m);
      logDetSigma += logDet;
      addProjected(A, p, Wb, m, plusB, minusB);
      for (let row = 0; row < m; row++) {
        let sum = 0.0;
        for (let s = 0; s < m; s++) sum = sum + at(Wb, row * m + s) * at(yb, s);
        const pr = index(plusB, row), mr = index(minusB, row);
        if (pr >= 0) put(c, pr, at(c, pr) + sum);
        if (mr >= 0) put(c, mr, at(c, mr) - sum);
      }
      product(Wb, P, WP, m);
      product(WP, Wb, WPWb, m);
      traceWP += trace(WP, m);
      product(WP, WP, WPWP, m);
      traceWPWP += trace(WPWP, m);
      addProjected(M, p, WPWb, m, plusB, minusB);
      product(WPWP, Wb, WPWPW, m);
      addProjected(N, p, WPWPW, m, plusB, minusB);
    }
    contrast += m;
    square += m * m;
  }

  symmetrise(A, A, p);
  if (!cholesky(A, L, p)) return -2;
  inverseFromCholesky(L, H, p);
  for (let i = 0; i < p; i++) {
    let s = 0.0;
    for (let k = 0; k < p; k++) s += at(H, i * p + k) * at(c, k);
    put(beta, i, s);
  }
  let logDetA = 0.0;
  for (let i = 0; i < p; i++) logDetA += 2 * log(at(L, i * p + i));

  let residual = 0.0;
  let residualP = 0.0;
  contrast = 0;
  square = 0;
  for (let b = 0; b < blocks; b++) {
    const m = index(sizes, b);
    for (let j = 0; j < m; j++) {
      const pj = index(plus, contrast + j), mj = index(minus, contrast + j);
      put(r, j, at(y, contrast + j) - (pj >= 0 ? at(beta, pj) : 0) + (mj >= 0 ? at(beta, mj) : 0));
    }
    residual += quadratic(W + (<usize>square << 3), r, m);
    residualP += quadratic(WPW + (<usize>square << 3), r, m);
    contrast += m;
    square += m * m;
  }

  // HM into A's space and HN into L's: neither is needed any more.
  const HM = A;
  const HN = L;
  multiply(H, M, HM, p);
  multiply(H, N, HN, p);
  let traceHM = 0.0;
  let traceHN = 0.0;
  let traceHMHM = 0.0;
  for (let i = 0; i < p; i++) {
    traceHM += at(HM, i * p + i);
    traceHN += at(HN, i * p + i);
    for (let j = 0; j < p; j++) traceHMHM += at(HM, i * p + j) * at(HM, j * p + i);
  }
  symmetrise(H, covariance, p);
  put(results, 0, residual);
  put(results, 1, -0.5 * (logDetSigma + logDetA + residual));
  put(results, 2, 0.5 * (residualP - traceWP + traceHM));
  put(results, 3, 0.5 * (traceWPWP - 2 * traceHN + traceHMHM));
  return -1;
}
