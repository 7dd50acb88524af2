/**
 * Block Cholesky factor of M = Aᵀ W A + εI on the body graph (6 × 6 blocks, one block row per body),
 * eliminated in a minimum-degree order: leaves of a tree or star first, so trees, stars and chains
 * factor without fill and the cost grows with the bodies, not with their cube.
 * Written here because no package on npm offers a block-sparse Cholesky factor for this structure
 * (ml-matrix and mathjs are dense); the ordering is the classic minimum-degree heuristic.
 */
import type { SparseRows } from "./rows";

export interface BlockFactor {
  N: number;
  /** body eliminated at each step */
  order: Int32Array;
  /** elimination step of each body */
  pos: Int32Array;
  /** per step: the 6 × 6 lower Cholesky factor L of the pivot block (row-major) */
  diag: Float64Array[];
  /** per step: W_q = L⁻¹ M_pq for the later steps q it couples to */
  off: Map<number, Float64Array>[];
  /** the same blocks flattened for the solves: step p's blocks are offPtr[p] … offPtr[p+1]−1 */
  offPtr: Int32Array;
  offStep: Int32Array;
  offVal: Float64Array;
}

/** The body graph of the rows with a non-zero weight: adjacency sets. */
function bodyGraph(R: SparseRows, w: ArrayLike<number>): Set<number>[] {
  const adj = Array.from({ length: R.N }, () => new Set<number>());
  for (let i = 0; i < R.m; i++) {
    if (w[i] === 0) continue;
    const a = R.b1[i];
    const b = R.b2[i];
    if (a >= 0 && b >= 0 && a !== b) {
      adj[a].add(b);
      adj[b].add(a);
    }
  }
  return adj;
}

/** Minimum-degree elimination order of the body graph (ties broken by body index, so it is reproducible). */
export function minimumDegreeOrder(R: SparseRows, w: ArrayLike<number>): Int32Array {
  const adj = bodyGraph(R, w);
  const N = R.N;
  const done = new Uint8Array(N);
  const order = new Int32Array(N);
  for (let step = 0; step < N; step++) {
    let best = -1;
    for (let b = 0; b < N; b++) if (!done[b] && (best < 0 || adj[b].size < adj[best].size)) best = b;
    order[step] = best;
    done[best] = 1;
    const nb = [...adj[best]];
    for (const x of nb) {
      adj[x].delete(best);
      for (const y of nb) if (y !== x) adj[x].add(y);
    }
    adj[best].clear();
  }
  return order;
}

/** C += s · a bᵀ for 6-vectors (row-major 6 × 6). */
function addOuter(C: Float64Array, a: ArrayLike<number>, ao: number, b: ArrayLike<number>, bo: number, s: number): void {
  for (let r = 0; r < 6; r++) {
    const ar = s * a[ao + r];
    if (ar === 0) continue;
    for (let c = 0; c < 6; c++) C[6 * r + c] += ar * b[bo + c];
  }
}

/** In-place Cholesky of a 6 × 6 block (lower, row-major); false when it is not positive definite. */
function chol6(A: Float64Array): boolean {
  for (let j = 0; j < 6; j++) {
    let d = A[7 * j];
    for (let k = 0; k < j; k++) d -= A[6 * j + k] * A[6 * j + k];
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    A[7 * j] = l;
    for (let i = j + 1; i < 6; i++) {
      let s = A[6 * i + j];
      for (let k = 0; k < j; k++) s -= A[6 * i + k] * A[6 * j + k];
      A[6 * i + j] = s / l;
    }
    for (let c = j + 1; c < 6; c++) A[6 * j + c] = 0;
  }
  return true;
}

/** B ← L⁻¹ B for a 6 × 6 block B (row-major), L lower. */
function forwardBlock(L: Float64Array, B: Float64Array): void {
  for (let c = 0; c < 6; c++)
    for (let i = 0; i < 6; i++) {
      let s = B[6 * i + c];
      for (let k = 0; k < i; k++) s -= L[6 * i + k] * B[6 * k + c];
      B[6 * i + c] = s / L[7 * i];
    }
}

/**
 * Factors Aᵀ W A + shift·I (W = diag(w), rows with w = 0 left out); null when a pivot block is not
 * positive definite (the shift is too small for the round-off of a singular M: the caller raises it).
 */
export function factorGram(R: SparseRows, w: ArrayLike<number>, shift: number, order = minimumDegreeOrder(R, w)): BlockFactor | null {
  const N = R.N;
  const pos = new Int32Array(N);
  order.forEach((b, p) => (pos[b] = p));
  const diag = Array.from({ length: N }, () => new Float64Array(36));
  const upper = Array.from({ length: N }, () => new Map<number, Float64Array>());
  for (let p = 0; p < N; p++) for (let j = 0; j < 6; j++) diag[p][7 * j] = shift;
  for (let i = 0; i < R.m; i++) {
    const wi = w[i];
    if (wi === 0) continue;
    const a = R.b1[i];
    const b = R.b2[i];
    const o = 6 * i;
    if (a >= 0) addOuter(diag[pos[a]], R.v, o, R.v, o, wi);
    if (b >= 0) addOuter(diag[pos[b]], R.v, o, R.v, o, wi);
    if (a >= 0 && b >= 0 && a !== b) {
      // the block of the earlier step: (+v)(−v)ᵀ w, symmetric, so its orientation does not matter
      const p = Math.min(pos[a], pos[b]);
      const q = Math.max(pos[a], pos[b]);
      let blk = upper[p].get(q);
      if (!blk) upper[p].set(q, (blk = new Float64Array(36)));
      addOuter(blk, R.v, o, R.v, o, -wi);
    }
  }
  for (let p = 0; p < N; p++) {
    const L = diag[p];
    if (!chol6(L)) return null;
    const nb = [...upper[p].keys()].sort((x, y) => x - y);
    for (const q of nb) forwardBlock(L, upper[p].get(q)!);
    // Schur update of the later blocks: M_qq' −= W_qᵀ W_q'
    for (let s = 0; s < nb.length; s++) {
      const q = nb[s];
      const Wq = upper[p].get(q)!;
      for (let t = s; t < nb.length; t++) {
        const q2 = nb[t];
        const Wq2 = upper[p].get(q2)!;
        let target: Float64Array;
        if (q2 === q) target = diag[q];
        else {
          let blk = upper[q].get(q2);
          if (!blk) upper[q].set(q2, (blk = new Float64Array(36)));
          target = blk;
        }
        for (let r = 0; r < 6; r++)
          for (let c = 0; c < 6; c++) {
            let sum = 0;
            for (let k = 0; k < 6; k++) sum += Wq[6 * k + r] * Wq2[6 * k + c];
            target[6 * r + c] -= sum;
          }
      }
    }
  }
  const offPtr = new Int32Array(N + 1);
  for (let p = 0; p < N; p++) offPtr[p + 1] = offPtr[p] + upper[p].size;
  const offStep = new Int32Array(offPtr[N]);
  const offVal = new Float64Array(36 * offPtr[N]);
  for (let p = 0; p < N; p++) {
    let k = offPtr[p];
    for (const [q, W] of upper[p]) {
      offStep[k] = q;
      offVal.set(W, 36 * k);
      k++;
    }
  }
  return { N, order, pos, diag, off: upper, offPtr, offStep, offVal };
}

/** Solves (Aᵀ W A + shift·I) x = b with a factor (b in body order, 6 per body). */
export function solveFactor(F: BlockFactor, b: ArrayLike<number>): Float64Array {
  const { N, order, diag, offPtr, offStep, offVal: V } = F;
  // work in elimination order
  const y = new Float64Array(6 * N);
  for (let p = 0; p < N; p++) for (let j = 0; j < 6; j++) y[6 * p + j] = b[6 * order[p] + j];
  // forward: Lᵀ-blocks, y_p = L⁻¹ y_p, then y_q −= W_qᵀ y_p
  for (let p = 0; p < N; p++) {
    const L = diag[p];
    const o = 6 * p;
    for (let i = 0; i < 6; i++) {
      let s = y[o + i];
      for (let k = 0; k < i; k++) s -= L[6 * i + k] * y[o + k];
      y[o + i] = s / L[7 * i];
    }
    const [y0, y1, y2, y3, y4, y5] = [y[o], y[o + 1], y[o + 2], y[o + 3], y[o + 4], y[o + 5]];
    for (let e = offPtr[p]; e < offPtr[p + 1]; e++) {
      const oq = 6 * offStep[e];
      const w = 36 * e;
      for (let c = 0; c < 6; c++)
        y[oq + c] -= V[w + c] * y0 + V[w + 6 + c] * y1 + V[w + 12 + c] * y2 + V[w + 18 + c] * y3 + V[w + 24 + c] * y4 + V[w + 30 + c] * y5;
    }
  }
  // backward: x_p = L⁻ᵀ (y_p − Σ W_q x_q)
  for (let p = N - 1; p >= 0; p--) {
    const L = diag[p];
    const o = 6 * p;
    for (let e = offPtr[p]; e < offPtr[p + 1]; e++) {
      const oq = 6 * offStep[e];
      const w = 36 * e;
      const [x0, x1, x2, x3, x4, x5] = [y[oq], y[oq + 1], y[oq + 2], y[oq + 3], y[oq + 4], y[oq + 5]];
      for (let r = 0; r < 6; r++) {
        const wr = w + 6 * r;
        y[o + r] -= V[wr] * x0 + V[wr + 1] * x1 + V[wr + 2] * x2 + V[wr + 3] * x3 + V[wr + 4] * x4 + V[wr + 5] * x5;
      }
    }
    for (let i = 5; i >= 0; i--) {
      let s = y[o + i];
      for (let k = i + 1; k < 6; k++) s -= L[6 * k + i] * y[o + k];
      y[o + i] = s / L[7 * i];
    }
  }
  const x = new Float64Array(6 * N);
  for (let p = 0; p < N; p++) for (let j = 0; j < 6; j++) x[6 * order[p] + j] = y[6 * p + j];
  return x;
}
