/**
 * The rows that hold the part in service and the map from row offsets to body twists, shared by the
 * temperature (analysis.md §9) and repeatability (§11) analyses: kept rows = every row but the seats the
 * first load case releases (and Hertz rows at zero force); K = their stiffness; and
 * t_s = (A_sᵀ K A_s)⁺ A_sᵀ K g for row offsets g along the normals, in scaled twist coordinates.
 * Written here because no package offers a weighted pseudo-inverse on a chosen row subset. Beyond
 * DENSE_MAX_BODIES the map is the structured pseudo-inverse (sparse/pinv.ts) on the sparse rows, with no dense matrix.
 */
import { Matrix } from "ml-matrix";
import { mulA, mulAT } from "./sparse/rows";
import { lowSpectrum } from "./sparse/spectrum";
import { PinvSystem } from "./sparse/pinv";
import type { ConstraintAnalysis } from "./constraint";
import type { StaticsResult, StiffnessSource } from "./statics";
import { rankOf, svdRight } from "./linalg";
import { cross, sub } from "./vec";
import type { Vec3 } from "@/lib/layout/model";

export interface RowMap {
  /** per row (contact order): kept in the service state */
  kept: boolean[];
  /** per row: stiffness in file force per file length (1 under the equal assumption, 0 when not kept) */
  k: number[];
  /** where K comes from: file (contacts and flexures), hertz (tangent at the first case), equal */
  source: Exclude<StiffnessSource, "none">;
  /** rank of the kept scaled rows */
  rank: number;
  /** kept rows − rank: redundancies of the service state */
  redundancies: number;
  /** the kept rows leave a free motion (rank below 6N) */
  undetermined: boolean;
  /** t_s = G g: scaled twist from offsets along the row normals (file length units) */
  solve(g: number[]): number[];
  /** (A_sᵀ K A_s)⁺ w for a twist-space vector w (symmetric, so also the adjoint of a twist functional) */
  pinv(w: number[]): number[];
  /** A_s t_s per row (the relative normal motion a scaled twist produces) */
  apply(ts: number[]): number[];
}

/** Builds the kept rows, their stiffness and the weighted map of §9 from the rank and statics results. */
export function buildRowMap(c: ConstraintAnalysis, statics: StaticsResult, tolerance: number): RowMap {
  const m = c.counts.contacts;
  const n = 6 * c.counts.bodies;
  const first = statics.cases[0];
  const active = first ? first.active : new Array<boolean>(m).fill(true);
  let source: RowMap["source"] = "equal";
  let stiff: number[] = new Array<number>(m).fill(1);
  if (statics.stiffnessSource === "file" && statics.fileStiffness) {
    source = "file";
    stiff = statics.fileStiffness;
  } else if (statics.stiffnessSource === "hertz" && first?.tangent && first.force) {
    source = "hertz";
    stiff = first.tangent;
  }
  const kept = active.map((a, i) => a && stiff[i] > 0);
  const k = stiff.map((v, i) => (kept[i] ? v : 0));
  const rows = kept.map((a, i) => (a ? i : -1)).filter((i) => i >= 0);
  if (c.method === "structured") return structuredRowMap(c, kept, k, rows.length, source, tolerance);
  const B = new Matrix(Math.max(rows.length, 1), Math.max(n, 1));
  rows.forEach((i, r) => {
    const sk = Math.sqrt(k[i]);
    for (let j = 0; j < n; j++) B.set(r, j, sk * c.A.get(i, j));
  });
  const svd = n > 0 && rows.length > 0 ? svdRight(B) : { s: [] as number[], V: new Matrix(n, n) };
  // the rank is that of the kept scaled rows themselves (analysis.md §9); K > 0 does not change it in
  // exact arithmetic, so the weighted decomposition is truncated at the same count
  let rank = rankOf(svd.s, tolerance);
  if (rows.length === m && m > 0) {
    // every row kept: the rank is the whole matrix's, already decided (§2)
    rank = Math.min(c.counts.rank, svd.s.filter((v) => v > 0).length);
  } else if (source !== "equal" && rows.length > 0 && n > 0) {
    const plain = new Matrix(rows.length, n);
    rows.forEach((i, r) => plain.setRow(r, c.A.getRow(i)));
    rank = Math.min(rankOf(svdRight(plain).s, tolerance), svd.s.filter((v) => v > 0).length);
  }
  const Vr = svd.V;
  const apply = (ts: number[]): number[] => {
    const out = new Array<number>(m).fill(0);
    for (const i of rows) {
      let d = 0;
      for (let j = 0; j < n; j++) d += c.A.get(i, j) * ts[j];
      out[i] = d;
    }
    return out;
  };
  const pinv = (w: number[]): number[] => {
    // V_r Σ_r⁻² V_rᵀ w
    const out = new Array<number>(n).fill(0);
    for (let col = 0; col < rank; col++) {
      let d = 0;
      for (let q = 0; q < n; q++) d += Vr.get(q, col) * w[q];
      d /= svd.s[col] * svd.s[col];
      for (let q = 0; q < n; q++) out[q] += d * Vr.get(q, col);
    }
    return out;
  };
  const solve = (g: number[]): number[] => {
    // w = A_sᵀ K g, then t_s = V_r Σ_r⁻² V_rᵀ w
    const w = new Array<number>(n).fill(0);
    for (const i of rows) {
      const kg = k[i] * g[i];
      if (kg !== 0) for (let j = 0; j < n; j++) w[j] += c.A.get(i, j) * kg;
    }
    return pinv(w);
  };
  return { kept, k, source, rank, redundancies: rows.length - rank, undetermined: rank < n, solve, pinv, apply };
}

/** The same map without a dense matrix: ranks from the structured low spectrum, solves by the structured pseudo-inverse. */
function structuredRowMap(c: ConstraintAnalysis, kept: boolean[], k: number[], keptCount: number, source: RowMap["source"], tolerance: number): RowMap {
  const m = c.counts.contacts;
  const n = 6 * c.counts.bodies;
  const w = Float64Array.from(k);
  const weighted = lowSpectrum(c.rows, w, tolerance, c.counts.freedoms);
  // as on the dense path: every row kept → the whole matrix's rank (§2); a subset under file or Hertz
  // stiffness → the rank of the kept rows themselves (weights 1), never above the weighted one
  let rank = weighted.rank;
  if (keptCount === m && m > 0) rank = Math.min(c.counts.rank, weighted.rank);
  else if (source !== "equal" && keptCount > 0)
    rank = Math.min(
      lowSpectrum(
        c.rows,
        Float64Array.from(kept, (a) => (a ? 1 : 0)),
        tolerance,
        c.counts.freedoms,
      ).rank,
      rank,
    );
  const sys = keptCount > 0 && n > 0 ? new PinvSystem(c.rows, w, weighted, tolerance) : null;
  const apply = (ts: number[]): number[] => {
    const y = mulA(c.rows, ts);
    return Array.from(y, (v, i) => (kept[i] ? v : 0));
  };
  const pinv = (w: number[]): number[] => (sys ? Array.from(sys.apply(w)) : new Array<number>(n).fill(0));
  const solve = (g: number[]): number[] =>
    pinv(
      Array.from(
        mulAT(
          c.rows,
          Float64Array.from(g, (v, i) => k[i] * v),
        ),
      ),
    );
  return { kept, k, source, rank, redundancies: keptCount - rank, undetermined: rank < n, solve, pinv, apply };
}

/** Body b's twist about the file origin (ω, v) from a scaled twist (analysis.md §1). */
export function unscaledTwist(ts: number[], b: number, centroid: Vec3, L: number): { omega: Vec3; v: Vec3 } {
  const omega: Vec3 = [ts[6 * b] / L, ts[6 * b + 1] / L, ts[6 * b + 2] / L];
  const vc: Vec3 = [ts[6 * b + 3], ts[6 * b + 4], ts[6 * b + 5]];
  return { omega, v: sub(vc, cross(omega, centroid)) };
}

/** Displacement of body b's point q under a scaled twist: v_c + ω × (q − c). */
export function pointMotion(ts: number[], b: number, q: Vec3, centroid: Vec3, L: number): Vec3 {
  const omega: Vec3 = [ts[6 * b] / L, ts[6 * b + 1] / L, ts[6 * b + 2] / L];
  const r = cross(omega, sub(q, centroid));
  return [ts[6 * b + 3] + r[0], ts[6 * b + 4] + r[1], ts[6 * b + 5] + r[2]];
}
