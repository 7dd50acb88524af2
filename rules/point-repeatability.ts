/** point-repeatability: the scatter of each functional point from seat scatter, and which seats feed it. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { rowLabel } from "./describe";
import { num, vec } from "@/lib/analysis/format";
import { metresPer } from "@/lib/layout/units";

/** Contributors listed per point in the finding. */
const TOP = 3;

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Repeatability: 3σ up to {sigma} µm at the functional points",
  titleOver: "Repeatability over the allowance at {points}",
};

export default defineRule({
  meta: {
    id: "point-repeatability",
    severity: "info",
    summary: "Repeatability of each functional point from seat scatter: 1σ per axis, 3σ ellipsoid and the seats that dominate.",
    explanation:
      "From one seating to the next each seat lands a little differently along its normal. With independent normal scatter s on every kept row, the body twists by δt = G δg (the weighted map of the temperature analysis) and a point moves by v + ω × q; its covariance is C = P G diag(s²) Gᵀ Pᵀ. The finding gives 1σ per axis, three times the largest semi-axis of the ellipsoid, and the seats with the largest share of the variance — the ones to improve first. It becomes a warning when 3σ exceeds the point's allowance.",
    source:
      "Linear propagation of independent errors (covariance law, GUM JCGM 100:2008 §5.1); error budgeting of kinematic couplings (precision-engineering practice)",
    options: z.object({}),
    messages,
  },
  check({ layout, analysis }) {
    const rep = analysis.repeatability;
    if (!rep) return [];
    const toUm = metresPer(layout.units.length) * 1e6;
    const lines: string[] = [];
    if (rep.undetermined) lines.push("The kept seats leave a free motion: the scatter along it is not determined (the smallest motion is shown).", "");
    lines.push("| point | 1σ x, y, z (µm) | 3σ largest semi-axis | allowance | largest contributors |", "|---|---|---|---|---|");
    const over: string[] = [];
    let worst = 0;
    for (const [id, p] of Object.entries(rep.points)) {
      const three = 3 * p.semiAxesUm[0];
      worst = Math.max(worst, three);
      const allowance = layout.points.find((x) => x.id === id)?.allowance;
      const exceeds = allowance !== undefined && three > allowance * toUm;
      if (exceeds) over.push(id);
      const top = Object.entries(p.contributions)
        .sort((a, b) => b[1] - a[1])
        .slice(0, TOP)
        .map(([c, share]) => `${rowLabel(layout, c)} ${num(share * 100, 3)} %`)
        .join(", ");
      lines.push(
        `| ${id} | ${vec(p.sigmaUm)} | ${num(three)} µm${exceeds ? " **over**" : ""} | ${allowance === undefined ? "—" : `${num(allowance * toUm)} µm`} | ${top || "—"} |`,
      );
    }
    if (over.length)
      lines.push(
        "",
        `**${over.join(", ")}** scatter${over.length === 1 ? "s" : ""} more than allowed (3σ). **Repair.** Improve the seats at the top of the list (finish, preload, harder contact), or move the point toward the coupling's centre.`,
      );
    return [
      {
        title: over.length ? fill(messages.titleOver, { points: over.join(", ") }) : fill(messages.title, { sigma: num(worst) }),
        body: lines.join("\n"),
        keys: ["repeatability"],
        ...(over.length ? { severity: "warning" as const } : {}),
      },
    ];
  },
});
