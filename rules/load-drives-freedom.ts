/** load-drives-freedom: a load has a component along a free motion, so the part is not held (per load case). */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { vec } from "@/lib/analysis/format";
import { unitLabel } from "@/lib/layout/units";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Case {case}: the load drives a free motion",
  titleAfterLiftOff: "Case {case}: the load drives a free motion after {seats} {verb} off",
};

export default defineRule({
  meta: {
    id: "load-drives-freedom",
    severity: "error",
    summary: "A load (gravity, preload, shock) pushes the part along a motion that no seat stops.",
    explanation:
      "With the free twists t and the load wrench W in scaled form, each normalised, the load drives a freedom when |t̂ᵀŴ| > 1e-9: the load does work along a free motion, so no set of contact forces balances it and the part moves until something not in the layout stops it. Seating forces are then not defined. The same happens when a seat lifts off and leaves a freedom behind.",
    source: "Principle of virtual work; reciprocity of twists and wrenches, Ball, A Treatise on the Theory of Screws (1900)",
    options: z.object({}),
    messages,
  },
  check({ layout, analysis }) {
    const u = unitLabel(layout.units.length);
    return analysis.statics.cases
      .filter((c) => c.driven)
      .map((c) => {
        const lifted = c.seating?.liftOff ?? [];
        return {
          title: lifted.length
            ? fill(messages.titleAfterLiftOff, { case: c.id, seats: lifted.join(", "), verb: lifted.length === 1 ? "lifts" : "lift" })
            : fill(messages.title, { case: c.id }),
          body: [
            `In load case **${c.id}** (acceleration ${vec(c.gravity, "m/s²")}) the external wrench has a component along a motion that the ${lifted.length ? "remaining " : ""}contacts do not stop, so the part is not held and seating forces are undefined.`,
            lifted.length ? `\nSeats released by the active-set solution: ${lifted.join(", ")}.` : "",
            analysis.constraint.counts.freedoms > 0
              ? `\nThe layout has ${analysis.constraint.counts.freedoms} free motion(s); see the free-motion finding for their axes (lengths in ${u}).`
              : "",
            "\n**Repair.** Add a contact along the driven motion, or add preload that keeps the seats closed in this case.",
          ].join(""),
          contacts: lifted.slice().sort(),
          loadCase: c.id,
          keys: [`case:${c.id}`],
        };
      })
      .map((d) => ({ ...d, body: d.body.replace(/\n\n+/g, "\n\n") }));
  },
});
