/**
 * Repeatability at the functional points (analysis.md §11): independent normal scatter of every kept
 * row through the §9 map to body twists, the 3 × 3 covariance of each point, its 1σ per axis, the
 * semi-axes and their directions, and each row's share of the variance.
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import type { Layout, Vec3 } from "@/lib/layout/model";
import { metresPer } from "@/lib/layout/units";
import type { ConstraintAnalysis } from "./constraint";
import { pointMotion, type RowMap } from "./row-map";

export interface PointRepeatability {
  sigmaUm: Vec3;
  semiAxesUm: Vec3;
  axes: [Vec3, Vec3, Vec3];
  contributions: Record<string, number>;
}

export interface RepeatabilityResult {
  undetermined: boolean;
  points: Record<string, PointRepeatability>;
}

/** Each row's 1σ scatter (file length): its own, else the layout default, else 0. */
export function rowScatter(layout: Layout): number[] {
  return layout.contacts.map((k) => k.scatter ?? layout.defaultScatter ?? 0);
}

/** Runs §11 when some scatter is positive and points exist; null otherwise. */
export function analyseRepeatability(layout: Layout, c: ConstraintAnalysis, map: RowMap): RepeatabilityResult | null {
  const s = rowScatter(layout);
  if (!layout.points.length || !s.some((v) => v > 0)) return null;
  const m = layout.contacts.length;
  const rows = [...Array(m).keys()].filter((i) => map.kept[i] && s[i] > 0);
  const n = 6 * layout.bodies.length;
  const toUm = metresPer(layout.units.length) * 1e6;
  const bodyIndex = new Map(layout.bodies.map((b, i) => [b.id, i]));
  const points: Record<string, PointRepeatability> = {};
  for (const p of layout.points) {
    const b = bodyIndex.get(p.body)!;
    // the point's motion P t_j for the twist t_j = G a_j k_j s_j of each scattering row j, by the adjoint:
    // G is symmetric, so (P t_j)_r = k_j s_j a_j·(G p_r) with p_r the r-th row of P; three solves a point
    // instead of one a row (a whole instrument has thousands of rows and a handful of points)
    const unit = (q: number) => Array.from({ length: n }, (_, j) => (j === q ? 1 : 0));
    const P = [0, 1, 2].map(() => new Array<number>(n).fill(0));
    for (let q = 6 * b; q < 6 * b + 6; q++) {
      const col = pointMotion(unit(q), b, p.point, c.centroid, c.length);
      for (let r = 0; r < 3; r++) P[r][q] = col[r];
    }
    const AY = P.map((pr) => map.apply(map.pinv(pr)));
    const d = rows.map((i) => [0, 1, 2].map((r) => map.k[i] * s[i] * AY[r][i]) as Vec3);
    const C = new Matrix(3, 3);
    for (const x of d) for (let r = 0; r < 3; r++) for (let q = 0; q < 3; q++) C.set(r, q, C.get(r, q) + x[r] * x[q]);
    const trace = C.get(0, 0) + C.get(1, 1) + C.get(2, 2);
    const contributions: Record<string, number> = {};
    rows.forEach((i, j) => {
      const v = d[j][0] ** 2 + d[j][1] ** 2 + d[j][2] ** 2;
      contributions[layout.contacts[i].id] = trace > 0 ? Math.min(1, Math.max(0, v / trace)) : 0;
    });
    const { semi, axes } = principal(C);
    points[p.id] = {
      sigmaUm: [0, 1, 2].map((r) => Math.sqrt(Math.max(0, C.get(r, r))) * toUm) as Vec3,
      semiAxesUm: semi.map((v) => Math.sqrt(Math.max(0, v)) * toUm) as Vec3,
      axes,
      contributions,
    };
  }
  return { undetermined: map.undetermined, points };
}

/** Eigenvalues (descending) and unit eigenvectors of a symmetric 3 × 3, each with its largest component positive. */
function principal(C: Matrix): { semi: number[]; axes: [Vec3, Vec3, Vec3] } {
  const eig = new EigenvalueDecomposition(C, { assumeSymmetric: true });
  const vals = eig.realEigenvalues;
  const V = eig.eigenvectorMatrix;
  const order = [0, 1, 2].sort((a, b) => vals[b] - vals[a]);
  const axes = order.map((j) => {
    const v = V.getColumn(j);
    const len = Math.hypot(...v) || 1;
    let big = 0;
    for (let r = 1; r < 3; r++) if (Math.abs(v[r]) > Math.abs(v[big]) + 1e-12) big = r;
    const sign = v[big] < 0 ? -1 : 1;
    return v.map((x) => (sign * x) / len) as Vec3;
  }) as [Vec3, Vec3, Vec3];
  return { semi: order.map((j) => vals[j]), axes };
}
