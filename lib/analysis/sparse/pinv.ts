/**
 * u = (Aᵀ W A)⁺ w without a dense decomposition: the block Cholesky factor of Aᵀ W A + εI, the null
 * space projected out on both sides (so the answer is the minimum-norm one of the pseudo-inverse), and
 * iterative refinement, which removes the shift: each pass shrinks the error by ε / (μ + ε) ≤ 1/100 for
 * every eigenvalue μ above the rank threshold.
 * Written here because no npm package offers a sparse pseudo-inverse solve.
 */
import { mulGram, type SparseRows } from "./rows";
import { shiftedFactor, type LowSpectrum } from "./spectrum";
import { solveFactor, type BlockFactor } from "./cholesky";

export class PinvSystem {
  private readonly F: BlockFactor;

  constructor(
    private readonly R: SparseRows,
    /** row weights (stiffness; 0 leaves a row out) */
    private readonly w: ArrayLike<number>,
    /** the rank analysis of W^½ A: σ_max and an orthonormal null basis */
    readonly spectrum: LowSpectrum,
    tolerance: number,
  ) {
    this.F = shiftedFactor(R, w, (0.1 * tolerance * spectrum.sigmaMax) ** 2 || 1e-300).F;
  }

  get rank(): number {
    return this.spectrum.rank;
  }

  /** v minus its part along the null space */
  project(v: ArrayLike<number>): Float64Array {
    const out = Float64Array.from(v);
    for (const z of this.spectrum.nullBasis) {
      let d = 0;
      for (let i = 0; i < out.length; i++) d += z[i] * out[i];
      if (d !== 0) for (let i = 0; i < out.length; i++) out[i] -= d * z[i];
    }
    return out;
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

  /** (Aᵀ W A)⁺ rhs */
  apply(rhs: ArrayLike<number>): Float64Array {
    const b = this.project(rhs);
    const bNorm = Math.sqrt(b.reduce((s, v) => s + v * v, 0));
    let x = new Float64Array(b.length);
    if (bNorm === 0) return x;
    let best = Infinity;
    for (let pass = 0; pass < 400; pass++) {
      const Mx = mulGram(this.R, this.w, x);
      const res = b.map((v, i) => v - Mx[i]);
      const rn = Math.sqrt(res.reduce((s, v) => s + v * v, 0));
      // stop at round-off: the residual no longer halves
      if (pass > 1 && rn > 0.5 * best) break;
      best = Math.min(best, rn);
      if (rn <= 1e-16 * bNorm) break;
      const dx = this.project(solveFactor(this.F, res));
      x = x.map((v, i) => v + dx[i]);
    }
    return x;
  }
}
