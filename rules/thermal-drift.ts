/** thermal-drift: where each body's thermal centre lies and how far each functional point drifts per kelvin and over the swing. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { num, vec } from "@/lib/analysis/format";
import { metresPer, unitLabel } from "@/lib/layout/units";
import { norm } from "@/lib/analysis/vec";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Thermal drift up to {drift} µm/K at the functional points",
  titleOver: "Thermal drift over the allowance at {points}",
  titleCentres: "Thermal centres of the bodies",
};

export default defineRule({
  meta: {
    id: "thermal-drift",
    severity: "info",
    summary: "Thermal centre of each body and drift of each functional point when the temperature changes.",
    explanation:
      "A uniform temperature change makes every body and the base grow about their own material, each by its expansion coefficient. The seats let the part move as a rigid body to follow the mismatch; the point of the part that stays put relative to the base is its **thermal centre**. A functional point away from it drifts by (α_body − α_base)(q − c) + v + ω × q per kelvin. The finding lists each body's thermal centre and each point's drift per kelvin and over the layout's temperature swing (1 K when none is given), and becomes a warning when a point's drift over the swing exceeds its allowance.",
    source:
      "Linear thermal expansion and rigid-body kinematics of the twist; thermal centre of three-groove couplings at the intersection of the groove axes (symmetry property of kinematic couplings, precision-engineering design practice)",
    options: z.object({}),
    messages,
  },
  check({ layout, analysis }) {
    const t = analysis.thermal;
    if (!t) return [];
    const u = unitLabel(layout.units.length);
    const swing = t.swingK ?? 1;
    const toUm = metresPer(layout.units.length) * 1e6;
    const lines: string[] = [];
    lines.push(
      `Expansion coefficients: base ${num(t.alpha.ground * 1e6)} µm/(m·K); ${layout.bodies.map((b) => `${b.id} ${num(t.alpha[b.id] * 1e6)} µm/(m·K)`).join("; ")}. Swing ${t.swingK === null ? "not given (1 K used)" : `${num(swing)} K`}.`,
    );
    if (t.undetermined)
      lines.push(
        "",
        "The kept seats leave a free motion: the drift shown is the smallest motion that satisfies the seats (undetermined along the free motion).",
      );
    lines.push("", "| body | thermal centre |", "|---|---|");
    for (const [id, b] of Object.entries(t.bodies)) lines.push(`| ${id} | ${b.centre ? vec(b.centre, u) : "none (same expansion as the base)"} |`);
    const over: string[] = [];
    const pts = Object.entries(t.points);
    if (pts.length) {
      lines.push("", `| point | drift per K (µm) | magnitude per K | over ${num(swing)} K | allowance |`, "|---|---|---|---|---|");
      for (const [id, p] of pts) {
        const perK = norm(p.driftUmPerK);
        const overSwing = perK * swing;
        const allowance = layout.points.find((x) => x.id === id)?.allowance;
        const allowUm = allowance === undefined ? null : allowance * toUm;
        const exceeds = allowUm !== null && overSwing > allowUm;
        if (exceeds) over.push(id);
        lines.push(
          `| ${id} | ${vec(p.driftUmPerK)} | ${num(perK)} µm | ${num(overSwing)} µm${exceeds ? " **over**" : ""} | ${allowUm === null ? "—" : `${num(allowUm)} µm`} |`,
        );
      }
    }
    if (over.length)
      lines.push(
        "",
        `**${over.join(", ")}** drift${over.length === 1 ? "s" : ""} more than allowed. **Repair.** Move the thermal centre toward the point (turn the grooves so their axes meet under it), or match the expansion of part and base.`,
      );
    const worst = pts.reduce((a, [, p]) => Math.max(a, norm(p.driftUmPerK)), 0);
    return [
      {
        title: over.length
          ? fill(messages.titleOver, { points: over.join(", ") })
          : pts.length
            ? fill(messages.title, { drift: num(worst) })
            : messages.titleCentres,
        body: lines.join("\n"),
        bodies: layout.bodies.map((b) => b.id),
        keys: ["thermal"],
        ...(over.length ? { severity: "warning" as const } : {}),
      },
    ];
  },
});
