/**
 * The canonical self-stress states of analysis.md §2 without the left null space in full.
 * The pivots of the reduced row-echelon form (contacts in sorted-id order) are the contacts whose row of A
 * depends on the rows after it; the rest (the lexicographically last row basis of A) is found by one sweep
 * over the rows in reverse sorted order, each rotated into a growing triangular factor (row-wise Givens QR
 * in the body graph's elimination order, George and Heath's method). A pivot's state is then the unique
 * balance λ_p = 1, A_Cᵀ λ_C = −a_pᵀ (modulo the free motions) on the basis rows C: among the basis rows near
 * the pivot when the loop closes there (a small dense least-squares problem, ml-matrix), else through the basis
 * rows' own triangular factor (corrected semi-normal equations), with conjugate gradients preconditioned by the
 * block Cholesky factor as the fallback. Rows are independent "modulo the free motions" (§2's left
 * null space is that of A with its numerical null space taken out): the basis in A is thinned by the rows
 * that stand apart only along a free motion whose singular value is small but not zero.
 * Written here because no npm package offers a row-sequential sparse QR.
 */
import { Matrix, inverse, solve } from "ml-matrix";
import { svdRight } from "../linalg";
import { MAX_SELF_STRESS_LISTED, type SelfStressState } from "../constraint";
import { PinvSystem, projectOut } from "./pinv";
import { addRowT, rowDot, type SparseRows } from "./rows";
import type { LowSpectrum } from "./spectrum";

type SparseVec = Map<number, Float64Array>;

/** Rows of A that form the lexicographically last row basis (by the given order), at threshold tau. */
export function lastRowBasis(
  R: SparseRows,
  sorted: number[],
  order: Int32Array,
  tau: number,
  limit: number,
): { inBasis: boolean[]; slots: (SparseVec | null)[]; pos: Int32Array } {
  const N = R.N;
  const pos = new Int32Array(N);
  order.forEach((b, p) => (pos[b] = p));
  const slots: (SparseVec | null)[] = new Array(6 * N).fill(null);
  const inBasis = new Array<boolean>(R.m).fill(false);
  let accepted = 0;
  // once `limit` rows are in, every earlier row depends on them
  for (let t = sorted.length - 1; t >= 0 && accepted < limit; t--) {
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
    let keep = 1;
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
          // no overflow to guard against (rows are scaled to order one): sqrt, not the slower Math.hypot
          const h = Math.sqrt(a * a + xv * xv);
          const cs = a / h;
          const sn = xv / h;
          // x is now keep · (the original row) + a combination of the original slot rows
          keep *= Math.abs(cs);
          // both rows get the union of their blocks, then one pass over the slot row's
          for (const q of x.keys()) if (!r.has(q)) r.set(q, new Float64Array(6));
          for (const [q, rq] of r) {
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
          // dependent when even ‖x‖ / keep, a bound on the original row's distance to the slot rows' span, is
          // under the threshold (‖x‖ alone is not: a rotation against a small pivot moves the row into the slot)
          if (rowNorm() <= tau * keep) break;
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
      if (rowNorm() <= tau * keep) break;
      x.delete(p);
    }
  }
  return { inBasis, slots, pos };
}

/**
 * The greedy row basis above is taken in A itself, where a direction just under the rank threshold (σ small
 * but not zero) still separates rows; the self-stress space of §2 is the left null space of A modulo its
 * numerical null space V₂ (λ is a state when Aᵀλ ∈ span V₂). The basis modulo V₂ is a subset of the basis in
 * A (a quotient's greedy basis lies inside the original's), short by e = |B| − rank rows: those are the
 * first rows, in sorted order, of the e combinations μ with A_Bᵀμ ∈ span V₂. They are found with the
 * triangular factor of the basis rows (semi-normal equations RᵀR y = V₂d, μ = A_B y, corrected while the residual falls),
 * d from the small dense SVD of what V₂'s columns leave outside range(Rᵀ). Drops them from `inBasis`.
 */
function quotientBasis(
  R: SparseRows,
  sorted: number[],
  found: { inBasis: boolean[]; slots: (SparseVec | null)[]; pos: Int32Array },
  nullBasis: Float64Array[],
  excess: number,
): void {
  const { inBasis, slots, pos } = found;
  const n = R.n;
  const { toElim, fromElim, forward, backward } = triangular(R, slots, pos);
  const basisRows = sorted.filter((i) => inBasis[i]);
  /** μ = A_B y for y in elimination coordinates */
  const muOf = (yElim: Float64Array) => {
    const y = fromElim(yElim);
    return basisRows.map((i) => rowDot(R, i, y));
  };
  // what each null vector leaves outside range(Rᵀ) = range(A_Bᵀ)
  const parts = nullBasis.map((z) => forward(toElim(z)));
  const nonSlot: number[] = [];
  for (let c = 0; c < n; c++) if (!slots[c]) nonSlot.push(c);
  const L = new Matrix(Math.max(nonSlot.length, nullBasis.length), nullBasis.length);
  parts.forEach(({ left }, j) => nonSlot.forEach((c, k) => L.set(k, j, left[c])));
  const { V } = svdRight(L);
  const mus: number[][] = [];
  for (let e = 0; e < excess; e++) {
    // the combinations d that R reaches: the right singular vectors of the smallest singular values
    const d = V.getColumn(nullBasis.length - 1 - e);
    const target = new Float64Array(n);
    nullBasis.forEach((z, j) => {
      for (let i = 0; i < n; i++) target[i] += d[j] * z[i];
    });
    const targetElim = toElim(target);
    let mu = muOf(backward(forward(targetElim).t));
    // corrected steps: the residual of A_Bᵀμ = V₂d through the same factor, while it falls
    let best = Infinity;
    for (let pass = 0; pass < 6; pass++) {
      const back = new Float64Array(n);
      basisRows.forEach((i, k) => addRowT(R, i, mu[k], back));
      const resid = toElim(back.map((v, i) => target[i] - v));
      const rn = Math.hypot(...resid);
      if (!(rn < 0.5 * best) || rn === 0) break;
      best = rn;
      const fix = muOf(backward(forward(resid).t));
      mu = mu.map((v, k) => v + fix[k]);
    }
    mus.push(mu);
  }
  // the first rows, in sorted order, of the span of the μ: Gram–Schmidt on the rows of an orthonormal basis
  const Y = orthonormalColumns(mus, basisRows.length);
  const kept: number[][] = [];
  let dropped = 0;
  for (let k = 0; k < basisRows.length && dropped < excess; k++) {
    const res = Y.map((col) => col[k]);
    for (let pass = 0; pass < 2; pass++)
      for (const b of kept) {
        let dd = 0;
        for (let c = 0; c < res.length; c++) dd += b[c] * res[c];
        for (let c = 0; c < res.length; c++) res[c] -= dd * b[c];
      }
    const len = Math.hypot(...res);
    if (len > 1e-8) {
      kept.push(res.map((v) => v / len));
      inBasis[basisRows[k]] = false;
      dropped++;
    }
  }
}

/**
 * Solves for the state coefficients on the basis rows C directly: λ_C with A_Cᵀ λ_C = rhs + V₂ d (the balance
 * up to a free motion), through the row QR factor of C alone (A_CᵀA_C = RᵀR): Rᵀt = rhs + V₂d forward on R's
 * columns, d chosen so nothing is left on the free columns (a small dense solve), R y = t back, λ_C = A_C y.
 * Null when the factor of C does not take every row of C (the caller falls back to conjugate gradients).
 */
function stateSolver(R: SparseRows, basis: number[], order: Int32Array, nullBasis: Float64Array[], tau: number): ((rhs: Float64Array) => Float64Array) | null {
  const own = lastRowBasis(R, basis, order, tau, R.n);
  if (own.inBasis.filter(Boolean).length !== basis.length) return null;
  const F = triangular(R, own.slots, own.pos);
  const free: number[] = [];
  for (let c = 0; c < R.n; c++) if (!own.slots[c]) free.push(c);
  if (free.length !== nullBasis.length) return null;
  const parts = nullBasis.map((z) => F.forward(F.toElim(z)));
  const L = new Matrix(free.length, free.length);
  parts.forEach(({ left }, j) => free.forEach((c, k) => L.set(k, j, left[c])));
  let Linv: Matrix | null = null;
  if (free.length > 0) {
    try {
      Linv = inverse(L);
    } catch {
      return null;
    }
  }
  return (rhs) => {
    const g = F.forward(F.toElim(rhs));
    if (Linv) {
      const d = Linv.mmul(Matrix.columnVector(free.map((c) => -g.left[c]))).getColumn(0);
      parts.forEach(({ t }, j) => {
        for (let i = 0; i < t.length; i++) g.t[i] += d[j] * t[i];
      });
    }
    const y = F.fromElim(F.backward(g.t));
    return Float64Array.from(basis, (i) => rowDot(R, i, y));
  };
}

/**
 * Forward and back substitution with a row QR factor (slot rows by column, in elimination coordinates), the
 * rows copied once into flat arrays (column index and value, diagonal first) for the repeated solves.
 */
function triangular(R: SparseRows, slots: (SparseVec | null)[], pos: Int32Array) {
  const n = R.n;
  const cols: number[] = [];
  slots.forEach((r, c) => r && cols.push(c));
  const ptr = new Int32Array(cols.length + 1);
  let nnz = 0;
  for (const c of cols) for (const blk of slots[c]!.values()) for (let j = 0; j < 6; j++) if (blk[j] !== 0) nnz++;
  const at = new Int32Array(nnz);
  const val = new Float64Array(nnz);
  let e = 0;
  cols.forEach((c, k) => {
    const r = slots[c]!;
    at[e] = c;
    val[e++] = r.get(Math.floor(c / 6))![c % 6];
    for (const [q, blk] of r)
      for (let j = 0; j < 6; j++)
        if (blk[j] !== 0 && 6 * q + j !== c) {
          at[e] = 6 * q + j;
          val[e++] = blk[j];
        }
    ptr[k + 1] = e;
  });
  return {
    // elimination coordinates: column 6·pos[b] + j is body b's coordinate j
    toElim(v: ArrayLike<number>) {
      const out = new Float64Array(n);
      for (let b = 0; b < R.N; b++) for (let j = 0; j < 6; j++) out[6 * pos[b] + j] = v[6 * b + j];
      return out;
    },
    fromElim(v: ArrayLike<number>) {
      const out = new Float64Array(n);
      for (let b = 0; b < R.N; b++) for (let j = 0; j < 6; j++) out[6 * b + j] = v[6 * pos[b] + j];
      return out;
    },
    /** Rᵀ t = z on the slot columns (forward); t and what is left on the other columns */
    forward(z: Float64Array) {
      const left = Float64Array.from(z);
      const t = new Float64Array(n);
      for (let k = 0; k < cols.length; k++) {
        const c = cols[k];
        const tc = left[c] / val[ptr[k]];
        t[c] = tc;
        left[c] = 0;
        for (let i = ptr[k] + 1; i < ptr[k + 1]; i++) left[at[i]] -= val[i] * tc;
      }
      return { t, left };
    },
    /** R y = t (back substitution), y zero off the slot columns */
    backward(t: Float64Array) {
      const y = new Float64Array(n);
      for (let k = cols.length - 1; k >= 0; k--) {
        let sum = t[cols[k]];
        for (let i = ptr[k] + 1; i < ptr[k + 1]; i++) sum -= val[i] * y[at[i]];
        y[cols[k]] = sum / val[ptr[k]];
      }
      return y;
    },
  };
}

/** An orthonormal basis (modified Gram–Schmidt, twice) of the given vectors of length `len`. */
function orthonormalColumns(vs: number[][], len: number): number[][] {
  const out: number[][] = [];
  for (const v0 of vs) {
    const v = v0.slice(0, len);
    for (let pass = 0; pass < 2; pass++)
      for (const q of out) {
        let d = 0;
        for (let i = 0; i < len; i++) d += q[i] * v[i];
        for (let i = 0; i < len; i++) v[i] -= d * q[i];
      }
    const l = Math.hypot(...v);
    if (l > 0) out.push(v.map((x) => x / l));
  }
  return out;
}

/**
 * Canonical states: pivots are the rows outside the basis, in sorted order; the state of pivot p has
 * λ_p = 1, zero on every other pivot, and on the basis rows the λ_C with P₁(a_pᵀ + A_Cᵀλ_C) = 0 (P₁ projecting
 * out the free motions: the state balances up to a motion the layout does not constrain, as the left singular
 * vectors of the dense path do).
 */
export function canonicalStatesSparse(R: SparseRows, contactIds: string[], spectrum: LowSpectrum, order: Int32Array, tolerance: number): SelfStressState[] {
  const sorted = contactIds.map((id, i) => [id, i] as const).sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  const idx = sorted.map(([, i]) => i);
  const found = lastRowBasis(R, idx, order, tolerance * spectrum.sigmaMax, R.n);
  const { inBasis } = found;
  const excess = inBasis.filter(Boolean).length - spectrum.rank;
  if (excess > 0) {
    // the factor above also absorbed the rows it rejected: the semi-normal equations need the basis rows' own
    const own = lastRowBasis(
      R,
      idx.filter((i) => inBasis[i]),
      order,
      0,
      R.n,
    );
    quotientBasis(R, idx, { inBasis, slots: own.slots, pos: own.pos }, spectrum.nullBasis, excess);
  }
  const pivots = idx.filter((i) => !inBasis[i]).slice(0, MAX_SELF_STRESS_LISTED);
  if (pivots.length === 0) return [];
  const states: SelfStressState[] = [];
  const basis = idx.filter((i) => inBasis[i]);
  const norm = (v: Float64Array) => {
    let t = 0;
    for (let i = 0; i < v.length; i++) t += v[i] * v[i];
    return Math.sqrt(t);
  };
  /** P₁(a_p + A_Cᵀ λ_C), P₁ taking out the free motions */
  const balance = (lam: Float64Array, p: number) => {
    const res = new Float64Array(R.n);
    addRowT(R, p, 1, res);
    for (const i of basis) if (lam[i] !== 0) addRowT(R, i, lam[i], res);
    return projectOut(spectrum.nullBasis, res);
  };
  const local = localSolver(R, basis);
  let direct: ((rhs: Float64Array) => Float64Array) | null | undefined;
  let sys: PinvSystem | undefined;
  let fruitless = 0;
  for (const p of pivots) {
    // most loops close between a body and its neighbour: solved there, exactly, when they do
    const near = local(p);
    if (near) {
      states.push(stateOf(near, p));
      continue;
    }
    const a = new Float64Array(R.n);
    addRowT(R, p, 1, a);
    const aNorm = norm(a);
    // first by the basis rows' own triangular factor (corrected semi-normal equations), refined while the
    // balance falls; accepted at 1e-8 of the pivot's row (on ill-conditioned basis rows the semi-normal
    // equations stop there, and conjugate gradients rarely do better). Built once: a null one stays null
    if (direct === undefined) direct = stateSolver(R, basis, order, spectrum.nullBasis, tolerance * spectrum.sigmaMax);
    // the best so far: λ_p = 1 alone to begin with
    let lam = new Float64Array(R.m);
    lam[p] = 1;
    let lamRes = norm(balance(lam, p));
    if (direct) {
      const x = new Float64Array(R.m);
      x[p] = 1;
      let res: Float64Array = a;
      let best = Infinity;
      for (let pass = 0; pass < 4; pass++) {
        const dl = direct(res.map((v) => -v));
        basis.forEach((i, k) => (x[i] += dl[k]));
        const rn = norm((res = balance(x, p)));
        if (rn < lamRes) [lam, lamRes] = [Float64Array.from(x), rn];
        if (!(rn < 0.5 * best) || rn <= 1e-15 * aNorm) break;
        best = rn;
      }
    }
    if (!(lamRes <= 1e-8 * aNorm) && fruitless < 5) {
      // else λ_C = −A_C (A_CᵀA_C)⁺ a_p, the pseudo-inverse by preconditioned conjugate gradients (patient: on
      // ill-conditioned basis rows their residual stalls before it falls), refined while the balance falls.
      // A_C has the rank of A: its operator, with A's free motions projected out, is invertible on the rest.
      // Once five of these have failed too, the canonical form of this layout is numerically meaningless
      // (its pivots are a round-off decision): the remaining states keep the direct result.
      sys ??= new PinvSystem(
        R,
        inBasis.map((b) => (b ? 1 : 0)),
        spectrum,
        tolerance,
      );
      const x = new Float64Array(R.m);
      x[p] = 1;
      let best = Infinity;
      for (let pass = 0; pass < 4; pass++) {
        const res = balance(x, p);
        const rn = norm(res);
        if (rn < lamRes) [lam, lamRes] = [Float64Array.from(x), rn];
        if (rn <= 1e-15 * aNorm || rn > 0.5 * best) break;
        best = rn;
        const y = sys.apply(res, 10);
        for (const i of basis) x[i] -= rowDot(R, i, y);
      }
      if (!(lamRes <= 1e-8 * aNorm)) fruitless++;
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
