/**
 * The extreme singular values of B = W^½ A without a dense decomposition (analysis.md §2, §12):
 * σ_max by Lanczos on BᵀB (full reorthogonalisation, the Lanczos matrix's top eigenvalue by Sturm bisection);
 * the null space (σ < tolerance · σ_max), σ_r and its right singular vector by subspace iteration with the
 * block Cholesky factor of BᵀB + εI, each step finished by a Rayleigh–Ritz step on B itself (a Householder QR
 * of B Q and the SVD of its small R, so nothing is read off a squared matrix).
 * Written here because no npm package offers sparse eigen- or singular-value solvers; the small dense SVD
 * comes from ml-matrix.
 */
import { Matrix } from "ml-matrix";
import { svdRight } from "../linalg";
import { factorGram, minimumDegreeOrder, solveFactor, type BlockFactor } from "./cholesky";
import { mulGram, rowDot, type SparseRows } from "./rows";

/** A reproducible pseudo-random sequence (results must not depend on the run). */
function seeded(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296 - 0.5;
  };
}

const dotv = (a: ArrayLike<number>, b: ArrayLike<number>) => {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
};
const normv = (a: ArrayLike<number>) => Math.sqrt(dotv(a, a));

/** Modified Gram–Schmidt, twice (columns that vanish are dropped). */
function orthonormalise(cols: Float64Array[]): Float64Array[] {
  const out: Float64Array[] = [];
  for (const c0 of cols) {
    const c = Float64Array.from(c0);
    const before = normv(c);
    for (let pass = 0; pass < 2; pass++)
      for (const q of out) {
        const d = dotv(q, c);
        for (let i = 0; i < c.length; i++) c[i] -= d * q[i];
      }
    const len = normv(c);
    if (len > 1e-12 * before && len > 0) {
      for (let i = 0; i < c.length; i++) c[i] /= len;
      out.push(c);
    }
  }
  return out;
}

/**
 * The R factor (k × k) of the Householder QR of a tall matrix given by its k columns (each of length ≥ k):
 * B Z = QR has R's singular values and right singular vectors.
 */
function householderR(cols: Float64Array[]): Matrix {
  const k = cols.length;
  const m = k ? cols[0].length : 0;
  const A = cols.map((c) => Float64Array.from(c));
  const Rm = new Matrix(k, k);
  for (let j = 0; j < k; j++) {
    const a = A[j];
    let norm = 0;
    for (let i = j; i < m; i++) norm += a[i] * a[i];
    norm = Math.sqrt(norm);
    if (norm > 0) {
      const alpha = a[j] > 0 ? -norm : norm;
      // v = a_j − α e_j (stored in place from row j), H = I − 2 v vᵀ / vᵀv
      a[j] -= alpha;
      let vv = 0;
      for (let i = j; i < m; i++) vv += a[i] * a[i];
      for (let c = j + 1; c < k; c++) {
        const b = A[c];
        let d = 0;
        for (let i = j; i < m; i++) d += a[i] * b[i];
        const f = (2 * d) / vv;
        for (let i = j; i < m; i++) b[i] -= f * a[i];
      }
      a[j] = alpha;
    }
    for (let c = j; c < k; c++) Rm.set(j, c, A[c][j]);
  }
  return Rm;
}

/**
 * The largest eigenvalue of the symmetric tridiagonal matrix (diagonal a, off-diagonal b) by bisection on the
 * Sturm sequence count (the classic method; a full eigen-decomposition of the Lanczos matrix at every check
 * cost more than the Lanczos steps themselves). Converged to the spacing of doubles.
 */
function largestTridiagonalEigenvalue(a: number[], b: number[]): number {
  const k = a.length;
  // Gershgorin bounds
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < k; i++) {
    const r = (i > 0 ? Math.abs(b[i - 1]) : 0) + (i + 1 < k ? Math.abs(b[i]) : 0);
    lo = Math.min(lo, a[i] - r);
    hi = Math.max(hi, a[i] + r);
  }
  // eigenvalues greater than x: sign changes of the LDLᵀ pivots of T − xI
  const above = (x: number) => {
    let count = 0;
    let d = 1;
    for (let i = 0; i < k; i++) {
      d = a[i] - x - (i > 0 ? (b[i - 1] * b[i - 1]) / d : 0);
      if (d === 0) d = -1e-300;
      if (d > 0) count++;
    }
    return count;
  };
  for (let it = 0; it < 200 && hi - lo > 2e-16 * Math.max(Math.abs(lo), Math.abs(hi)); it++) {
    const mid = 0.5 * (lo + hi);
    if (above(mid) >= 1) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * σ_max(B) by Lanczos on BᵀB. Only the largest eigenvalue is wanted, so the three-term recurrence runs without
 * reorthogonalisation against the whole basis (each step is orthogonalised against the two vectors before it):
 * the loss of orthogonality that sets in as the top Ritz value converges only repeats that value (Paige's
 * analysis), it does not move it, and the steps then cost O(n) instead of O(j·n).
 */
export function sigmaMax(R: SparseRows, w: ArrayLike<number>): number {
  const n = R.n;
  if (n === 0) return 0;
  const rnd = seeded(7);
  let q: Float64Array = new Float64Array(n);
  for (let i = 0; i < n; i++) q[i] = rnd();
  const q0 = normv(q);
  for (let i = 0; i < n; i++) q[i] /= q0;
  let qPrev: Float64Array = new Float64Array(n);
  const alpha: number[] = [];
  const beta: number[] = [];
  let theta = 0;
  let aMax = 0;
  const steps = Math.min(n, 300);
  for (let j = 0; j < steps; j++) {
    const z = mulGram(R, w, q);
    const a = dotv(z, q);
    alpha.push(a);
    aMax = Math.max(aMax, Math.abs(a));
    const bPrev = j > 0 ? beta[j - 1] : 0;
    for (let i = 0; i < n; i++) z[i] -= a * q[i] + bPrev * qPrev[i];
    // a second local pass keeps the recurrence's own round-off out of the next vector
    const d1 = dotv(z, q);
    const d0 = j > 0 ? dotv(z, qPrev) : 0;
    for (let i = 0; i < n; i++) z[i] -= d1 * q[i] + d0 * qPrev[i];
    const b = normv(z);
    if (j % 4 === 3 || b < 1e-14 * aMax || j === steps - 1) {
      const top = largestTridiagonalEigenvalue(alpha, beta);
      const settled = Math.abs(top - theta) <= 1e-13 * Math.abs(top);
      theta = top;
      if (settled || b < 1e-14 * Math.abs(top)) break;
    }
    beta.push(b);
    qPrev = q;
    for (let i = 0; i < n; i++) z[i] /= b;
    q = z;
  }
  return Math.sqrt(Math.max(theta, 0));
}

export interface LowSpectrum {
  sigmaMax: number;
  /** numerical rank: singular values above tolerance · σ_max */
  rank: number;
  /** orthonormal basis of the null space (σ below the threshold), columns of length n */
  nullBasis: Float64Array[];
  /** σ_r and its right singular vector (null when the rank is 0) */
  weakest: { sigma: number; vector: Float64Array } | null;
}

/** The block factor of BᵀB + εI, raising ε tenfold while round-off leaves a pivot block indefinite. */
export function shiftedFactor(R: SparseRows, w: ArrayLike<number>, shift: number, order?: Int32Array): { F: BlockFactor; shift: number } {
  const ord = order ?? minimumDegreeOrder(R, w);
  let eps = shift;
  for (let attempt = 0; attempt < 12; attempt++) {
    const F = factorGram(R, w, eps, ord);
    if (F) return { F, shift: eps };
    eps *= 10;
  }
  throw new Error("block Cholesky factor failed at every shift");
}

/** (BᵀB + shift·I)⁻¹ q by the factor and one step of refinement against Bᵀ(B x) + shift·x. */
function refinedSolve(R: SparseRows, w: ArrayLike<number>, F: BlockFactor, shift: number, q: Float64Array): Float64Array {
  const x = solveFactor(F, q);
  const r = mulGram(R, w, x);
  for (let i = 0; i < r.length; i++) r[i] = q[i] - r[i] - shift * x[i];
  const d = solveFactor(F, r);
  for (let i = 0; i < x.length; i++) x[i] += d[i];
  return x;
}

/** min(‖u − v‖, ‖u + v‖) for unit vectors: how far apart two directions are, to round-off. */
function unitDistance(u: Float64Array, v: Float64Array): number {
  let a = 0;
  let b = 0;
  for (let i = 0; i < u.length; i++) {
    a += (u[i] - v[i]) ** 2;
    b += (u[i] + v[i]) ** 2;
  }
  return Math.sqrt(Math.min(a, b));
}

/** Projector distance ‖N_new − N_old N_oldᵀ N_new‖_F between two orthonormal column sets. */
function subspaceGap(oldB: Float64Array[], newB: Float64Array[]): number {
  if (oldB.length !== newB.length) return Infinity;
  let sum = 0;
  for (const v of newB) {
    const r = Float64Array.from(v);
    for (const u of oldB) {
      const d = dotv(u, v);
      for (let i = 0; i < r.length; i++) r[i] -= d * u[i];
    }
    sum += dotv(r, r);
  }
  return Math.sqrt(sum);
}

/**
 * Rank, null space and the weakest constrained direction of B = W^½ A at the relative tolerance.
 * `nullHint` is a guess of the null dimension (the block grows when the guess is short).
 */
export function lowSpectrum(R: SparseRows, w: ArrayLike<number>, tolerance: number, nullHint = 0): LowSpectrum {
  const n = R.n;
  const smax = sigmaMax(R, w);
  if (!(smax > 0)) {
    const basis = Array.from({ length: n }, (_, j) => {
      const e = new Float64Array(n);
      e[j] = 1;
      return e;
    });
    return { sigmaMax: 0, rank: 0, nullBasis: basis, weakest: null };
  }
  const tau = tolerance * smax;
  const { F, shift } = shiftedFactor(R, w, (0.1 * tau) ** 2);
  const rnd = seeded(11);
  const sqrtW = Array.from(w, (x) => Math.sqrt(x));
  // a few directions beyond the expected null space: σ_r converges by (σ_r / σ_{p+1})² an iteration
  let p = Math.min(n, nullHint + 8);
  let Q = orthonormalise(Array.from({ length: p }, () => Float64Array.from({ length: n }, () => rnd())));
  let prevNull: Float64Array[] = [];
  let prevWeak: Float64Array | null = null;
  let prevSigma = NaN;
  let [prevGapNull, prevGapWeak] = [Infinity, Infinity];
  let result: LowSpectrum | null = null;
  let [bestNull, bestWeak, stallNull, stallWeak] = [Infinity, Infinity, 0, 0];
  const rowsUsed: number[] = [];
  for (let i = 0; i < R.m; i++) if (sqrtW[i] !== 0) rowsUsed.push(i);
  for (let iter = 0; iter < 200; iter++) {
    // The factor is of the explicitly formed BᵀB, whose round-off (ε·σ_max² in every direction) moves the
    // fixed point of the iteration by up to 1e-7 when singular values crowd the threshold (a 200-body chain,
    // against LAPACK). Once the block is near its fixed point, each solve takes one refinement step against
    // the unsquared product Bᵀ(B x), whose error in the small directions is only ε·σ_max·σ: the iteration
    // then converges to B's own singular vectors.
    // Only the null directions and the weakest one (the first f + 1 Ritz vectors) are refined: the others only
    // widen the block, and the Rayleigh–Ritz step below reads the wanted vectors off the whole span.
    const refine = iter > 0 && Math.max(prevGapNull, prevGapWeak) < 1e-3;
    const refined = refine ? prevNull.length + 1 : 0;
    const Z = orthonormalise(Q.map((q, c) => (c < refined ? refinedSolve(R, w, F, shift, q) : solveFactor(F, q))));
    // Rayleigh–Ritz on B: singular values and right vectors of B Z, through its Householder QR (B Z = QR
    // has R's singular values and right vectors; backward stable, and the SVD is then k × k, not m × k)
    const C = Z.map((z) => {
      const col = new Float64Array(Math.max(rowsUsed.length, Z.length));
      for (let r = 0; r < rowsUsed.length; r++) col[r] = sqrtW[rowsUsed[r]] * rowDot(R, rowsUsed[r], z);
      return col;
    });
    const { s, V } = svdRight(householderR(C));
    const k = Z.length;
    const sig = Array.from({ length: k }, (_, j) => s[j] ?? 0);
    // ascending order: column k−1−j of V belongs to sig[k−1−j]
    const ritz: Float64Array[] = [];
    const vals: number[] = [];
    for (let j = k - 1; j >= 0; j--) {
      const v = new Float64Array(n);
      for (let c = 0; c < k; c++) {
        const coef = V.get(c, j);
        const zc = Z[c];
        if (coef !== 0) for (let i = 0; i < n; i++) v[i] += coef * zc[i];
      }
      ritz.push(v);
      vals.push(sig[j]);
    }
    const f = vals.filter((x) => x <= tau).length;
    if (f >= k - 1 && k < n) {
      // the block holds no direction above the threshold yet: grow it
      p = Math.min(n, 2 * k + 4);
      Q = orthonormalise([...ritz, ...Array.from({ length: p - k }, () => Float64Array.from({ length: n }, () => rnd()))]);
      prevNull = [];
      prevWeak = null;
      [prevGapNull, prevGapWeak] = [Infinity, Infinity];
      [bestNull, bestWeak, stallNull, stallWeak] = [Infinity, Infinity, 0, 0];
      continue;
    }
    const nullB = ritz.slice(0, f);
    const weak = f < k ? ritz[f] : null;
    const sigma = f < k ? vals[f] : NaN;
    const gapNull = subspaceGap(prevNull, nullB);
    // the distance between the unit vectors (up to sign), not √(1 − cos²), which cannot resolve below 1e-8
    const gapWeak = weak && prevWeak ? unitDistance(weak, prevWeak) : weak ? Infinity : 0;
    const sigmaSettled = !weak || Math.abs(sigma - prevSigma) <= 1e-13 * sigma;
    // a repeated σ_r (identical mounts) has no single direction: then only its value must settle
    const weakUnique = !weak || f + 1 >= k || vals[f + 1] - sigma > 1e-8 * sigma;
    result = { sigmaMax: smax, rank: n - f, nullBasis: nullB, weakest: weak ? { sigma, vector: weak } : null };
    // settled: the null space stops moving (1e-11: the free motions are read to far better than 1e-8), the
    // weakest direction (shown as a screw to four digits) to 1e-9, or they stand still at round-off, which
    // near-null directions just under the threshold reach sooner (below 1e-10 and no longer halving)
    stallNull = gapNull > 0.5 * bestNull ? stallNull + 1 : 0;
    stallWeak = gapWeak > 0.5 * bestWeak ? stallWeak + 1 : 0;
    bestNull = Math.min(bestNull, gapNull);
    bestWeak = Math.min(bestWeak, gapWeak);
    // an invariant subspace is determined only to about ε_mach · σ_max / (its gap to the next singular value):
    // asking for more just iterates on round-off (a cluster straddling the threshold)
    const below = f > 0 ? vals[f - 1] : 0;
    const above = f + 1 < k ? vals[f + 1] : Infinity;
    const nullTol = f > 0 && f < k ? Math.max(1e-11, (1e-15 * smax) / Math.max(vals[f] - below, 1e-300)) : 1e-11;
    const weakTol = weak ? Math.max(1e-9, (1e-15 * smax) / Math.max(Math.min(sigma - below, above - sigma), 1e-300)) : 1e-9;
    const nullSettled = gapNull < nullTol || (gapNull < 1e-10 && stallNull >= 3);
    const weakSettled = gapWeak < weakTol || (gapWeak < 1e-9 && stallWeak >= 3) || !weakUnique;
    const valueSettled = sigmaSettled || (iter >= 3 && Math.abs(sigma - prevSigma) <= 1e-12 * sigma);
    if (refine && nullSettled && weakSettled && valueSettled) break;
    [prevGapNull, prevGapWeak] = [gapNull, gapWeak];
    prevNull = nullB;
    prevWeak = weak;
    prevSigma = sigma;
    Q = ritz;
  }
  return result!;
}
