// Study importance (METHODS.md §13; Rücker, Nikolakopoulou, Papakonstantinou, Salanti, Riley &
// Schwarzer, BMC Med Res Methodol 2020;20:190): for the pair A, B and study s,
//   I_s(A,B) = 1 − v_N(A,B) / v_N⁽⁻ˢ⁾(A,B),
// the loss of precision of the network estimate when s is left out, with τ² held at the full-data
// estimate. Rather than refitting the model once per study, the information matrix without s is
// reached by a rank-k update (Woodbury): with H = (XᵀWX)⁻¹, Xₛ the study's design rows and
// Σₛ = Vₛ + τ²Pₛ its covariance (k contrasts),
//   (XᵀWX − XₛᵀΣₛ⁻¹Xₛ)⁻¹ = H + HXₛᵀ(Σₛ − XₛHXₛᵀ)⁻¹XₛH.
// Written with Σₛ = LLᵀ and the eigen-decomposition QΛQᵀ of N = I − L⁻¹XₛHXₛᵀL⁻ᵀ (eigenvalues in
// [0, 1]), the variance of c = e_A − e_B becomes v_N + Σᵢ hᵢ²/λᵢ with h = QᵀL⁻¹XₛHc. A zero λᵢ is a
// direction the network loses with s: if c has a part in it (hᵢ ≠ 0), A and B are no longer
// connected (or s holds the only data on one of them) and I = 1; if not, the direction does not
// touch A vs B, as with a generalised inverse.
import { CholeskyDecomposition, EigenvalueDecomposition, inverse, Matrix } from "ml-matrix";
import { importanceLists, type StudyDirections } from "./kernels";
import { symmetrise, type StudyBlock } from "./model";

export interface StudyImportance {
  study: string;
  value: number;
}

/** Report per pair the studies with I ≥ 0.001, largest first, at most 10 (§13). */
export const importanceFloor = 0.001;
export const importanceListLength = 10;

/**
 * One study's rows of R = QᵀL⁻¹XₛH (over the parameters) and the eigenvalues λ of N: what the pair
 * loop needs. `columns` is p, the number of basic parameters.
 */
function studyUpdate(block: StudyBlock, H: number[][], tau2: number, columns: number): StudyDirections {
  const m = block.y.length;
  const row = (column: number) => (column >= 0 ? H[column]! : null);
  // K = XₛH: contrast j's row is H[plus_j] − H[minus_j] (the reference has no row).
  const K = Array.from({ length: m }, (_, j) => {
    const k = new Float64Array(columns);
    const plus = row(block.plus[j]!);
    const minus = row(block.minus[j]!);
    for (let q = 0; q < columns; q++) k[q] = (plus ? plus[q]! : 0) - (minus ? minus[q]! : 0);
    return k;
  });
  const at = (k: Float64Array, column: number) => (column >= 0 ? k[column]! : 0);
  // G = XₛHXₛᵀ.
  const G = K.map((k) => block.plus.map((plus, l) => at(k, plus) - at(k, block.minus[l]!)));
  const sigma = block.V.map((r, j) => r.map((v, l) => v + tau2 * (j === l ? 1 : 0.5)));

  if (m === 1) {
    const scale = 1 / Math.sqrt(sigma[0]![0]!);
    const rowOut = K[0]!.map((v) => v * scale);
    return { rows: [rowOut], lambda: [1 - G[0]![0]! / sigma[0]![0]!] };
  }
  const inverseL = inverse(new CholeskyDecomposition(sigma).lowerTriangularMatrix);
  const N = Matrix.eye(m).sub(inverseL.mmul(new Matrix(G)).mmul(inverseL.transpose()));
  const eigen = new EigenvalueDecomposition(new Matrix(symmetrise(N.to2DArray())), { assumeSymmetric: true });
  // R = Qᵀ L⁻¹ K.
  const R = eigen.eigenvectorMatrix.transpose().mmul(inverseL).mmul(new Matrix(K.map((k) => Array.from(k))));
  return { rows: R.to2DArray().map((r) => Float64Array.from(r)), lambda: eigen.realEigenvalues };
}

/**
 * The most important studies of every pair of `treatments` (in the engine's order: i < j), keyed
 * "i,j" by the treatments' indices. `columnOf` maps a treatment to its parameter (−1: reference). Each
 * study's directions are found here; the pairs are scored in WebAssembly (./kernels/assembly/importance.ts).
 */
export function studyImportances(
  blocks: readonly StudyBlock[],
  H: number[][],
  tau2: number,
  treatments: readonly string[],
  columnOf: (treatment: string) => number,
): (a: number, b: number) => StudyImportance[] {
  const T = treatments.length;
  const columns = H.length;
  const column = Int32Array.from(treatments, columnOf);
  const entry = (i: number, q: number) => (i >= 0 && q >= 0 ? H[i]![q]! : 0);
  // v_N of every pair, once.
  const variance = new Float64Array(T * T);
  for (let i = 0; i < T; i++) {
    for (let j = i + 1; j < T; j++) {
      const a = column[i]!, b = column[j]!;
      variance[i * T + j] = entry(a, a) + entry(b, b) - 2 * entry(a, b);
    }
  }
  // Equal importances list the smaller label first: each label's place in code-unit order.
  const labels = blocks.map((block) => block.study);
  const order = labels.map((_, i) => i).sort((x, y) => (labels[x]! < labels[y]! ? -1 : labels[x]! > labels[y]! ? 1 : 0));
  const ranks = new Int32Array(blocks.length);
  order.forEach((study, place) => (ranks[study] = place));

  const lists = importanceLists(
    { options: T, parameters: columns, column, variance, ranks, floor: importanceFloor, length: importanceListLength },
    blocks.map((block) => studyUpdate(block, H, tau2, columns)),
  );
  const listOf = (pair: number): StudyImportance[] =>
    Array.from({ length: lists.filled[pair]! }, (_, e) => ({
      study: labels[lists.studies[pair * importanceListLength + e]!]!,
      value: lists.values[pair * importanceListLength + e]!,
    }));
  return (a, b) => listOf(a < b ? a * T + b : b * T + a);
}
