// The engine's numeric kernels in WebAssembly (decision 0049), compiled from ./assembly. A run of the
// command line is one cold process: JavaScript's loops run interpreted until V8 has optimised them,
// which took most of a run, while WebAssembly is compiled before its first call. The kernels work on
// arrays laid out in their memory; the functions here copy the inputs in and the results out.
import { kernelsWasm } from "./wasm";

interface Kernels {
  memory: WebAssembly.Memory;
  heapBase(): number;
  exp(x: number): number;
  ln(x: number): number;
  seedNormals(seed: number): void;
  fillNormals(z: number, count: number): void;
  cholesky(a: number, l: number, n: number): number;
  countRanks(p: number, T: number, draws: number, sign: number, reference: number, L: number, mean: number, parameterIndex: number, counts: number, values: number, order: number, z: number): void;
  scoreStudy(study: number, rank: number, m: number, rows: number, lambda: number, p: number, T: number, column: number, variance: number, floor: number, length: number, values: number, studies: number, ranks: number, filled: number, h: number): void;
  fitAt(tau2: number, blocks: number, p: number, sizes: number, y: number, V: number, plus: number, minus: number, beta: number, covariance: number, results: number, W: number, WPW: number, A: number, M: number, N: number, L: number, H: number, c: number, small: number, r: number): number;
}

let instance: Kernels | undefined;

function kernels(): Kernels {
  // Math.log for the fit, whose log-determinants used it before (decision 0049).
  instance ??= new WebAssembly.Instance(new WebAssembly.Module(Buffer.from(kernelsWasm, "base64")), { math: { log: Math.log } }).exports as unknown as Kernels;
  return instance;
}

/**
 * Byte offsets for arrays of the given sizes in bytes, above the kernels' static data, growing the
 * memory to hold them. Views of the memory are made afterwards: growing detaches earlier ones.
 */
function layout<K extends string>(k: Kernels, bytes: Record<K, number>): Record<K, number> {
  let next = k.heapBase();
  const offsets = {} as Record<K, number>;
  for (const name of Object.keys(bytes) as K[]) {
    offsets[name] = next;
    next += Math.ceil(bytes[name] / 8) * 8;
  }
  const missing = next - k.memory.buffer.byteLength;
  if (missing > 0) k.memory.grow(Math.ceil(missing / 65_536));
  return offsets;
}

/** The kernels' own exp and ln (fdlibm's, ./assembly/fdlibm.ts), for the tests that compare them with stdlib's. */
export const fdlibm = {
  exp: (x: number): number => kernels().exp(x),
  ln: (x: number): number => kernels().ln(x),
};

/** The first `count` standard normals of the generator seeded with `seed` (an integer from 1 to 2³² − 1). */
export function standardNormals(seed: number, count: number): Float64Array {
  const k = kernels();
  const at = layout(k, { z: count * 8 });
  k.seedNormals(seed);
  k.fillNormals(at.z, count);
  return new Float64Array(k.memory.buffer, at.z, count).slice();
}

export interface RankDraws {
  /** Cov(β̂), row-major p × p. */
  covariance: Float64Array;
  mean: Float64Array;
  /** For each parameter, its option's index among the T options. */
  parameterIndex: Int32Array;
  options: number;
  reference: number;
  /** +1: the smallest value ranks first; −1: the largest. */
  sign: 1 | -1;
  draws: number;
  seed: number;
}

const drawsPerCall = 500;

/** counts[t·T + r]: in how many draws option t ranked r + 1. */
export function rankCounts(input: RankDraws): Float64Array {
  const k = kernels();
  const p = input.mean.length;
  const T = input.options;
  const at = layout(k, { covariance: p * p * 8, L: p * p * 8, mean: p * 8, parameterIndex: p * 4, counts: T * T * 8, values: T * 8, order: T * 4, z: p * 8 });
  new Float64Array(k.memory.buffer, at.covariance, p * p).set(input.covariance);
  // β = β̂ + L z with Cov(β̂) = L Lᵀ. A covariance from the fit is positive definite.
  k.cholesky(at.covariance, at.L, p);
  new Float64Array(k.memory.buffer, at.mean, p).set(input.mean);
  new Int32Array(k.memory.buffer, at.parameterIndex, p).set(input.parameterIndex);
  new Float64Array(k.memory.buffer, at.counts, T * T).fill(0);
  k.seedNormals(input.seed);
  // In calls of a few hundred draws: V8 moves a WebAssembly function to its optimising compiler between
  // calls, not during one, so the later calls run the faster code (about 8 ms of a run; decision 0049).
  for (let done = 0; done < input.draws; done += drawsPerCall) k.countRanks(p, T, Math.min(drawsPerCall, input.draws - done), input.sign, input.reference, at.L, at.mean, at.parameterIndex, at.counts, at.values, at.order, at.z);
  return new Float64Array(k.memory.buffer, at.counts, T * T).slice();
}

/** A network's studies as the fit kernel reads them: each study's contrasts one after another. */
export interface PackedStudies {
  /** Contrasts per study. */
  sizes: Int32Array;
  y: Float64Array;
  /** Each study's m × m covariance of its contrasts, row-major. */
  V: Float64Array;
  /** Each contrast's parameter columns of +d and −d (−1: the reference). */
  plus: Int32Array;
  minus: Int32Array;
}

export interface KernelFit {
  beta: Float64Array;
  /** Row-major p × p. */
  covariance: Float64Array;
  residual: number;
  restrictedLogLikelihood: number;
  score: number;
  information: number;
}

/**
 * The generalised least squares fit at tau2 (../model.ts documents it). Returns the index of the
 * first study whose covariance is not positive definite, or "singular" when XᵀWX is not.
 */
export function fitStudies(studies: PackedStudies, p: number, tau2: number): KernelFit | { notPositiveDefinite: number } | "singular" {
  const k = kernels();
  const contrasts = studies.y.length;
  const squares = studies.V.length;
  const largest = studies.sizes.reduce((max, m) => Math.max(max, m), 1);
  const at = layout(k, {
    sizes: studies.sizes.length * 4,
    y: contrasts * 8,
    V: squares * 8,
    plus: contrasts * 4,
    minus: contrasts * 4,
    beta: p * 8,
    covariance: p * p * 8,
    results: 4 * 8,
    W: squares * 8,
    WPW: squares * 8,
    A: p * p * 8,
    M: p * p * 8,
    N: p * p * 8,
    L: p * p * 8,
    H: p * p * 8,
    c: p * 8,
    small: 6 * largest * largest * 8,
    r: largest * 8,
  });
  const memory = k.memory.buffer;
  new Int32Array(memory, at.sizes, studies.sizes.length).set(studies.sizes);
  new Float64Array(memory, at.y, contrasts).set(studies.y);
  new Float64Array(memory, at.V, squares).set(studies.V);
  new Int32Array(memory, at.plus, contrasts).set(studies.plus);
  new Int32Array(memory, at.minus, contrasts).set(studies.minus);
  const status = k.fitAt(tau2, studies.sizes.length, p, at.sizes, at.y, at.V, at.plus, at.minus, at.beta, at.covariance, at.results, at.W, at.WPW, at.A, at.M, at.N, at.L, at.H, at.c, at.small, at.r);
  if (status === -2) return "singular";
  if (status >= 0) return { notPositiveDefinite: status };
  const [residual, restrictedLogLikelihood, score, information] = new Float64Array(memory, at.results, 4);
  return {
    beta: new Float64Array(memory, at.beta, p).slice(),
    covariance: new Float64Array(memory, at.covariance, p * p).slice(),
    residual: residual!,
    restrictedLogLikelihood: restrictedLogLikelihood!,
    score: score!,
    information: information!,
  };
}

export interface ImportanceInput {
  /** T options; p parameters. */
  options: number;
  parameters: number;
  /** Each option's parameter column (−1: the reference). */
  column: Int32Array;
  /** v_N of the pair i < j at i·T + j. */
  variance: Float64Array;
  /** Each study's label's place in code-unit order: equal importances list the smaller label first. */
  ranks: Int32Array;
  floor: number;
  length: number;
}

/** One study's directions: R's rows over the p parameters and N's eigenvalues (../importance.ts). */
export interface StudyDirections {
  rows: Float64Array[];
  lambda: number[];
}

/**
 * Every pair's most important studies, given each study's directions: at pair i·T + j, filled[pair]
 * entries from pair·length on, as values and study indices.
 */
export function importanceLists(input: ImportanceInput, directions: StudyDirections[]): { values: Float64Array; studies: Int32Array; filled: Int32Array } {
  const k = kernels();
  const T = input.options;
  const p = input.parameters;
  const pairs = T * T;
  const largest = directions.reduce((max, study) => Math.max(max, study.lambda.length), 1);
  const at = layout(k, {
    column: T * 4,
    variance: pairs * 8,
    values: pairs * input.length * 8,
    studies: pairs * input.length * 4,
    ranks: pairs * input.length * 4,
    filled: pairs * 4,
    rows: largest * p * 8,
    lambda: largest * 8,
    h: T * largest * 8,
  });
  const memory = k.memory.buffer;
  new Int32Array(memory, at.column, T).set(input.column);
  new Float64Array(memory, at.variance, pairs).set(input.variance);
  new Int32Array(memory, at.filled, pairs).fill(0);
  directions.forEach(({ rows, lambda }, study) => {
    rows.forEach((row, r) => new Float64Array(memory, at.rows + r * p * 8, p).set(row));
    new Float64Array(memory, at.lambda, lambda.length).set(lambda);
    k.scoreStudy(study, input.ranks[study]!, lambda.length, at.rows, at.lambda, p, T, at.column, at.variance, input.floor, input.length, at.values, at.studies, at.ranks, at.filled, at.h);
  });
  return {
    values: new Float64Array(memory, at.values, pairs * input.length).slice(),
    studies: new Int32Array(memory, at.studies, pairs * input.length).slice(),
    filled: new Int32Array(memory, at.filled, pairs).slice(),
  };
}
