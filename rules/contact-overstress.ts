/** contact-overstress: Hertz maximum pressure above the lower allowable of the two materials. */
import { z } from "zod";
import { defineRule } from "./types";
import { num } from "@/lib/analysis/format";

export default defineRule({
  meta: {
    id: "contact-overstress",
    severity: "error",
    summary: "Hertz maximum contact pressure above the allowable of the weaker material.",
    explanation:
      "Each contact with Hertz data is solved at its seated force: contact modulus, principal relative radii, semi-axes, maximum pressure p0, approach and stiffness (elliptical contacts by the exact elliptic-integral solution). p0 is compared with the lower allowable pressure of the two materials. Precision mounts usually stay well below static ratings for repeatability; a project can lower the allowable with the `derate` option. A ball in a true cone touches along a ring, not at points: model a socket as three point contacts.",
    source: "Johnson, Contact Mechanics (CUP 1985) §3–§4; Roark's Formulas for Stress and Strain, Table 14.1; ISO 76 static load rating (4200 MPa for ball bearings)",
    options: z.object({ derate: z.number().positive().max(1).default(1) }),
  },
  check({ analysis, options }) {
    const out = [];
    for (const c of analysis.statics.cases) {
      for (const [id, h] of Object.entries(c.hertz)) {
        if (h.allowableMPa === null) continue;
        const allow = h.allowableMPa * options.derate;
        if (h.maxPressureMPa <= allow) continue;
        out.push({
          title: `Case ${c.id}: ${id} at ${num(h.maxPressureMPa)} MPa exceeds ${num(allow)} MPa`,
          body: `In load case **${c.id}** contact ${id} reaches a maximum Hertz pressure of **${num(h.maxPressureMPa)} MPa** against an allowable of ${num(allow)} MPa${options.derate < 1 ? ` (derated ×${options.derate})` : ""}; contact ellipse ${num(h.semiMajor)} × ${num(h.semiMinor)} (semi-axes, file length units), approach ${num(h.approachUm)} µm.\n\n**Repair.** Larger radii, a conforming groove, harder materials or less preload.`,
          contacts: [id],
          loadCase: c.id,
        });
      }
    }
    return out;
  },
});
