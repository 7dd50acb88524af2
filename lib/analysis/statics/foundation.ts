/**
 * Coupling to the foundation (analysis.md §4): Δλ = S d with S = K − KA(AᵀKA)⁺AᵀK over the first load
 * case's active contacts and tangent stiffness, per 1 µm rise of each ground contact and per unit warp.
 */
import { GROUND } from "@/lib/layout/model";
import { STATICS } from "../tolerances";
import { addRowT } from "../sparse/rows";
import { factorStiff, separation, solveWith } from "./solver";
import type { CaseResult, Ctx, Factor, FoundationResult, GroundSolves, StiffnessSource } from "./types";

/**
 * The stiffness the foundation (and the functional points) use: every contact when nothing is redundant
 * (the result does not depend on it), file stiffness, or the first case's Hertz tangent; null when only the
 * equal assumption is left (no magnitude).
 */
export function foundationStiffness(ctx: Ctx, first: CaseResult, source: StiffnessSource): number[] | null {
  const { layout, c } = ctx;
  if (c.counts.redundancies === 0) return layout.contacts.map((k) => k.stiffness ?? 1);
  if (source === "file") return layout.contacts.map((k, i) => (first.active[i] ? k.stiffness! : 0));
  if (source === "hertz" && first.tangent && first.tangent.some((v) => v > 0)) return first.tangent.map((v, i) => (first.active[i] ? v : 0));
  return null;
}

/** The foundation result, or null without a stiffness magnitude. */
export function analyseFoundation(
  ctx: Ctx,
  first: CaseResult,
  source: StiffnessSource,
  kFound: number[] | null,
  /** the factor and each ground contact's 1 µm response, shared with the functional points (one solve each) */
  shared?: GroundSolves,
): FoundationResult | null {
  const { layout, c, m } = ctx;
  if (!kFound) return null;
  const ground = layout.contacts.map((k, i) => (k.on === GROUND ? i : -1)).filter((i) => i >= 0);
  const perUm = 1e-6 / ctx.toMetre;
  const active = first.active.map((a, i) => a && kFound[i] > 0);
  let factor: Factor | null = null;
  const columnOf = (d: number[]): number[] => {
    // (AᵀKA) u = AᵀK d over the active contacts, then Δλ = K (d − A u)
    factor ??=
      shared?.factor() ??
      factorStiff(
        ctx,
        kFound.map((v) => (v > 0 ? v : 1)),
        active,
      );
    const Kd = d.map((v, i) => (active[i] ? kFound[i] * v : 0));
    const w = new Array<number>(ctx.n).fill(0);
    for (let i = 0; i < m; i++) if (Kd[i] !== 0) addRowT(c.rows, i, Kd[i], w);
    const { u } = solveWith(ctx, factor, w);
    return d.map((v, i) => (active[i] ? kFound[i] * (v - separation(ctx, i, u)) : 0));
  };
  const kMax = Math.max(...kFound);
  const cols = ground.map((j) => {
    if (c.counts.redundancies === 0) return new Float64Array(m);
    const d = new Array<number>(m).fill(0);
    d[j] = perUm;
    if (!shared) return Float64Array.from(columnOf(d));
    const u = shared.twist(j);
    return Float64Array.from(d, (v, i) => (active[i] ? kFound[i] * (v - separation(ctx, i, u)) : 0));
  });
  let max = 0;
  for (const col of cols)
    for (let i = 0; i < m; i++) {
      if (Math.abs(col[i]) < STATICS.foundationRoundOff * (kMax * perUm)) col[i] = 0;
      max = Math.max(max, Math.abs(col[i]));
    }
  // large layouts: the map is ground contacts × all contacts; entries below 1e-12 of the largest may be left out
  // (analysis.md §8, a missing entry is zero), which keeps the report's size in proportion to what is coupled;
  // decided before the entries are written (deleting a million keys afterwards cost half a second)
  const sparse = ground.length * m > STATICS.sparseFoundationEntries;
  const sensitivity: Record<string, Record<string, number>> = {};
  ground.forEach((j, g) => {
    const col = cols[g];
    const entry: Record<string, number> = {};
    layout.contacts.forEach((k, i) => {
      if (!sparse || Math.abs(col[i]) > STATICS.foundationRoundOff * max) entry[k.id] = col[i];
    });
    sensitivity[layout.contacts[j].id] = entry;
  });
  const warp =
    c.counts.redundancies === 0
      ? []
      : c.selfStress.map((state) => {
          const d = layout.contacts.map((k) => (k.on === GROUND ? (state.forces[k.id] ?? 0) : 0));
          const big = Math.max(...d.map(Math.abs));
          const resp = big > 0 ? columnOf(d.map((v) => (v / big) * perUm)) : new Array<number>(m).fill(0);
          return { pivot: state.pivot, forces: Object.fromEntries(layout.contacts.map((k, i) => [k.id, resp[i]])) };
        });
  return { sensitivity, maxPerMicrometre: max, warp, stiffness: c.counts.redundancies === 0 ? "none" : source };
}
