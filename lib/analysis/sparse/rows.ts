/**
 * The scaled constraint matrix of analysis.md §1 kept as what it is: each row touches at most two bodies,
 * so a row is stored as its six coefficients and the two body indices (+ in `body`'s columns, − in `on`'s,
 * −1 for ground). Products with A and Aᵀ then cost 12 multiplications a row instead of 6N.
 */
export interface SparseRows {
  /** rows (contacts and flexure rows) */
  m: number;
  /** bodies (ground excluded) */
  N: number;
  /** columns, 6N */
  n: number;
  /** body index of `body` per row, −1 for ground */
  b1: Int32Array;
  /** body index of `on` per row, −1 for ground */
  b2: Int32Array;
  /** six coefficients per row: [((p − c) × n̂)/L, n̂] */
  v: Float64Array;
}

/** (A x)_i: the relative normal velocity of row i under the scaled twist x. */
export function rowDot(R: SparseRows, i: number, x: ArrayLike<number>): number {
  let s = 0;
  const o = 6 * i;
  const b1 = R.b1[i];
  const b2 = R.b2[i];
  if (b1 >= 0) for (let j = 0; j < 6; j++) s += R.v[o + j] * x[6 * b1 + j];
  if (b2 >= 0) for (let j = 0; j < 6; j++) s -= R.v[o + j] * x[6 * b2 + j];
  return s;
}

/** out += s · a_iᵀ (row i as a column). */
export function addRowT(R: SparseRows, i: number, s: number, out: { [k: number]: number }): void {
  if (s === 0) return;
  const o = 6 * i;
  const b1 = R.b1[i];
  const b2 = R.b2[i];
  if (b1 >= 0) for (let j = 0; j < 6; j++) out[6 * b1 + j] += s * R.v[o + j];
  if (b2 >= 0) for (let j = 0; j < 6; j++) out[6 * b2 + j] -= s * R.v[o + j];
}

/** y = A x */
export function mulA(R: SparseRows, x: ArrayLike<number>): Float64Array {
  const y = new Float64Array(R.m);
  for (let i = 0; i < R.m; i++) y[i] = rowDot(R, i, x);
  return y;
}

/** x = Aᵀ y */
export function mulAT(R: SparseRows, y: ArrayLike<number>): Float64Array {
  const x = new Float64Array(R.n);
  for (let i = 0; i < R.m; i++) addRowT(R, i, y[i], x);
  return x;
}

/** x ↦ Aᵀ W A x with row weights w (0 leaves a row out). */
export function mulGram(R: SparseRows, w: ArrayLike<number>, x: ArrayLike<number>): Float64Array {
  const out = new Float64Array(R.n);
  for (let i = 0; i < R.m; i++) if (w[i] !== 0) addRowT(R, i, w[i] * rowDot(R, i, x), out);
  return out;
}
