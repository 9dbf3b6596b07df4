// The contrast-based network model of METHODS.md §3 (White, Barrett, Jackson & Higgins, Res Synth
// Methods 2012;3:111–125; Salanti, Res Synth Methods 2012;3:80–97): y = Xβ + δ + ε with
// ε ~ N(0, V) block-diagonal by study and δ ~ N(0, τ²P), P = 1 on the diagonal and ½ off it within a
// study (Higgins & Whitehead, Stat Med 1996;15:2733–2749). XᵀWX and XᵀWy are accumulated study by
// study; the full V is never formed.
import { CholeskyDecomposition, Matrix } from "ml-matrix";
import type { ArmEffects } from "./types";

/** One study's contrasts against its first arm (the baseline b): y_j = θ_j − θ_b (§2, Gleser & Olkin 2009). */
export interface StudyBlock {
  study: string;
  treatments: string[];
  y: number[];
  /** Var(y_j) = v_j + v_b on the diagonal, Cov(y_j, y_k) = v_b off it. */
  V: number[][];
  /** For each contrast, the parameter columns of +d_j and −d_b (−1 where the treatment is the reference). */
  plus: number[];
  minus: number[];
}

export function studyBlocks(studies: ArmEffects[], columnOf: (treatment: string) => number): StudyBlock[] {
  return studies.map((study) => {
    const vb = study.variances[0]!;
    const m = study.treatments.length - 1;
    const V = Array.from({ length: m }, (_, j) =>
      Array.from({ length: m }, (_, k) => vb + (j === k ? study.variances[j + 1]! : 0)),
    );
    const baseline = columnOf(study.treatments[0]!);
    return {
      study: study.study,
      treatments: study.treatments,
      y: study.effects.slice(1).map((theta) => theta - study.effects[0]!),
      V,
      plus: study.treatments.slice(1).map(columnOf),
      minus: Array.from({ length: m }, () => baseline),
    };
  });
}

/** Adds Xᵢᵀ S Xᵢ into target, for a small symmetric S over one study's contrasts. */
function addProjected(target: number[][], S: number[][], block: StudyBlock): void {
  const m = block.y.length;
  for (let r = 0; r < m; r++) {
    for (let s = 0; s < m; s++) {
      const w = S[r]![s]!;
      if (w === 0) continue;
      const pr = block.plus[r]!, mr = block.minus[r]!, ps = block.plus[s]!, ms = block.minus[s]!;
      if (pr >= 0 && ps >= 0) target[pr]![ps]! += w;
      if (pr >= 0 && ms >= 0) target[pr]![ms]! -= w;
      if (mr >= 0 && ps >= 0) target[mr]![ps]! -= w;
      if (mr >= 0 && ms >= 0) target[mr]![ms]! += w;
    }
  }
}

/** The product of two of a study's small square matrices (a multi-arm study's few contrasts). */
function product(a: number[][], b: number[][]): number[][] {
  const m = a.length;
  return a.map((row) => {
    const out = new Array<number>(m).fill(0);
    for (let k = 0; k < m; k++) for (let j = 0; j < m; j++) out[j]! += row[k]! * b[k]![j]!;
    return out;
  });
}

/** (S + Sᵀ)/2: rounding leaves inverses a hair off symmetric, and the Cholesky factorisation insists. */
export function symmetrise(S: number[][]): number[][] {
  return S.map((row, i) => row.map((value, j) => (i === j ? value : (value + S[j]![i]!) / 2)));
}

function trace(a: number[][]): number {
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += a[i]![i]!;
  return sum;
}

function quadratic(S: number[][], x: number[]): number {
  let sum = 0;
  for (let r = 0; r < x.length; r++) for (let s = 0; s < x.length; s++) sum += x[r]! * S[r]![s]! * x[s]!;
  return sum;
}

/** Σᵢ = Vᵢ + τ²Pᵢ, its inverse Wᵢ and log-determinant, through a Cholesky factor for multi-arm studies. */
function invertBlock(block: StudyBlock, tau2: number): { W: number[][]; P: number[][]; logDet: number } {
  const m = block.y.length;
  const P = Array.from({ length: m }, (_, j) => Array.from({ length: m }, (_, k) => (j === k ? 1 : 0.5)));
  if (m === 1) {
    const sigma = block.V[0]![0]! + tau2;
    return { W: [[1 / sigma]], P, logDet: Math.log(sigma) };
  }
  const sigma = block.V.map((row, j) => row.map((v, k) => v + tau2 * P[j]![k]!));
  const cholesky = new CholeskyDecomposition(sigma);
  if (!cholesky.isPositiveDefinite()) throw new Error(`the covariance of study ${block.study} is not positive definite`);
  const L = cholesky.lowerTriangularMatrix;
  let logDet = 0;
  for (let i = 0; i < m; i++) logDet += 2 * Math.log(L.get(i, i));
  return { W: symmetrise(cholesky.solve(Matrix.eye(m)).to2DArray()), P, logDet };
}

export interface Fit {
  tau2: number;
  /** β̂: the basic parameters d_R,t, one per non-reference treatment. */
  beta: number[];
  /** Cov(β̂) = (XᵀWX)⁻¹. */
  covariance: number[][];
  /** (y − Xβ̂)ᵀ W (y − Xβ̂). */
  residual: number;
  /** The restricted log-likelihood up to its constant, and its first derivative and Fisher information in τ². */
  restrictedLogLikelihood: number;
  score: number;
  information: number;
}

const zeros = (p: number) => Array.from({ length: p }, () => new Array<number>(p).fill(0));

/**
 * Generalised least squares at a given τ² (§3): β̂ = (XᵀWX)⁻¹XᵀWy, Cov(β̂) = (XᵀWX)⁻¹, with W the
 * inverse of V + τ²P. Also the REML criterion and its derivatives (Harville, JASA 1977;72:320–338):
 *   ℓ_R = −½ [Σ log|Σᵢ| + log|XᵀWX| + rᵀWr]
 *   ∂ℓ_R/∂τ² = ½ [rᵀWPWr − tr(WP) + tr(H·XᵀWPWX)],  H = (XᵀWX)⁻¹
 *   I(τ²) = ½ tr(ΠPΠP), Π = W − WXHXᵀW, expanded study by study.
 */
export function fitAt(blocks: StudyBlock[], parameters: number, tau2: number): Fit {
  const A = zeros(parameters);
  const c = new Array<number>(parameters).fill(0);
  const M = zeros(parameters); // Σ XᵢᵀWᵢPᵢWᵢXᵢ
  const N = zeros(parameters); // Σ XᵢᵀWᵢPᵢWᵢPᵢWᵢXᵢ
  let logDetSigma = 0;
  let traceWP = 0;
  let traceWPWP = 0;
  const weights: { W: number[][]; WPW: number[][] }[] = [];

  for (const block of blocks) {
    if (block.y.length === 1) {
      // A two-arm study (most of them): every matrix below is one number, P = [1], so
      // WP = W, WPW = W², WPWPW = W³; written out, to spare the small-matrix work.
      const sigma = block.V[0]![0]! + tau2;
      const w = 1 / sigma;
      logDetSigma += Math.log(sigma);
      const weight = { W: [[w]], WPW: [[w * w]] };
      addProjected(A, weight.W, block);
      const plus = block.plus[0]!, minus = block.minus[0]!;
      if (plus >= 0) c[plus]! += w * block.y[0]!;
      if (minus >= 0) c[minus]! -= w * block.y[0]!;
      traceWP += w;
      traceWPWP += w * w;
      addProjected(M, weight.WPW, block);
      addProjected(N, [[w * w * w]], block);
      weights.push(weight);
      continue;
    }
    const { W, P, logDet } = invertBlock(block, tau2);
    logDetSigma += logDet;
    addProjected(A, W, block);
    const Wy = W.map((row) => row.reduce((sum, w, s) => sum + w * block.y[s]!, 0));
    Wy.forEach((value, r) => {
      if (block.plus[r]! >= 0) c[block.plus[r]!]! += value;
      if (block.minus[r]! >= 0) c[block.minus[r]!]! -= value;
    });
    const WP = product(W, P);
    const WPW = product(WP, W);
    traceWP += trace(WP);
    traceWPWP += trace(product(WP, WP));
    addProjected(M, WPW, block);
    addProjected(N, product(product(WP, WP), W), block);
    weights.push({ W, WPW });
  }

  const cholesky = new CholeskyDecomposition(symmetrise(A));
  if (!cholesky.isPositiveDefinite()) throw new Error("XᵀWX is singular: the network is not connected");
  const H = cholesky.solve(Matrix.eye(parameters));
  const beta = H.mmul(Matrix.columnVector(c)).to1DArray();
  const lower = cholesky.lowerTriangularMatrix; // a getter that copies the factor at every call
  let logDetA = 0;
  for (let i = 0; i < parameters; i++) logDetA += 2 * Math.log(lower.get(i, i));

  let residual = 0;
  let residualP = 0;
  blocks.forEach((block, i) => {
    const r = block.y.map((y, j) => y - (block.plus[j]! >= 0 ? beta[block.plus[j]!]! : 0) + (block.minus[j]! >= 0 ? beta[block.minus[j]!]! : 0));
    residual += quadratic(weights[i]!.W, r);
    residualP += quadratic(weights[i]!.WPW, r);
  });

  const HM = H.mmul(new Matrix(M));
  const HN = H.mmul(new Matrix(N));
  let traceHM = 0;
  let traceHN = 0;
  let traceHMHM = 0;
  for (let p = 0; p < parameters; p++) {
    traceHM += HM.get(p, p);
    traceHN += HN.get(p, p);
    for (let q = 0; q < parameters; q++) traceHMHM += HM.get(p, q) * HM.get(q, p);
  }

  return {
    tau2,
    beta,
    covariance: symmetrise(H.to2DArray()),
    residual,
    restrictedLogLikelihood: -0.5 * (logDetSigma + logDetA + residual),
    score: 0.5 * (residualP - traceWP + traceHM),
    information: 0.5 * (traceWPWP - 2 * traceHN + traceHMHM),
  };
}
