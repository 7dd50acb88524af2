/**
 * u = (Aᵀ W A)⁺ w without a dense decomposition: the block Cholesky factor of Aᵀ W A + εI, the null
 * space projected out on both sides and from every product (so the answer is the minimum-norm one of the
 * pseudo-inverse, also when the weights leave out rows and the operator's range is not the given one), and
 * iterative refinement, which removes the shift: each pass shrinks the error by ε / (μ + ε) ≤ 1/100 for
 * every eigenvalue μ above the rank threshold.
 * Written here because no npm package offers a sparse pseudo-inverse solve.
 */
import { mulGram, type SparseRows } from "./rows";
import { shiftedFactor, type LowSpectrum } from "./spectrum";
import { solveFactor, type BlockFactor } from "./cholesky";

/** v minus its part along an orthonormal set of vectors */
export function projectOut(basis: Float64Array[], v: ArrayLike<number>): Float64Array<ArrayBuffer> {
  const out = Float64Array.from(v);
  for (const z of basis) {
    let d = 0;
    for (let i = 0; i < out.length; i++) d += z[i] * out[i];
    if (d !== 0) for (let i = 0; i < out.length; i++) out[i] -= d * z[i];
  }
  return out;
}

export class PinvSystem {
  private readonly F: BlockFactor;

  constructor(
    private readonly R: SparseRows,
    /** row weights (stiffness; 0 leaves a row out) */
    private readonly w: ArrayLike<number>,
    /** the rank analysis of W^½ A: σ_max and an orthonormal null basis */
    readonly spectrum: LowSpectrum,
    tolerance: number,
    /** the factor's shift as a fraction of the rank threshold (squared): smaller preconditions better when the factor takes it */
    shiftFraction = 0.1,
  ) {
    this.F = shiftedFactor(R, w, (shiftFraction * tolerance * spectrum.sigmaMax) ** 2 || 1e-300).F;
  }

  get rank(): number {
    return this.spectrum.rank;
  }

  /** v minus its part along the null space */
  project(v: ArrayLike<number>): Float64Array {
    return projectOut(this.spectrum.nullBasis, v);
  }

  /** largest |zᵀ v| over the null basis */
  nullComponent(v: ArrayLike<number>): number {
    let max = 0;
    for (const z of this.spectrum.nullBasis) {
      let d = 0;
      for (let i = 0; i < v.length; i++) d += z[i] * v[i];
      max = Math.max(max, Math.abs(d));
    }
    return max;
  }

  /** one step of the shifted factor with the null space projected out: (Aᵀ W A + εI)⁻¹ r, a preconditioner for refinement */
  step(r: ArrayLike<number>): Float64Array {
    return this.project(solveFactor(this.F, r));
  }

  /**
   * (Aᵀ W A)⁺ rhs by conjugate gradients on the range of Aᵀ W A, preconditioned by the shifted factor:
   * the preconditioned operator has eigenvalues μ/(μ + ε) in (0, 1], so a few iterations reach round-off
   * even when the factor needed a larger shift (stationary refinement would crawl at ε/(μ + ε) a pass).
   * Finished by refinement passes on the true residual.
   */
  apply(rhs: ArrayLike<number>, patience = 3, tolerance = 1e-16): Float64Array {
    const b = this.project(rhs);
    const n = b.length;
    const bNorm = norm(b);
    const x = new Float64Array(n);
    if (bNorm === 0) return x;
    const r = Float64Array.from(b);
    let z = this.step(r);
    const p = Float64Array.from(z);
    let rz = dot(r, z);
    let best = Infinity;
    let stall = 0;
    for (let it = 0; it < 500 && rz > 0; it++) {
      const Ap = this.project(mulGram(this.R, this.w, p));
      const pAp = dot(p, Ap);
      if (!(pAp > 0)) break;
      const alpha = rz / pAp;
      for (let i = 0; i < n; i++) {
        x[i] += alpha * p[i];
        r[i] -= alpha * Ap[i];
      }
      const rn = norm(r);
      if (rn <= tolerance * bNorm) break;
      // stop at round-off: the residual has not halved in three iterations (`patience` while it is above 1e-10
      // of the right-hand side: on an ill-conditioned operator, such as the basis rows of a self-stress solve,
      // the residual of conjugate gradients can stall for a while before it falls again)
      stall = rn > 0.5 * best ? stall + 1 : 0;
      best = Math.min(best, rn);
      if (stall >= (rn <= 1e-10 * bNorm ? 3 : patience)) break;
      z = this.step(r);
      const rzNew = dot(r, z);
      const beta = rzNew / rz;
      rz = rzNew;
      for (let i = 0; i < n; i++) p[i] = z[i] + beta * p[i];
    }
    // refinement on the true residual (the recurrence's residual drifts from it at round-off); none when a
    // looser answer was asked for
    let prev = Infinity;
    for (let pass = 0; pass < (tolerance > 1e-16 ? 0 : 3); pass++) {
      const Mx = this.project(mulGram(this.R, this.w, x));
      const res = new Float64Array(n);
      for (let i = 0; i < n; i++) res[i] = b[i] - Mx[i];
      const rn = norm(res);
      if (rn <= 1e-16 * bNorm || rn > 0.5 * prev) break;
      prev = rn;
      const dx = this.step(res);
      for (let i = 0; i < n; i++) x[i] += dx[i];
    }
    return this.project(x);
  }
}

function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

const norm = (a: ArrayLike<number>) => Math.sqrt(dot(a, a));
