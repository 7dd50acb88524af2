/** foundation-coupling: the support to ground is over-constrained, so the base's shape leaks into the part. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { featuresOf, listIds } from "./describe";
import { num } from "@/lib/analysis/format";
import { GROUND } from "@/lib/layout/model";
import { unitLabel } from "@/lib/layout/units";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Base warp reaches the part: {force} {unit} per µm",
  titleNoMagnitude: "Base warp reaches the part (over-constrained support)",
};

export default defineRule({
  meta: {
    id: "foundation-coupling",
    severity: "warning",
    summary: "Over-constrained support to ground: a deforming base changes the contact forces.",
    explanation:
      "A base that warps moves the ground contacts along their normals by d. The contact forces change by Δλ = S d with S = K − KJ(JᵀKJ)⁺JᵀK. With no redundant support S = 0: the part follows the base as a rigid body and its loads and shape do not change. With a redundant support the part must bend to stay on all its seats: the base's shape leaks into the part. The finding gives, per micrometre of rise of each support, the largest force change, and compares it with the mean seated force.",
    source:
      "Compatibility and stiffness method of structural analysis (flexibility/stiffness of redundant supports); self-stress after Pellegrino & Calladine, IJSS 22 (1986)",
    options: z.object({ fraction: z.number().positive().default(0.01) }),
    messages,
  },
  check({ layout, analysis, options }) {
    const { selfStress, counts } = analysis.constraint;
    const groundIds = new Set(layout.contacts.filter((c) => c.on === GROUND).map((c) => c.id));
    const grounded = selfStress.filter((s) => Object.keys(s.forces).some((id) => groundIds.has(id)));
    if (counts.redundancies === 0 || grounded.length === 0) return [];
    const involved = [...new Set(grounded.flatMap((s) => Object.keys(s.forces)))].filter((id) => groundIds.has(id)).sort();
    const f = analysis.statics.foundation;
    const fu = unitLabel(layout.units.force);
    const first = analysis.statics.cases[0];
    const seated = first?.force ? first.force.filter((v) => v > 0) : [];
    const mean = seated.length ? seated.reduce((a, b) => a + b, 0) / seated.length : 0;
    if (f && mean > 0 && f.maxPerMicrometre <= options.fraction * mean) return [];
    const lines: string[] = [];
    if (f) {
      lines.push(`A 1 µm rise of one support changes a contact force by up to **${num(f.maxPerMicrometre)} ${fu}** (stiffness: ${f.stiffness}).`);
      if (mean > 0)
        lines.push(
          `That is ${num((f.maxPerMicrometre / mean) * 100, 3)} % of the mean seated force ${num(mean)} ${fu} (threshold ${options.fraction * 100} %).`,
        );
      lines.push("", "| support rises 1 µm | largest change | at |", "|---|---|---|");
      for (const [g, col] of Object.entries(f.sensitivity)) {
        const [at, v] = Object.entries(col).reduce((a, b) => (Math.abs(b[1]) > Math.abs(a[1]) ? b : a), ["—", 0] as [string, number]);
        lines.push(`| ${g} | ${num(v)} ${fu} | ${at} |`);
      }
    } else {
      lines.push(
        "The support to ground is over-constrained. The file gives no contact stiffness (or no seated load for Hertz stiffness), so the size of the effect is not computed: with equal stiffness assumed it has no magnitude.",
      );
    }
    lines.push(
      "",
      `The base's shape reaches the part through ${listIds(involved)}. **Repair.** Support on three seats (exact constraint), or make one support compliant along its normal.`,
    );
    return [
      {
        title: f ? fill(messages.title, { force: num(f.maxPerMicrometre), unit: fu }) : messages.titleNoMagnitude,
        body: lines.join("\n"),
        contacts: involved,
        features: featuresOf(layout, involved),
      },
    ];
  },
});
