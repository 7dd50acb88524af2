/**
 * The canonical self-stress states of analysis.md §2 without the left null space in full.
 * The pivots of the reduced row-echelon form (contacts in sorted-id order) are the contacts whose row of A
 * depends on the rows after it; the rest (the lexicographically last row basis of A) is found by one sweep
 * over the rows in reverse sorted order, each rotated into a growing triangular factor (row-wise Givens QR
 * in the body graph's elimination order, George and Heath's method). A pivot's state is then the unique
 * balance λ_p = 1, A_Cᵀ λ_C = −a_pᵀ on the basis rows C: among the basis rows near the pivot when the loop
 * closes there (a small dense least-squares problem, ml-matrix), else by refinement with the sparse factor.
 * Written here because no npm package offers a row-sequential sparse QR.
 */
import { Matrix, solve } from "ml-matrix";
import { MAX_SELF_STRESS_LISTED, type SelfStressState } from "../constraint";
import { PinvSystem } from "./pinv";
import { addRowT, rowDot, type SparseRows } from "./rows";
import type { LowSpectrum } from "./spectrum";

type SparseVec = Map<number, Float64Array>;

/** Rows of A that form the lexicographically last row basis (by the given order), at threshold tau. */
export function lastRowBasis(R: SparseRows, sorted: number[], order: Int32Array, tau: number, rank: number): boolean[] {
  const N = R.N;
  const pos = new Int32Array(N);
  order.forEach((b, p) => (pos[b] = p));
  const slots: (SparseVec | null)[] = new Array(6 * N).fill(null);
  const inBasis = new Array<boolean>(R.m).fill(false);
  let accepted = 0;
  // once `rank` rows are in, every earlier row depends on them (the rank is decided by the singular values)
  for (let t = sorted.length - 1; t >= 0 && accepted < rank; t--) {
    const i = sorted[t];
    const x: SparseVec = new Map();
    const put = (b: number, sign: number) => {
      if (b < 0) return;
      const p = pos[b];
      const blk = x.get(p) ?? new Float64Array(6);
      for (let j = 0; j < 6; j++) blk[j] += sign * R.v[6 * i + j];
      x.set(p, blk);
    };
    put(R.b1[i], 1);
    put(R.b2[i], -1);
    const rowNorm = () => {
      let s = 0;
      for (const blk of x.values()) for (let j = 0; j < 6; j++) s += blk[j] * blk[j];
      return Math.sqrt(s);
    };
    let placed = false;
    // visit x's blocks in increasing elimination step; rotations only add later blocks
    while (x.size > 0 && !placed) {
      let p = Infinity;
      for (const k of x.keys()) if (k < p) p = k;
      const blk = x.get(p)!;
      for (let j = 0; j < 6 && !placed; j++) {
        const xv = blk[j];
        if (xv === 0) continue;
        const c = 6 * p + j;
        const r = slots[c];
        if (r) {
          // Givens rotation that zeroes x_c against the slot's row
          const rb = r.get(p)!;
          const a = rb[j];
          const h = Math.hypot(a, xv);
          const cs = a / h;
          const sn = xv / h;
          const keys = new Set<number>([...r.keys(), ...x.keys()]);
          for (const q of keys) {
            let rq = r.get(q);
            if (!rq) r.set(q, (rq = new Float64Array(6)));
            let xq = x.get(q);
            if (!xq) x.set(q, (xq = new Float64Array(6)));
            for (let jj = q === p ? j : 0; jj < 6; jj++) {
              const rv = rq[jj];
              const xw = xq[jj];
              rq[jj] = cs * rv + sn * xw;
              xq[jj] = -sn * rv + cs * xw;
            }
          }
          blk[j] = 0;
        } else {
          if (rowNorm() <= tau) break;
          if (Math.abs(xv) <= 1e-10 * rowNorm()) {
            blk[j] = 0;
            continue;
          }
          // independent: x becomes the slot's row (zeros before column c are dropped)
          for (let jj = 0; jj < j; jj++) blk[jj] = 0;
          slots[c] = x;
          inBasis[i] = true;
          accepted++;
          placed = true;
        }
      }
      if (placed) break;
      if (rowNorm() <= tau) break;
      x.delete(p);
    }
  }
  return inBasis;
}

/**
 * Canonical states: pivots are the rows outside the basis, in sorted order; the state of pivot p has
 * λ_p = 1, zero on every other pivot, and λ_C = −A_C (A_Cᵀ A_C)⁺ a_pᵀ on the basis rows.
 */
export function canonicalStatesSparse(R: SparseRows, contactIds: string[], spectrum: LowSpectrum, order: Int32Array, tolerance: number): SelfStressState[] {
  const sorted = contactIds.map((id, i) => [id, i] as const).sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  const idx = sorted.map(([, i]) => i);
  const inBasis = lastRowBasis(R, idx, order, tolerance * spectrum.sigmaMax, spectrum.rank);
  const pivots = idx.filter((i) => !inBasis[i]).slice(0, MAX_SELF_STRESS_LISTED);
  if (pivots.length === 0) return [];
  // A_C has the rank of A, so its null space is A's
  const w = inBasis.map((b) => (b ? 1 : 0));
  const sys = new PinvSystem(R, w, spectrum, tolerance);
  const states: SelfStressState[] = [];
  const basis = idx.filter((i) => inBasis[i]);
  const norm = (v: Float64Array) => {
    let t = 0;
    for (let i = 0; i < v.length; i++) t += v[i] * v[i];
    return Math.sqrt(t);
  };
  const local = localSolver(R, basis);
  const res = new Float64Array(R.n);
  for (const p of pivots) {
    // most loops close between a body and its neighbour: solved there, exactly, when they do
    const near = local(p);
    if (near) {
      states.push(stateOf(near, p));
      continue;
    }
    // λ_C = −A_C (A_CᵀA_C)⁺ a_p by refinement on the balance itself: start from λ_p = 1 alone, then
    // λ_C −= A_C step(Aᵀλ) while the residual falls. Every update lies in range(A_C), so the fixed point is
    // the minimum-norm (canonical) state; each step shrinks the error by ε/(μ+ε) ≤ 1/100
    const lam = new Float64Array(R.m);
    lam[p] = 1;
    res.fill(0);
    addRowT(R, p, 1, res);
    const aNorm = norm(res);
    let best = Infinity;
    for (let step = 0; step < 60; step++) {
      if (step > 0) {
        res.fill(0);
        addRowT(R, p, 1, res);
        for (const i of basis) if (lam[i] !== 0) addRowT(R, i, lam[i], res);
      }
      const rn = norm(res);
      // stop at round-off: the residual no longer halves
      if (rn <= 1e-16 * aNorm || (step > 1 && rn > 0.5 * best)) break;
      best = Math.min(best, rn);
      const dy = sys.step(res);
      for (const i of basis) lam[i] -= rowDot(R, i, dy);
    }
    states.push(stateOf(lam, p));
  }
  return states;

  function stateOf(lam: Float64Array, p: number): SelfStressState {
    let max = 0;
    for (const v of lam) max = Math.max(max, Math.abs(v));
    const forces: Record<string, number> = {};
    for (const [id, i] of sorted) if (Math.abs(lam[i]) >= 1e-9 * max) forces[id] = lam[i];
    return { pivot: contactIds[p], forces };
  }
}

/**
 * The state of a pivot from the basis rows near it. The basis rows are independent, so −a_p has exactly one
 * expression in them: if the rows among the pivot's own bodies (then among those and their neighbours) already
 * express it — a small dense least-squares problem with a residual at round-off — that is the state, with
 * zero on every other row. Null when no small neighbourhood closes the loop (the caller iterates globally).
 */
function localSolver(R: SparseRows, basis: number[]): (p: number) => Float64Array | null {
  // basis rows by body: those to ground only (solo), and every row touching the body
  const byBody = new Map<number, number[]>();
  const solo = new Map<number, number[]>();
  const push = (m: Map<number, number[]>, b: number, i: number) => {
    const list = m.get(b);
    if (list) list.push(i);
    else m.set(b, [i]);
  };
  for (const i of basis) {
    const [a, b] = [R.b1[i], R.b2[i]];
    if (a >= 0) push(byBody, a, i);
    if (b >= 0 && b !== a) push(byBody, b, i);
    if (a < 0 || b < 0 || a === b) push(solo, Math.max(a, b), i);
  }
  const MAX_BODIES = 10;
  const MAX_ROWS = 60;
  const other = (i: number, b: number) => (R.b1[i] === b ? R.b2[i] : R.b1[i]);
  /** basis rows whose bodies all lie in `near`: a row joining two of them is in both lists, so the largest list is skipped */
  const rowsWithin = (near: Set<number>): number[] | null => {
    const bodies = [...near];
    const largest = bodies.reduce((x, y) => ((byBody.get(y)?.length ?? 0) > (byBody.get(x)?.length ?? 0) ? y : x));
    const rows = new Set<number>(solo.get(largest) ?? []);
    for (const b of bodies) {
      if (b === largest) continue;
      for (const i of byBody.get(b) ?? []) {
        const o = other(i, b);
        if (o < 0 || o === b || near.has(o)) rows.add(i);
      }
      if (rows.size > MAX_ROWS) return null;
    }
    return rows.size && rows.size <= MAX_ROWS ? [...rows] : null;
  };
  return (p) => {
    const near = new Set([R.b1[p], R.b2[p]].filter((b) => b >= 0));
    if (!near.size) return null;
    for (let ring = 0; ring < 2; ring++) {
      if (ring === 1) {
        // the neighbours of the pivot's bodies, unless that makes the problem large (a hub's neighbours)
        let tooMany = false;
        for (const b of [...near]) {
          const list = byBody.get(b) ?? [];
          if (list.length > 4 * MAX_ROWS) {
            tooMany = true;
            break;
          }
          for (const i of list) {
            const o = other(i, b);
            if (o >= 0) near.add(o);
          }
          if (near.size > MAX_BODIES) {
            tooMany = true;
            break;
          }
        }
        if (tooMany) break;
      }
      const rows = rowsWithin(near);
      if (!rows) continue;
      const bodies = [...near];
      const col = new Map(bodies.map((b, k) => [b, 6 * k]));
      const M = new Matrix(6 * bodies.length, rows.length);
      const rhs = new Matrix(6 * bodies.length, 1);
      const put = (i: number, into: (q: number, v: number) => void) => {
        for (const [b, sign] of [
          [R.b1[i], 1],
          [R.b2[i], -1],
        ])
          if (b >= 0) for (let j = 0; j < 6; j++) into(col.get(b)! + j, sign * R.v[6 * i + j]);
      };
      rows.forEach((i, c) => put(i, (q, v) => M.set(q, c, M.get(q, c) + v)));
      put(p, (q, v) => rhs.set(q, 0, rhs.get(q, 0) - v));
      if (M.rows < M.columns) continue;
      let x: Matrix;
      try {
        x = solve(M, rhs);
      } catch {
        continue;
      }
      const r = M.mmul(x).sub(rhs);
      if (!(r.norm() <= 1e-12 * rhs.norm())) continue;
      const lam = new Float64Array(R.m);
      lam[p] = 1;
      rows.forEach((i, c) => (lam[i] = x.get(c, 0)));
      return lam;
    }
    return null;
  };
}
