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

/** x ↦ Aᵀ W A x with row weights w (0 leaves a row out); the hot product of every iteration, written out flat. */
export function mulGram(R: SparseRows, w: ArrayLike<number>, x: ArrayLike<number>): Float64Array {
  const out = new Float64Array(R.n);
  const { v, b1, b2 } = R;
  for (let i = 0; i < R.m; i++) {
    const wi = w[i];
    if (wi === 0) continue;
    const o = 6 * i;
    const p = 6 * b1[i];
    const q = 6 * b2[i];
    let s = 0;
    if (p >= 0) s += v[o] * x[p] + v[o + 1] * x[p + 1] + v[o + 2] * x[p + 2] + v[o + 3] * x[p + 3] + v[o + 4] * x[p + 4] + v[o + 5] * x[p + 5];
    if (q >= 0) s -= v[o] * x[q] + v[o + 1] * x[q + 1] + v[o + 2] * x[q + 2] + v[o + 3] * x[q + 3] + v[o + 4] * x[q + 4] + v[o + 5] * x[q + 5];
    s *= wi;
    if (p >= 0) for (let j = 0; j < 6; j++) out[p + j] += s * v[o + j];
    if (q >= 0) for (let j = 0; j < 6; j++) out[q + j] -= s * v[o + j];
  }
  return out;
}
