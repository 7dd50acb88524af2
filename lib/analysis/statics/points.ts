/** Functional points (analysis.md §5): motion per 1 µm rise of each ground support, and under the first case's seated load. */
import { GROUND } from "@/lib/layout/model";
import { scale } from "../vec";
import { addRowT } from "../sparse/rows";
import { pointDisplacement } from "./context";
import { factorStiff, solveWith } from "./solver";
import type { CaseResult, Ctx, GroundSolves, PointMotion } from "./types";

/** Point motions with the foundation's stiffness (equal when it has none). */
export function analysePoints(ctx: Ctx, first: CaseResult, kFound: number[] | null, shared?: GroundSolves): Record<string, PointMotion> {
  const { layout, c } = ctx;
  const points: Record<string, PointMotion> = {};
  if (!layout.points.length) return points;
  const ground = layout.contacts.map((k, i) => (k.on === GROUND ? i : -1)).filter((i) => i >= 0);
  const perUm = 1e-6 / ctx.toMetre;
  const k = kFound ?? layout.contacts.map(() => 1);
  const active = first.active;
  for (const pt of layout.points) points[pt.id] = { perMicrometre: {}, seatedUm: null, body: pt.body };
  let factor: ReturnType<typeof factorStiff> | null = null;
  for (const j of ground) {
    if (!active[j]) continue;
    let u: number[];
    if (shared) u = shared.twist(j);
    else {
      factor ??= factorStiff(
        ctx,
        k.map((v) => (v > 0 ? v : 1)),
        active,
      );
      const w = new Array<number>(ctx.n).fill(0);
      addRowT(c.rows, j, k[j] * perUm, w);
      u = solveWith(ctx, factor, w).u;
    }
    for (const pt of layout.points) points[pt.id].perMicrometre[layout.contacts[j].id] = scale(pointDisplacement(ctx, pt.body, pt.point, u), 1 / perUm);
  }
  if (first.displacement) {
    for (const pt of layout.points) points[pt.id].seatedUm = scale(pointDisplacement(ctx, pt.body, pt.point, first.displacement), 1 / perUm);
  }
  return points;
}
