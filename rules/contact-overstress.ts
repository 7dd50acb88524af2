/** contact-overstress: Hertz maximum pressure above the lower allowable of the two materials (one finding per contact, every case in a table). */
import { z } from "zod";
import { defineRule, fill, type FindingDraft } from "./types";
import { num } from "@/lib/analysis/format";
import { unitLabel } from "@/lib/layout/units";
import type { HertzEntry } from "@/lib/analysis";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "{contact} at {pressure} MPa exceeds {allowable} MPa (load case {worstCase})",
  titleCases: "{contact} at {pressure} MPa exceeds {allowable} MPa (worst of {cases} load cases: {worstCase})",
};

export default defineRule({
  meta: {
    id: "contact-overstress",
    severity: "error",
    summary: "Hertz maximum contact pressure above the allowable of the weaker material.",
    explanation:
      "Each contact with Hertz data is solved at its seated force in every load case: contact modulus, principal relative radii, semi-axes, maximum pressure p0, approach and stiffness (elliptical contacts by the exact elliptic-integral solution). p0 is compared with the lower allowable pressure of the two materials. One finding per contact lists every load case that exceeds, worst first. Precision mounts usually stay well below static ratings for repeatability; a project can lower the allowable with the `derate` option. A ball in a true cone touches along a ring, not at points: model a socket as three point contacts.",
    source:
      "Johnson, Contact Mechanics (CUP 1985) §3–§4; Roark's Formulas for Stress and Strain, Table 14.1; ISO 76 static load rating (4200 MPa for ball bearings)",
    options: z.object({ derate: z.number().positive().max(1).default(1) }),
    messages,
  },
  check({ layout, analysis, options }) {
    const u = unitLabel(layout.units.length);
    const over = new Map<string, { caseId: string; h: HertzEntry; allow: number }[]>();
    for (const c of analysis.statics.cases) {
      for (const [id, h] of Object.entries(c.hertz)) {
        if (h.allowableMPa === null) continue;
        const allow = h.allowableMPa * options.derate;
        if (h.maxPressureMPa <= allow) continue;
        over.set(id, [...(over.get(id) ?? []), { caseId: c.id, h, allow }]);
      }
    }
    const out: FindingDraft[] = [];
    for (const c of layout.contacts) {
      const rows = over.get(c.id);
      if (!rows) continue;
      rows.sort((a, b) => b.h.maxPressureMPa / b.allow - a.h.maxPressureMPa / a.allow);
      const worst = rows[0];
      const table = [`| load case | max. pressure (MPa) | allowable (MPa) | contact ellipse semi-axes (${u}) | approach (µm) |`, "|---|---|---|---|---|"];
      for (const r of rows)
        table.push(`| ${r.caseId} | ${num(r.h.maxPressureMPa)} | ${num(r.allow)} | ${num(r.h.semiMajor)} × ${num(r.h.semiMinor)} | ${num(r.h.approachUm)} |`);
      out.push({
        title: fill(rows.length > 1 ? messages.titleCases : messages.title, {
          contact: c.id,
          pressure: num(worst.h.maxPressureMPa),
          allowable: num(worst.allow),
          cases: rows.length,
          worstCase: worst.caseId,
        }),
        body: [
          `Contact ${c.id} exceeds the allowable Hertz pressure${options.derate < 1 ? ` (derated ×${options.derate})` : ""} in ${rows.length} load case${rows.length === 1 ? "" : "s"}, worst first:`,
          "",
          table.join("\n"),
          "",
          "**Repair.** Larger radii, a conforming groove, harder materials or less preload.",
        ].join("\n"),
        // fingerprint = rule + contact id (no load case): the thread follows the contact whichever case is worst
        contacts: [c.id],
      });
    }
    return out;
  },
});
