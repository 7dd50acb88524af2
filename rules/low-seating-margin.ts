/** low-seating-margin: the least-loaded seat carries little of the mean seat force. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { num } from "@/lib/analysis/format";
import { unitLabel } from "@/lib/layout/units";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Case {case}: seating margin {margin} at {seat}",
};

export default defineRule({
  meta: {
    id: "low-seating-margin",
    severity: "warning",
    summary: "Seating margin (smallest seat force over mean seat force) below the threshold.",
    explanation:
      "A seat that carries little of the load is close to lifting off: a small extra load, a vibration or friction can unseat it. The margin is the smallest seat force over the mean seat force in each load case.",
    source: "common practice (kinematic coupling preload design)",
    options: z.object({ threshold: z.number().positive().max(1).default(0.1) }),
    messages,
  },
  check({ layout, analysis, options }) {
    const fu = unitLabel(layout.units.force);
    return analysis.statics.cases
      .filter((c) => c.seating?.forces && c.seating.liftOff.length === 0 && c.seating.margin !== null && c.seating.margin < options.threshold)
      .map((c) => {
        const forces = c.seating!.forces!;
        const seats = layout.contacts.filter((k) => k.sense === "unilateral");
        const least = seats.reduce((a, b) => (forces[b.id] < forces[a.id] ? b : a));
        return {
          title: fill(messages.title, { case: c.id, margin: num(c.seating!.margin!, 3), seat: least.id }),
          body: `In load case **${c.id}** seat ${least.id} carries ${num(forces[least.id])} ${fu}, ${num(c.seating!.margin! * 100, 3)} % of the mean seat force (threshold ${options.threshold * 100} %).\n\n**Repair.** Add preload or move the load's line of action towards the middle of the support.`,
          contacts: [least.id],
          loadCase: c.id,
        };
      });
  },
});
