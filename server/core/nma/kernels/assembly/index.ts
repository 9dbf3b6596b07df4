// The engine's WebAssembly kernels (decision 0049): compiled by `npm run build:kernels` into
// ../wasm.ts, and called through ../index.ts.
export { fillNormals, seedNormals } from "./normals";
export { countRanks } from "./ranks";
export { cholesky } from "./linear";
export { exp, ln } from "./fdlibm";

/** Where the caller's arrays may start: above the kernels' own static data. */
export function heapBase(): usize {
  return __heap_base;
}
export { fitAt } from "./fit";
export { scoreStudy } from "./importance";
