/**
 * The stiffness solve on the scaled matrix A of §1 (u = (AᵀKA)⁺ w over the active contacts, λ = −K A u),
 * factored once per stiffness vector, with iterative refinement; and the active-set loop of §3.
 * Written here because no package offers a pseudo-inverse solve restricted to an active row set.
 */
import { Matrix } from "ml-matrix";
import { svdRight, rankOf } from "../linalg";
import { addRowT, rowDot } from "../sparse/rows";
import { lowSpectrum } from "../sparse/spectrum";
import { PinvSystem } from "../sparse/pinv";
import { STATICS } from "../tolerances";
import type { Ctx, Factor, Solve } from "./types";

const LIFT = STATICS.liftOffRelative;

/** K^½ A over the active contacts, factored once (dense SVD, or the structured pseudo-inverse beyond DENSE_MAX_BODIES). */
export function factorStiff(ctx: Ctx, k: number[], active: boolean[]): Factor {
  const rows = active.map((a, i) => (a ? i : -1)).filter((i) => i >= 0);
  if (ctx.c.method === "structured") {
    const w = new Float64Array(ctx.m);
    for (const i of rows) w[i] = k[i];
    const spectrum = lowSpectrum(ctx.c.rows, w, ctx.layout.tolerance, ctx.c.counts.freedoms);
    const sys = new PinvSystem(ctx.c.rows, w, spectrum, ctx.layout.tolerance);
    return {
      k,
      rows,
      r: spectrum.rank,
      applyPinv: (rhs) => Array.from(sys.apply(rhs)),
      project: (v) => Array.from(sys.project(v)),
      nullAlong: (v) => sys.nullComponent(v),
    };
  }
  const B = new Matrix(Math.max(rows.length, 1), ctx.n);
  rows.forEach((i, r) => {
    const sk = Math.sqrt(k[i]);
    for (let j = 0; j < ctx.n; j++) B.set(r, j, sk * ctx.c.A.get(i, j));
  });
  const { s, V } = svdRight(B);
  const r = rankOf(s, ctx.layout.tolerance);
  // u = V Σ⁻² Vᵀ w on the kept singular directions
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
  const nullAlong = (w: number[]): number => {
    let along = 0;
    for (let j = r; j < ctx.n; j++) {
      let d = 0;
      for (let q = 0; q < ctx.n; q++) d += V.get(q, j) * w[q];
      along = Math.max(along, Math.abs(d));
    }
    return along;
  };
  return { k, rows, r, applyPinv, project, nullAlong };
}

/** u = (AᵀKA)⁺ w over the active contacts, λ = −K A u; `driven` when w has a part along a free motion. */
export function solveStiff(ctx: Ctx, k: number[], active: boolean[], w: number[]): Solve {
  return solveWith(ctx, factorStiff(ctx, k, active), w);
}

export function solveWith(ctx: Ctx, f: Factor, w: number[]): Solve {
  const { k, rows, applyPinv, project } = f;
  const u = applyPinv(w);
  // part of the load along the null space of the active support
  const wNorm = Math.hypot(...w);
  const along = f.nullAlong(w);
  const lambda = new Array<number>(ctx.m).fill(0);
  const applyKA = (du: number[], sign: number) => {
    for (const i of rows) lambda[i] += sign * k[i] * rowDot(ctx.c.rows, i, du);
  };
  applyKA(u, -1);
  // iterative refinement on the forces themselves: res = Aᵀλ + P w, δu = (AᵀKA)⁺ res, λ −= K A δu
  // (recomputing λ from a refined u cannot beat the rounding of A u when u is large)
  const target = project(w);
  const tNorm = Math.hypot(...target);
  let prev = Infinity;
  for (let step = 0; step < STATICS.refinementSteps; step++) {
    const res = target.slice();
    for (const i of rows) if (lambda[i] !== 0) addRowT(ctx.c.rows, i, lambda[i], res);
    // balanced to 1e-13 (forces are read to 1e-9 of the largest), or no longer improving: another solve
    // would only add noise
    const rn = Math.hypot(...res);
    if (rn <= 1e-13 * tNorm || rn > 0.5 * prev) break;
    prev = rn;
    const du = applyPinv(res);
    for (let q = 0; q < ctx.n; q++) u[q] += du[q];
    applyKA(du, -1);
  }
  return { u, lambda, driven: wNorm > 0 && along / wNorm > STATICS.drivenRelative };
}

/** Normal separation (A u)_i of one contact. */
export function separation(ctx: Ctx, i: number, u: number[]): number {
  return rowDot(ctx.c.rows, i, u);
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
