/**
 * The stiffness solve on the scaled matrix A of §1 (u = (AᵀKA)⁺ w over the active contacts, λ = −K A u),
 * factored once per stiffness vector, with iterative refinement; and the active-set loop of §3.
 * Written here because no package offers a pseudo-inverse solve restricted to an active row set.
 */
import { Matrix } from "ml-matrix";
import { svdRight, rankOf } from "../linalg";
import { STATICS } from "../tolerances";
import type { Ctx, Factor, Solve } from "./types";

const LIFT = STATICS.liftOffRelative;

/** The SVD of K^½ A over the active contacts: factor once, solve for many load vectors. */
export function factorStiff(ctx: Ctx, k: number[], active: boolean[]): Factor {
  const rows = active.map((a, i) => (a ? i : -1)).filter((i) => i >= 0);
  const B = new Matrix(Math.max(rows.length, 1), ctx.n);
  rows.forEach((i, r) => {
    const sk = Math.sqrt(k[i]);
    for (let j = 0; j < ctx.n; j++) B.set(r, j, sk * ctx.c.A.get(i, j));
  });
  const { s, V } = svdRight(B);
  return { k, rows, s, V, r: rankOf(s, ctx.layout.tolerance) };
}

/** u = (AᵀKA)⁺ w over the active contacts, λ = −K A u; `driven` when w has a part along a free motion. */
export function solveStiff(ctx: Ctx, k: number[], active: boolean[], w: number[]): Solve {
  return solveWith(ctx, factorStiff(ctx, k, active), w);
}

export function solveWith(ctx: Ctx, f: Factor, w: number[]): Solve {
  const { k, rows, s, V, r } = f;
  // u = V Σ⁻² Vᵀ w on the kept singular directions, then iterative refinement
  // (r = P w − BᵀB u) to bring the equilibrium residual down to rounding
  const applyPinv = (rhs: number[]): number[] => {
    const out = new Array<number>(ctx.n).fill(0);
    for (let j = 0; j < r; j++) {
      let d = 0;
      for (let q = 0; q < ctx.n; q++) d += V.get(q, j) * rhs[q];
      d /= s[j] * s[j];
      for (let q = 0; q < ctx.n; q++) out[q] += d * V.get(q, j);
    }
    return out;
  };
  const project = (vec: number[]): number[] => {
    const out = new Array<number>(ctx.n).fill(0);
    for (let j = 0; j < r; j++) {
      let d = 0;
      for (let q = 0; q < ctx.n; q++) d += V.get(q, j) * vec[q];
      for (let q = 0; q < ctx.n; q++) out[q] += d * V.get(q, j);
    }
    return out;
  };
  const u = applyPinv(w);
  // part of the load along the null space of the active support
  const wNorm = Math.hypot(...w);
  let along = 0;
  for (let j = r; j < ctx.n; j++) {
    let d = 0;
    for (let q = 0; q < ctx.n; q++) d += V.get(q, j) * w[q];
    along = Math.max(along, Math.abs(d));
  }
  const lambda = new Array<number>(ctx.m).fill(0);
  const applyKA = (du: number[], sign: number) => {
    for (const i of rows) {
      let au = 0;
      for (let q = 0; q < ctx.n; q++) au += ctx.c.A.get(i, q) * du[q];
      lambda[i] += sign * k[i] * au;
    }
  };
  applyKA(u, -1);
  // iterative refinement on the forces themselves: res = Aᵀλ + P w, δu = (AᵀKA)⁺ res, λ −= K A δu
  // (recomputing λ from a refined u cannot beat the rounding of A u when u is large)
  const target = project(w);
  for (let step = 0; step < STATICS.refinementSteps; step++) {
    const res = target.slice();
    for (const i of rows) if (lambda[i] !== 0) for (let q = 0; q < ctx.n; q++) res[q] += ctx.c.A.get(i, q) * lambda[i];
    const du = applyPinv(res);
    for (let q = 0; q < ctx.n; q++) u[q] += du[q];
    applyKA(du, -1);
  }
  return { u, lambda, driven: wNorm > 0 && along / wNorm > STATICS.drivenRelative };
}

/** Normal separation (A u)_i of one contact. */
export function separation(ctx: Ctx, i: number, u: number[]): number {
  let au = 0;
  for (let q = 0; q < ctx.n; q++) au += ctx.c.A.get(i, q) * u[q];
  return au;
}

/** The active-set loop of analysis.md §3 for one stiffness vector. */
export function activeSet(ctx: Ctx, k: number[], w: number[], start?: boolean[]): { solve: Solve; active: boolean[] } {
  const { layout } = ctx;
  const active = start ? start.slice() : new Array<boolean>(ctx.m).fill(true);
  let solve = solveStiff(ctx, k, active, w);
  for (let iter = 0; iter < STATICS.activeSetIterations(ctx.m); iter++) {
    if (solve.driven) break;
    const max = Math.max(...solve.lambda.map(Math.abs), 0);
    let worst = -1;
    for (let i = 0; i < ctx.m; i++) {
      if (!active[i] || layout.contacts[i].sense !== "unilateral") continue;
      if (solve.lambda[i] < -LIFT * max && (worst < 0 || solve.lambda[i] < solve.lambda[worst])) worst = i;
    }
    if (worst >= 0) {
      active[worst] = false;
      solve = solveStiff(ctx, k, active, w);
      continue;
    }
    const scaleU = Math.max(...solve.u.map(Math.abs), 1e-300);
    let readded = false;
    for (let i = 0; i < ctx.m; i++) {
      if (!active[i] && separation(ctx, i, solve.u) < -STATICS.readdRelative * scaleU) {
        active[i] = true;
        readded = true;
      }
    }
    if (!readded) break;
    solve = solveStiff(ctx, k, active, w);
  }
  return { solve, active };
}
