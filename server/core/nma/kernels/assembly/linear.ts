// Small dense linear algebra on row-major n × n matrices of doubles, in the same order of operations
// as ml-matrix (which the engine used before decision 0049), so that results agree to the bit.

@inline export function at(base: usize, i: i32): f64 {
  return load<f64>(base + (<usize>i << 3));
}
@inline export function put(base: usize, i: i32, value: f64): void {
  store<f64>(base + (<usize>i << 3), value);
}
@inline export function index(base: usize, i: i32): i32 {
  return load<i32>(base + (<usize>i << 2));
}

/** l = the lower Cholesky factor of a (ml-matrix's CholeskyDecomposition); whether a is positive definite. */
export function cholesky(a: usize, l: usize, n: i32): bool {
  let positiveDefinite = true;
  for (let j = 0; j < n; j++) {
    let d = 0.0;
    for (let k = 0; k < j; k++) {
      let s = 0.0;
      for (let i = 0; i < k; i++) s += at(l, k * n + i) * at(l, j * n + i);
      s = (at(a, j * n + k) - s) / at(l, k * n + k);
      put(l, j * n + k, s);
      d = d + s * s;
    }
    d = at(a, j * n + j) - d;
    positiveDefinite = positiveDefinite && d > 0;
    put(l, j * n + j, Math.sqrt(Math.max(d, 0)));
    for (let k = j + 1; k < n; k++) put(l, j * n + k, 0);
  }
  return positiveDefinite;
}

/** out = (L Lᵀ)⁻¹, solving for the identity column by column (ml-matrix's solve). */
export function inverseFromCholesky(l: usize, out: usize, n: i32): void {
  for (let i = 0; i < n * n; i++) put(out, i, 0);
  for (let i = 0; i < n; i++) put(out, i * n + i, 1);
  for (let k = 0; k < n; k++) {
    for (let j = 0; j < n; j++) {
      for (let i = 0; i < k; i++) put(out, k * n + j, at(out, k * n + j) - at(out, i * n + j) * at(l, k * n + i));
      put(out, k * n + j, at(out, k * n + j) / at(l, k * n + k));
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    for (let j = 0; j < n; j++) {
      for (let i = k + 1; i < n; i++) put(out, k * n + j, at(out, k * n + j) - at(out, i * n + j) * at(l, i * n + k));
      put(out, k * n + j, at(out, k * n + j) / at(l, k * n + k));
    }
  }
}

/** out = (s + sᵀ) / 2 off the diagonal (model.ts's symmetrise); out may be s. */
export function symmetrise(s: usize, out: usize, n: i32): void {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      // IEEE addition commutes exactly: both halves get the same value.
      const value = (at(s, i * n + j) + at(s, j * n + i)) / 2;
      put(out, i * n + j, value);
      put(out, j * n + i, value);
    }
    put(out, i * n + i, at(s, i * n + i));
  }
}

/** out = a b (model.ts's product of a study's small matrices); out is neither a nor b. */
export function product(a: usize, b: usize, out: usize, n: i32): void {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) put(out, i * n + j, 0);
    for (let k = 0; k < n; k++) {
      const aik = at(a, i * n + k);
      for (let j = 0; j < n; j++) put(out, i * n + j, at(out, i * n + j) + aik * at(b, k * n + j));
    }
  }
}

/** out = a b (ml-matrix's mmul: each entry summed over k from 0); out is neither a nor b. */
export function multiply(a: usize, b: usize, out: usize, n: i32): void {
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      let s = 0.0;
      for (let k = 0; k < n; k++) s += at(a, i * n + k) * at(b, k * n + j);
      put(out, i * n + j, s);
    }
  }
}

export function trace(a: usize, n: i32): f64 {
  let sum = 0.0;
  for (let i = 0; i < n; i++) sum += at(a, i * n + i);
  return sum;
}
