/**
 * Temperature (analysis.md §9): interference per kelvin of every kept row, body twists by the weighted
 * pseudo-inverse in scaled coordinates, thermal force change (a self-stress), each body's thermal centre
 * and each functional point's drift relative to the base. All per kelvin, file units.
 */
import { Matrix, solve as solveLinear } from "ml-matrix";
import { GROUND, type Layout, type Vec3 } from "@/lib/layout/model";
import { findMaterial } from "@/lib/layout/materials";
import { metresPer } from "@/lib/layout/units";
import type { ConstraintAnalysis } from "./constraint";
import type { RowMap } from "./row-map";
import { unscaledTwist } from "./row-map";
import { add, cross, dot, scale, sub } from "./vec";
import { THERMAL } from "./tolerances";

export interface ThermalResult {
  swingK: number | null;
  undetermined: boolean;
  bodies: Record<string, { centre: Vec3 | null }>;
  /** contact force change per kelvin (file force units; positive pushes more), null without a stiffness magnitude */
  forcesPerK: Record<string, number> | null;
  points: Record<string, { driftUmPerK: Vec3 }>;
  /** expansion coefficient per body id and of the ground, 1/K */
  alpha: Record<string, number>;
  /** the kept rows carry a redundancy and the mismatch is fought (max|e − J t| > 1e-9 max|e|) */
  fought: boolean;
  /** kept rows' redundancy */
  redundancies: number;
  /** stiffness behind the forces */
  stiffness: RowMap["source"];
  /** rows (contact ids) with a non-zero interference and no rigid-body way out: they carry the force */
  fightingRows: string[];
}

function cleanVec(v: Vec3, scaleRef: number): Vec3 {
  return v.map((x) => (Math.abs(x) < THERMAL.roundOff * scaleRef ? 0 : x)) as Vec3;
}

/** Expansion coefficient of every body and of the ground, or the list of what lacks one. */
export function expansionCoefficients(layout: Layout): { alpha: Record<string, number>; missing: string[] } {
  const alpha: Record<string, number> = {};
  const missing: string[] = [];
  const take = (id: string, materialId: string | undefined) => {
    const a = findMaterial(layout, materialId)?.expansionPerK;
    if (a === undefined) missing.push(id);
    else alpha[id] = a;
  };
  take(GROUND, layout.groundMaterial);
  for (const b of layout.bodies) take(b.id, b.material);
  return { alpha, missing };
}

/** Runs §9 when the ground and every body have an expansion coefficient; null otherwise. */
export function analyseThermal(layout: Layout, c: ConstraintAnalysis, map: RowMap): ThermalResult | null {
  const { alpha, missing } = expansionCoefficients(layout);
  if (missing.length) return null;
  const cen = c.centroid;
  const L = c.length;
  const e = layout.contacts.map((k, i) => (map.kept[i] ? dot(c.normals[i], scale(sub(k.point, cen), alpha[k.on] - alpha[k.body])) : 0));
  const ts = map.solve(e);
  const Jt = map.apply(ts);
  const resid = e.map((v, i) => (map.kept[i] ? v - Jt[i] : 0));
  const eMax = Math.max(0, ...e.map(Math.abs));
  const rMax = Math.max(0, ...resid.map(Math.abs));
  const fought = map.redundancies > 0 && eMax > 0 && rMax > THERMAL.foughtRelative * eMax;
  let forcesPerK: Record<string, number> | null;
  if (map.redundancies === 0) forcesPerK = Object.fromEntries(layout.contacts.map((k) => [k.id, 0]));
  else if (map.source === "equal") forcesPerK = null;
  else forcesPerK = Object.fromEntries(layout.contacts.map((k, i) => [k.id, map.kept[i] ? map.k[i] * resid[i] : 0]));
  const toUm = metresPer(layout.units.length) * 1e6;
  const aG = alpha[GROUND];
  const bodies: ThermalResult["bodies"] = {};
  layout.bodies.forEach((b, bi) => {
    const { omega, v } = unscaledTwist(ts, bi, cen, L);
    const da = alpha[b.id] - aG;
    if (Math.abs(da) < THERMAL.noMismatchPerK) {
      bodies[b.id] = { centre: null };
      return;
    }
    // (Δα I + [ω]×) q = −v + Δα c; the matrix is regular whenever Δα ≠ 0 (eigenvalues Δα, Δα ± i|ω|)
    const M = new Matrix([
      [da, -omega[2], omega[1]],
      [omega[2], da, -omega[0]],
      [-omega[1], omega[0], da],
    ]);
    const rhs = Matrix.columnVector(add(scale(v, -1), scale(cen, da)));
    bodies[b.id] = { centre: solveLinear(M, rhs).getColumn(0) as Vec3 };
  });
  const bodyIndex = new Map(layout.bodies.map((b, i) => [b.id, i]));
  const points: ThermalResult["points"] = {};
  for (const p of layout.points) {
    const bi = bodyIndex.get(p.body)!;
    const { omega, v } = unscaledTwist(ts, bi, cen, L);
    const r = add(add(scale(sub(p.point, cen), alpha[p.body] - aG), v), cross(omega, p.point));
    points[p.id] = { driftUmPerK: scale(r, toUm) };
  }
  // round-off of the solve (1e-15 of the scale) is shown as the zero it is
  const spread = Math.max(L, ...cen.map(Math.abs));
  for (const b of Object.values(bodies)) if (b.centre) b.centre = cleanVec(b.centre, spread);
  const driftScale = Math.max(0, ...Object.values(points).flatMap((p) => p.driftUmPerK.map(Math.abs)));
  for (const p of Object.values(points)) p.driftUmPerK = cleanVec(p.driftUmPerK, driftScale);
  if (forcesPerK) {
    const fMax = Math.max(0, ...Object.values(forcesPerK).map(Math.abs));
    for (const id of Object.keys(forcesPerK)) if (Math.abs(forcesPerK[id]) < THERMAL.roundOff * fMax) forcesPerK[id] = 0;
  }
  const fightingRows = fought ? layout.contacts.filter((_, i) => Math.abs(resid[i]) > THERMAL.foughtRelative * eMax).map((k) => k.id) : [];
  return {
    swingK: layout.temperatureSwing ?? null,
    undetermined: map.undetermined,
    bodies,
    forcesPerK,
    points,
    alpha,
    fought,
    redundancies: map.redundancies,
    stiffness: map.source,
    fightingRows,
  };
}
