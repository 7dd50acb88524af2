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
 * The row QR keeps a fixed column order, so it does not reveal rank: on layouts whose canonical form is
 * ill-posed its basis rows can be singular to working precision. A state that then fails to balance sends the
 * whole form to the dense path's own pivot rule, applied to the projections P_S e_j of unit vectors on the
 * self-stress space (statesByProjection): the same pivots, and states that balance.
 * Written here because no npm package offers a row-sequential sparse QR.
 */
import { Matrix, SingularValueDecomposition, inverse, solve } from "ml-matrix";
import { svdRight } from "../linalg";
import { MAX_SELF_STRESS_LISTED, type SelfStressState } from "../constraint";
import { PinvSystem, projectOut } from "./pinv";
import { addRowT, mulAT, rowDot, type SparseRows } from "./rows";
import type { LowSpectrum } from "./spectrum";

/**
 * Storage of a row QR factor in the body graph's elimination order. The slot rows of step p can only touch the
 * steps that eliminating p couples it to (the pattern of the block Cholesky factor of AᵀA: George and Heath),
 * so each step's six slot rows are kept dense over that fixed pattern, found once before any rotation.
 */
export interface RowFactor {
  /** elimination step of each body */
  pos: Int32Array;
  /** per step p: the steps its slot rows may touch, p itself first, then ascending */
  pattern: Int32Array[];
  /** per elimination column c = 6p + j: whether a row holds that slot */
  has: Uint8Array;
  /** per step p: its six slot rows, row j at 6·|pattern[p]|·j, block k of the pattern at 6k within it */
  val: Float64Array[];
}

/** The elimination steps and fill pattern of the body graph of all rows, in the given body order. */
export function symbolicPattern(R: SparseRows, order: Int32Array): { pos: Int32Array; pattern: Int32Array[] } {
  const N = R.N;
  const pos = new Int32Array(N);
  order.forEach((b, p) => (pos[b] = p));
  const adj = Array.from({ length: N }, () => new Set<number>());
  for (let i = 0; i < R.m; i++) {
    const [a, b] = [R.b1[i], R.b2[i]];
    if (a >= 0 && b >= 0 && a !== b) {
      adj[pos[a]].add(pos[b]);
      adj[pos[b]].add(pos[a]);
    }
  }
  const pattern: Int32Array[] = [];
  for (let p = 0; p < N; p++) {
    const later = [...adj[p]].filter((q) => q > p).sort((x, y) => x - y);
    pattern.push(Int32Array.from([p, ...later]));
    // eliminating p joins its later neighbours to one another
    for (const q of later) for (const q2 of later) if (q2 !== q) adj[q].add(q2);
  }
  return { pos, pattern };
}

/**
 * Rows of A that form the lexicographically last row basis (by the order of `sorted`), at threshold tau, and
 * the triangular factor of those rows alone. Each row is rotated in a dense scratch vector, block by block in
 * increasing elimination step: the part of it still to eliminate at step p lies within p's pattern. A row found
 * dependent is taken back out: its rotations are undone in reverse order (orthogonal, so the slot rows return
 * to round-off), which leaves the factor of the basis rows' own (what the semi-normal equations need).
 */
export function lastRowBasis(
  R: SparseRows,
  sorted: number[],
  sym: { pos: Int32Array; pattern: Int32Array[] },
  tau: number,
  limit: number,
): { inBasis: boolean[]; factor: RowFactor } {
  const { pos, pattern } = sym;
  const N = R.N;
  const has = new Uint8Array(6 * N);
  const val = pattern.map((pt) => new Float64Array(36 * pt.length));
  const inBasis = new Array<boolean>(R.m).fill(false);
  const x = new Float64Array(6 * N);
  const live = new Uint8Array(N);
  const touched: number[] = [];
  // the current row's rotations (slot column, cosine, sine) and the entries it dropped below the cut
  const turns: number[] = [];
  const cuts: number[] = [];
  let accepted = 0;
  const rowNorm = () => {
    let s = 0;
    for (const q of touched) if (live[q]) for (let j = 6 * q; j < 6 * q + 6; j++) s += x[j] * x[j];
    return Math.sqrt(s);
  };
  /** Givens rotation of slot row (p, j) and x over p's pattern: r ← c·r + s·x, x ← −s·r + c·x (s → −s undoes it) */
  const turn = (p: number, j: number, cs: number, sn: number) => {
    const pt = pattern[p];
    const base = 6 * pt.length * j;
    const rv = val[p];
    for (let k = 0; k < pt.length; k++) {
      const q = pt[k];
      if (!live[q]) {
        live[q] = 1;
        touched.push(q);
      }
      const xo = 6 * q;
      const ro = base + 6 * k;
      for (let jj = k === 0 ? j : 0; jj < 6; jj++) {
        const r0 = rv[ro + jj];
        const x0 = x[xo + jj];
        rv[ro + jj] = cs * r0 + sn * x0;
        x[xo + jj] = -sn * r0 + cs * x0;
      }
    }
  };
  // once `limit` rows are in, every earlier row depends on them
  for (let t = sorted.length - 1; t >= 0 && accepted < limit; t--) {
    const i = sorted[t];
    touched.length = 0;
    for (const [b, sign] of [
      [R.b1[i], 1],
      [R.b2[i], -1],
    ]) {
      if (b < 0) continue;
      const p = pos[b];
      if (!live[p]) {
        live[p] = 1;
        touched.push(p);
      }
      for (let j = 0; j < 6; j++) x[6 * p + j] += sign * R.v[6 * i + j];
    }
    let placed = false;
    let keep = 1;
    turns.length = 0;
    cuts.length = 0;
    for (;;) {
      let p = -1;
      for (const q of touched) if (live[q] && (p < 0 || q < p)) p = q;
      if (p < 0) break;
      const pt = pattern[p];
      const width = 6 * pt.length;
      const rv = val[p];
      for (let j = 0; j < 6 && !placed; j++) {
        const xv = x[6 * p + j];
        if (xv === 0) continue;
        const base = width * j;
        if (has[6 * p + j]) {
          // Givens rotation that zeroes x_c against the slot's row
          const a = rv[base + j];
          // no overflow to guard against (rows are scaled to order one): sqrt, not the slower Math.hypot
          const h = Math.sqrt(a * a + xv * xv);
          const cs = a / h;
          const sn = xv / h;
          // x is now keep · (the original row) + a combination of the original slot rows
          keep *= Math.abs(cs);
          turns.push(6 * p + j, cs, sn);
          turn(p, j, cs, sn);
          x[6 * p + j] = 0;
        } else {
          // dependent when even ‖x‖ / keep, a bound on the original row's distance to the slot rows' span, is
          // under the threshold (‖x‖ alone is not: a rotation against a small pivot moves the row into the slot)
          const len = rowNorm();
          if (len <= tau * keep) break;
          if (Math.abs(xv) <= 1e-10 * len) {
            cuts.push(6 * p + j, xv);
            x[6 * p + j] = 0;
            continue;
          }
          // independent: x becomes the slot's row (zeros before column c are dropped)
          for (let k = 0; k < pt.length; k++) for (let jj = k === 0 ? j : 0; jj < 6; jj++) rv[base + 6 * k + jj] = x[6 * pt[k] + jj];
          has[6 * p + j] = 1;
          inBasis[i] = true;
          accepted++;
          placed = true;
        }
      }
      if (placed || rowNorm() <= tau * keep) break;
      // block p is done: every entry rotated away or dropped
      x.fill(0, 6 * p, 6 * p + 6);
      live[p] = 0;
    }
    if (!placed && turns.length > 0) {
      // dependent: the dropped entries back in place (no later rotation touched them), then every rotation
      // undone, last first; x's blocks reappear as the slot rows' patterns need them
      for (let e = 0; e < cuts.length; e += 2) x[cuts[e]] = cuts[e + 1];
      for (let e = turns.length - 3; e >= 0; e -= 3) {
        const p = Math.floor(turns[e] / 6);
        turn(p, turns[e] - 6 * p, turns[e + 1], -turns[e + 2]);
      }
    }
    for (const q of touched) {
      x.fill(0, 6 * q, 6 * q + 6);
      live[q] = 0;
    }
  }
  return { inBasis, factor: { pos, pattern, has, val } };
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
function quotientBasis(R: SparseRows, sorted: number[], inBasis: boolean[], factor: RowFactor, nullBasis: Float64Array[], excess: number): void {
  const n = R.n;
  const { toElim, fromElim, forward, backward } = triangular(R, factor);
  const basisRows = sorted.filter((i) => inBasis[i]);
  /** μ = A_B y for y in elimination coordinates */
  const muOf = (yElim: Float64Array) => {
    const y = fromElim(yElim);
    return basisRows.map((i) => rowDot(R, i, y));
  };
  // what each null vector leaves outside range(Rᵀ) = range(A_Bᵀ)
  const parts = nullBasis.map((z) => forward(toElim(z)));
  const nonSlot: number[] = [];
  for (let c = 0; c < n; c++) if (!factor.has[c]) nonSlot.push(c);
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
 * `factor` is C's own when the caller has it, else C is factored here. Null when the factor of C does not take
 * every row of C (the caller falls back to conjugate gradients).
 */
function stateSolver(
  R: SparseRows,
  basis: number[],
  sym: { pos: Int32Array; pattern: Int32Array[] },
  nullBasis: Float64Array[],
  tau: number,
  factor: RowFactor | null,
): ((rhs: Float64Array) => Float64Array) | null {
  let own = factor;
  if (!own) {
    const found = lastRowBasis(R, basis, sym, tau, R.n);
    if (found.inBasis.filter(Boolean).length !== basis.length) return null;
    own = found.factor;
  }
  const F = triangular(R, own);
  const free: number[] = [];
  for (let c = 0; c < R.n; c++) if (!own.has[c]) free.push(c);
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
    // a plain loop: Float64Array.from with a mapping function is several times slower in V8
    const lam = new Float64Array(basis.length);
    for (let k = 0; k < basis.length; k++) lam[k] = rowDot(R, basis[k], y);
    return lam;
  };
}

/**
 * Forward and back substitution with a row QR factor (slot rows by column, in elimination coordinates), the
 * rows copied once into flat arrays (column index and value, diagonal first) for the repeated solves.
 */
function triangular(R: SparseRows, factor: RowFactor) {
  const n = R.n;
  const { pos, pattern, has, val: rowVal } = factor;
  const cols: number[] = [];
  has.forEach((h, c) => h && cols.push(c));
  const ptr = new Int32Array(cols.length + 1);
  let nnz = 0;
  for (const c of cols) {
    const p = Math.floor(c / 6);
    const width = 6 * pattern[p].length;
    const base = width * (c % 6);
    for (let e = base; e < base + width; e++) if (rowVal[p][e] !== 0) nnz++;
  }
  // the diagonal (never zero in a slot row) first, then the other entries
  const at = new Int32Array(nnz);
  const val = new Float64Array(nnz);
  let e = 0;
  cols.forEach((c, k) => {
    const p = Math.floor(c / 6);
    const j = c % 6;
    const pt = pattern[p];
    const rv = rowVal[p];
    const base = 6 * pt.length * j;
    at[e] = c;
    val[e++] = rv[base + j];
    for (let b = 0; b < pt.length; b++)
      for (let jj = 0; jj < 6; jj++) {
        const v = rv[base + 6 * b + jj];
        if (v !== 0 && !(b === 0 && jj === j)) {
          at[e] = 6 * pt[b] + jj;
          val[e++] = v;
        }
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
  const sym = symbolicPattern(R, order);
  const { inBasis, factor } = lastRowBasis(R, idx, sym, tolerance * spectrum.sigmaMax, R.n);
  const excess = inBasis.filter(Boolean).length - spectrum.rank;
  // the factor is the basis rows' own (rejected rows were taken back out): the quotient's semi-normal equations
  // use it, and so do the direct state solves when the quotient keeps every row
  if (excess > 0) quotientBasis(R, idx, inBasis, factor, spectrum.nullBasis, excess);
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
    if (direct === undefined) direct = stateSolver(R, basis, sym, spectrum.nullBasis, tolerance * spectrum.sigmaMax, excess > 0 ? null : factor);
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
    if (!(lamRes <= 1e-8 * aNorm) && lamRes < 0.5 * aNorm && fruitless < 1) {
      // else λ_C = −A_C (A_CᵀA_C)⁺ a_p, the pseudo-inverse by preconditioned conjugate gradients (patient: on
      // ill-conditioned basis rows their residual stalls before it falls), refined while the balance falls.
      // A_C has the rank of A: its operator, with A's free motions projected out, is invertible on the rest.
      // Once one of these has failed too, the remaining states go straight to the check below; so do they when
      // the direct passes could not even halve the pivot's row (the basis rows do not reach it at all).
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
    if (!(lamRes <= 1e-8 * aNorm)) {
      // The basis rows cannot express −a_p to round-off: they are singular to working precision, so the
      // row QR's pivots were a round-off decision (its fixed column order does not reveal rank). The whole
      // canonical form is then taken by the dense path's own rule on projected unit vectors (below).
      return statesByProjection(R, sorted, spectrum, tolerance);
    }
    states.push(stateOf(lam, p));
  }
  return states;

  function stateOf(lam: Float64Array, p: number): SelfStressState {
    return stateFrom(lam, contactIds[p], sorted);
  }
}

/** A state as reported: coefficients in sorted-id order, those below 1e-9 of the largest left out (§2). */
function stateFrom(lam: Float64Array, pivot: string, sorted: (readonly [string, number])[]): SelfStressState {
  let max = 0;
  for (const v of lam) max = Math.max(max, Math.abs(v));
  const forces: Record<string, number> = {};
  for (const [id, i] of sorted) if (Math.abs(lam[i]) >= 1e-9 * max) forces[id] = lam[i];
  return { pivot, forces };
}

const vnorm = (v: ArrayLike<number>) => {
  let t = 0;
  for (let i = 0; i < v.length; i++) t += v[i] * v[i];
  return Math.sqrt(t);
};

/** Self-stress spaces up to this dimension are taken whole by the projection rule (every pivot, so the reduced form can be formed). */
const PROJECTION_WHOLE = 50;

/**
 * The canonical states by the dense path's rule, for layouts whose row QR cannot decide the pivots (basis rows
 * singular to working precision). With P_S the orthogonal projector on the self-stress space S, the vector
 * z_j = P_S e_j = e_j − A (AᵀA)⁺ P₁a_j (all rows; the pseudo-inverse by conjugate gradients, balanced to
 * round-off) has, against the earlier z's, the residual that row j of an orthonormal basis Y of S has against
 * the earlier rows of Y (Y maps coordinates isometrically onto S). So contacts are visited in sorted order and
 * one is a pivot when its z keeps more than 1e-8 after Gram–Schmidt on the earlier pivots' (the dense rule).
 * With Q the orthonormal basis built on the way, the state of pivot s is the reduced form's Q (Q_P)⁻¹ e_s when
 * every pivot is found (spaces up to PROJECTION_WHOLE) and Q_P is not singular to within ten decades; else the
 * echelon state q_s / q_s[p_s] (1 on its pivot, 0 on every contact before it). Each balances, the states are
 * independent, and the pivots are the dense path's.
 */
function statesByProjection(R: SparseRows, sorted: (readonly [string, number])[], spectrum: LowSpectrum, tolerance: number): SelfStressState[] {
  const k = R.m - spectrum.rank;
  const want = k <= PROJECTION_WHOLE ? k : Math.min(k, MAX_SELF_STRESS_LISTED);
  // every row, with a factor shifted 1e-4 below the rank threshold's square (raised while round-off makes it
  // indefinite): conjugate gradients then take a couple of steps per solve
  const full = new PinvSystem(R, new Float64Array(R.m).fill(1), spectrum, tolerance, 0.01);
  const Q: Float64Array[] = [];
  const pivots: number[] = [];
  /** v ← P_S v: the part of v that A's rows balance taken out, refined while the balance P₁Aᵀv falls */
  const toS = (v: Float64Array) => {
    let best = Infinity;
    for (let pass = 0; pass < 4; pass++) {
      const res = projectOut(spectrum.nullBasis, mulAT(R, v));
      const rn = vnorm(res);
      if (rn <= 1e-15 * spectrum.sigmaMax * vnorm(v) || rn > 0.5 * best) break;
      best = rn;
      const y = full.apply(res);
      for (let i = 0; i < R.m; i++) v[i] -= rowDot(R, i, y);
    }
  };
  /** v minus its part along the pivots' orthonormal vectors so far (twice) */
  const orthogonalise = (v: Float64Array) => {
    for (let pass = 0; pass < 2; pass++)
      for (const q of Q) {
        let d = 0;
        for (let i = 0; i < R.m; i++) d += q[i] * v[i];
        for (let i = 0; i < R.m; i++) v[i] -= d * q[i];
      }
    return vnorm(v);
  };
  for (const [, j] of sorted) {
    if (pivots.length >= want) break;
    // A quick z_j (conjugate gradients to 1e-12) can only overstate the residual: its error A·δy lies in the
    // range of A, orthogonal to S and so to the residual's true part. At or under 1e-8 the row is not a pivot;
    // just above, z_j is projected on S to round-off and its residual taken again before it counts.
    const z = new Float64Array(R.m);
    z[j] = 1;
    const y = full.apply(projectOut(spectrum.nullBasis, mulAT(R, z)), 3, 1e-12);
    for (let i = 0; i < R.m; i++) z[i] -= rowDot(R, i, y);
    // one pass with the exact coefficients: ⟨q, z_j⟩ = q_j for q in S
    for (const q of Q) {
      const d = q[j];
      if (d !== 0) for (let i = 0; i < R.m; i++) z[i] -= d * q[i];
    }
    const quick = vnorm(z);
    if (!(quick > 1e-8)) continue;
    // well above the threshold the quick value decides (its error is some 1e-10 at most): a pivot
    if (quick <= 1e-6) toS(z);
    const len = quick <= 1e-6 ? orthogonalise(z) : quick;
    if (len > 1e-8) {
      // the residual is small beside the round-off it carries when len is small: normalised, projected on S
      // again and orthogonalised again, so every basis vector balances to round-off of its own unit size
      for (let i = 0; i < R.m; i++) z[i] /= len;
      toS(z);
      const again = orthogonalise(z);
      for (let i = 0; i < R.m; i++) z[i] /= again;
      Q.push(z);
      pivots.push(j);
    }
  }
  const L = pivots.length;
  if (L === 0) return [];
  // q_s is supported on the contacts from p_s on (it is orthogonal to every earlier z, and ⟨q, z_j⟩ = q_j on
  // S) with q_s at p_s equal to its residual: q_s / q_s[p_s] is the echelon state of pivot s. The reduced form
  // Q (Q_P)⁻¹ needs every pivot and a pivot block that is not singular to working precision
  const QP = new Matrix(L, L);
  pivots.forEach((p, r) => Q.forEach((q, c) => QP.set(r, c, q[p])));
  const sv = L === k ? new SingularValueDecomposition(QP, { computeLeftSingularVectors: false, computeRightSingularVectors: false }).diagonal : [];
  const reduced = L === k && sv[L - 1] > 1e-10 * sv[0];
  const W = reduced ? inverse(QP) : null;
  const states: SelfStressState[] = [];
  for (let si = 0; si < Math.min(L, MAX_SELF_STRESS_LISTED); si++) {
    let lam = new Float64Array(R.m);
    if (W) {
      Q.forEach((q, c) => {
        const w = W.get(c, si);
        for (let i = 0; i < R.m; i++) lam[i] += w * q[i];
      });
      pivots.forEach((p, t) => (lam[p] = t === si ? 1 : 0));
    } else {
      lam = Q[si].map((v) => v / Q[si][pivots[si]]);
      lam[pivots[si]] = 1;
    }
    states.push(stateFrom(lam, sorted.find(([, i]) => i === pivots[si])![0], sorted));
  }
  return states;
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
