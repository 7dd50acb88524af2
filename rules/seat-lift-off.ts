/** seat-lift-off: a unilateral seat would have to pull in some load case. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { featuresOf } from "./describe";
import { vec } from "@/lib/analysis/format";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Case {case}: {seats} {verb} off",
};

export default defineRule({
  meta: {
    id: "seat-lift-off",
    severity: "error",
    summary: "A unilateral seat would have to pull: it lifts off and the part is no longer seated there.",
    explanation:
      "A seat can push but not pull. The seating solution releases every seat whose force would be negative (below −1e-9 of the largest force) and re-solves (an active set), re-adding any released seat the part then presses into. A seat that lifts off is a seat the mount has lost: repeatability and stiffness go with it.",
    source: "Unilateral contact statics by an active-set method: Nocedal & Wright, Numerical Optimization, ch. 16",
    options: z.object({}),
    messages,
  },
  check({ layout, analysis }) {
    return analysis.statics.cases
      .filter((c) => (c.seating?.liftOff.length ?? 0) > 0)
      .map((c) => {
        const lifted = c.seating!.liftOff.slice().sort();
        return {
          title: fill(messages.title, { case: c.id, seats: lifted.join(", "), verb: lifted.length === 1 ? "lifts" : "lift" }),
          body: [
            `In load case **${c.id}** (acceleration ${vec(c.gravity, "m/s²")}) the seat${lifted.length === 1 ? "" : "s"} ${lifted.join(", ")} would have to pull and ${lifted.length === 1 ? "is" : "are"} released.`,
            c.unloaded.length ? `\nSeats that carry nothing (the part rocks on them): ${c.unloaded.join(", ")}.` : "",
            "\n\n**Repair.** Add preload (a spring or the part's weight) that keeps every seat closed in this case, or move the seats so that the load's line of action falls inside the support.",
          ].join(""),
          contacts: lifted,
          features: featuresOf(layout, lifted),
          loadCase: c.id,
        };
      });
  },
});
