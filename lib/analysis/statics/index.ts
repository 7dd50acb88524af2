/**
 * Seating, load sharing, lift-off, Hertz stress, foundation coupling and functional-point motion
 * (analysis.md §3–§5), one module per question. Everything is solved on the scaled constraint matrix A of
 * §1: a scaled twist s = [L·ω; v + ω × c] pairs with the scaled wrench w = [M_c / L; F] (M_c the moment
 * about c), so A s gives normal separations and Aᵀλ + w = 0 is equilibrium. File units throughout.
 */
import type { Layout } from "@/lib/layout/model";
import { metresPer, newtonsPer } from "@/lib/layout/units";
import type { ConstraintAnalysis } from "../constraint";
import { hertzUsable, materialTable } from "./context";
import { analyseFoundation, foundationStiffness } from "./foundation";
import { analysePoints } from "./points";
import { solveCase } from "./seating";
import { factorStiff, solveWith } from "./solver";
import { addRowT } from "../sparse/rows";
import type { CaseResult, Ctx, Factor, GroundSolves, StaticsResult, StiffnessSource } from "./types";

export type { CaseResult, FoundationResult, HertzEntry, PointMotion, SeatingResult, StaticsResult, StiffnessSource } from "./types";
export { hertzUsable } from "./context";

/** Runs seating for every load case, foundation coupling and functional points. */
export function analyseStatics(layout: Layout, c: ConstraintAnalysis): StaticsResult {
  const ctx: Ctx = {
    layout,
    c,
    m: layout.contacts.length,
    n: 6 * layout.bodies.length,
    toMetre: metresPer(layout.units.length),
    toNewton: newtonsPer(layout.units.force),
    bodyIndex: new Map(layout.bodies.map((b, i) => [b.id, i])),
    materials: materialTable(layout),
  };
  const hasLoad = layout.bodies.some((b) => b.mass !== undefined) || layout.loads.length > 0;
  const m = ctx.m;
  // all-or-nothing (§3): file stiffness on every row, else usable Hertz data on every contact, else equal
  const source: StiffnessSource =
    m > 0 && layout.contacts.every((k) => k.stiffness !== undefined)
      ? "file"
      : m > 0 && layout.contacts.every((k) => hertzUsable(layout, k))
        ? "hertz"
        : "equal";
  const caseDefs = layout.loadCases ?? [{ id: "default", gravity: layout.gravity, loads: undefined }];
  const cases: CaseResult[] = caseDefs.map((lc) =>
    hasLoad && m > 0
      ? solveCase(ctx, lc.id, lc.gravity, lc.loads, source)
      : {
          id: lc.id,
          gravity: lc.gravity,
          driven: false,
          seating: null,
          unloaded: [],
          hertz: {},
          force: null,
          active: new Array(m).fill(true),
          displacement: null,
          tangent: source === "file" ? layout.contacts.map((k) => k.stiffness!) : null,
        },
  );
  const first = cases[0];
  const kFound = foundationStiffness(ctx, first, source);
  const fileStiffness = source === "file" ? layout.contacts.map((k) => k.stiffness!) : null;
  // the foundation map and the functional points solve the same system for each ground contact's 1 µm rise
  // when every active contact has a stiffness: solve it once for both
  const shared = kFound && first.active.every((a, i) => !a || kFound[i] > 0) ? groundTwists(ctx, first.active, kFound) : undefined;
  return {
    hasLoad,
    stiffnessSource: source,
    fileStiffness,
    cases,
    foundation: analyseFoundation(ctx, first, source, kFound, shared),
    points: analysePoints(ctx, first, kFound, shared),
  };
}

/** u_j = (AᵀKA)⁺ Aᵀ K e_j · 1 µm for ground contact j, over the active contacts, each solved once on first use. */
function groundTwists(ctx: Ctx, active: boolean[], k: number[]): GroundSolves {
  const perUm = 1e-6 / ctx.toMetre;
  const cache = new Map<number, number[]>();
  let f: Factor | null = null;
  const factor = () => (f ??= factorStiff(ctx, k, active));
  return {
    factor,
    twist: (j) => {
      const known = cache.get(j);
      if (known) return known;
      const w = new Array<number>(ctx.n).fill(0);
      addRowT(ctx.c.rows, j, k[j] * perUm, w);
      const u = solveWith(ctx, factor(), w).u;
      cache.set(j, u);
      return u;
    },
  };
}
