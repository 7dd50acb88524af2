/** thermal-mismatch: an over-constrained support fights the thermal growth and its contacts load up. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { featuresOf, largestRows, listIds, rowLabel, rowNames } from "./describe";
import { num } from "@/lib/analysis/format";
import { unitLabel } from "@/lib/layout/units";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Thermal growth is fought: up to {force} {unit}/K at {rows}",
  titleNoMagnitude: "Thermal growth is fought by {rows}",
};

export default defineRule({
  meta: {
    id: "thermal-mismatch",
    severity: "warning",
    summary: "An over-constrained support fights the thermal growth: contact forces change with temperature.",
    explanation:
      "When part and base expand differently, an exactly constrained mount lets the part follow as a rigid body and no force changes. With a redundant support the seats cannot all follow: the mismatch e is fought and the forces change by Δλ = K(e − J t) per kelvin, a self-stress (Jᵀ Δλ = 0) that bends the part and shifts its seats. With file, flexure or Hertz stiffness the finding gives the force change per kelvin and over the swing and compares it with the mean seated force (threshold an option); with only equal stiffness assumed it names the loop without a magnitude.",
    source: "Thermal stress in statically indeterminate supports (compatibility method, Hooke's law); self-stress after Pellegrino & Calladine, IJSS 22 (1986)",
    options: z.object({ fraction: z.number().positive().default(0.01) }),
    messages,
  },
  check({ layout, analysis, options }) {
    const t = analysis.thermal;
    if (!t || !t.fought) return [];
    const fu = unitLabel(layout.units.force);
    const swing = t.swingK ?? 1;
    const first = analysis.statics.cases[0];
    const seated = first?.force ? layout.contacts.map((c, i) => (c.sense === "unilateral" ? first.force![i] : 0)).filter((v) => v > 0) : [];
    const mean = seated.length ? seated.reduce((a, b) => a + b, 0) / seated.length : 0;
    const maxPerK = t.forcesPerK ? Math.max(...Object.values(t.forcesPerK).map(Math.abs)) : null;
    if (maxPerK !== null && mean > 0 && maxPerK * swing <= options.fraction * mean) return [];
    const rows = t.fightingRows;
    const names = rowNames(layout, rows);
    const lines: string[] = [];
    lines.push(
      `The support has ${t.redundancies} redundant constraint${t.redundancies === 1 ? "" : "s"} in service, and the expansion mismatch is fought by **${listIds(names)}**.`,
    );
    if (t.forcesPerK && maxPerK !== null) {
      lines.push("", `| row | force change per K (${fu}) | over ${num(swing)} K (${fu}) |`, "|---|---|---|");
      const shown = largestRows(rows, (id) => t.forcesPerK![id]);
      for (const id of shown) lines.push(`| ${rowLabel(layout, id)} | ${num(t.forcesPerK[id])} | ${num(t.forcesPerK[id] * swing)} |`);
      if (shown.length < rows.length) lines.push("", `${rows.length - shown.length} more rows with smaller changes are in the report (thermal.forcesPerK).`);
      lines.push(
        "",
        `Largest change **${num(maxPerK * swing)} ${fu}** over ${num(swing)} K (stiffness: ${t.stiffness})${mean > 0 ? `, ${num(((maxPerK * swing) / mean) * 100, 3)} % of the mean seated force ${num(mean)} ${fu} (threshold ${options.fraction * 100} %)` : ""}.`,
      );
    } else {
      lines.push("", "No contact stiffness magnitude is known (equal stiffness assumed), so the size of the force change is not computed.");
    }
    lines.push(
      "",
      "**Repair.** Remove the redundancy (exact constraint lets the part grow freely about its thermal centre), make one seat compliant along its normal, or match the expansion of part and base.",
    );
    return [
      {
        title:
          maxPerK !== null
            ? fill(messages.title, { force: num(maxPerK), unit: fu, rows: names.slice(0, 4).join(", ") })
            : fill(messages.titleNoMagnitude, { rows: names.slice(0, 4).join(", ") }),
        body: lines.join("\n"),
        contacts: rows.slice().sort(),
        features: featuresOf(layout, rows),
      },
    ];
  },
});
