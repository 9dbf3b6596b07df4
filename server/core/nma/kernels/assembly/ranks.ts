// The rank draws of METHODS.md §6: β = β̂ + L z with Cov(β̂) = L Lᵀ and z standard normal, the
// options ranked best first in each draw and counted. The caller lays out the arrays (byte offsets,
// row-major) and reads the counts back.
import { at, index, put } from "./linear";
import { normal } from "./normals";

/**
 * Adds `draws` draws to counts[t·T + rank] (rank 0 = best). The T options are the reference (value
 * 0, at `reference`) and p parameters: option parameterIndex[i] takes sign·(mean[i] + Σⱼ L[i][j] z[j]),
 * and the smallest value ranks first. `values` (T doubles), `order` (T integers) and `z` (p doubles)
 * are scratch space.
 */
export function countRanks(
  p: i32,
  T: i32,
  draws: i32,
  sign: f64,
  reference: i32,
  L: usize,
  mean: usize,
  parameterIndex: usize,
  counts: usize,
  values: usize,
  order: usize,
  z: usize,
): void {
  for (let t = 0; t < T; t++) store<i32>(order + (<usize>t << 2), t);
  for (let draw = 0; draw < draws; draw++) {
    for (let j = 0; j < p; j++) put(z, j, normal());
    put(values, reference, 0.0);
    for (let i = 0; i < p; i++) {
      const row = L + (<usize>(i * p) << 3);
      let sum = at(mean, i);
      for (let j = 0; j <= i; j++) sum += at(row, j) * at(z, j);
      put(values, index(parameterIndex, i), sign * sum);
    }
    // Insertion sort from the previous draw's order, which changes little from draw to draw. Ties go
    // to the lower option index, so the order is the one a stable sort from scratch would give.
    for (let i = 1; i < T; i++) {
      const t = index(order, i);
      const value = at(values, t);
      let place = i;
      for (; place > 0; place--) {
        const before = index(order, place - 1);
        const other = at(values, before);
        if (!(other > value || (other == value && before > t))) break;
        store<i32>(order + (<usize>place << 2), before);
      }
      store<i32>(order + (<usize>place << 2), t);
    }
    for (let rank = 0; rank < T; rank++) {
      const cell = counts + (<usize>(index(order, rank) * T + rank) << 3);
      store<f64>(cell, load<f64>(cell) + 1.0);
    }
  }
}
