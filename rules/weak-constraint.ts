/** weak-constraint: the constraint matrix is poorly conditioned (a direction held only by a small lever). */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { movingBodies, screwText } from "./describe";
import { num } from "@/lib/analysis/format";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Weakly held: conditioning {conditioning} is below {threshold}",
};

export default defineRule({
  meta: {
    id: "weak-constraint",
    severity: "warning",
    summary: "Conditioning σ_r / σ_max below the threshold: some direction is held only weakly.",
    explanation:
      "Conditioning is the smallest kept singular value of the scaled constraint matrix over the largest. Near zero, some motion is stopped only by contacts at a poor angle or a short lever: small contact compliance or misfit gives a large error motion. The least-constrained direction is that motion, shown as a screw.",
    source:
      "Singular value decomposition, condition of a linear map: Golub & Van Loan, Matrix Computations, §2.4; characteristic-length scaling as in Hopkins & Culpepper, Precision Engineering 34 (2010)",
    options: z.object({ threshold: z.number().positive().max(1).default(0.05) }),
    messages,
  },
  check({ layout, analysis, options }) {
    const { conditioning, counts, weakestDirection } = analysis.constraint;
    if (counts.rank === 0 || conditioning >= options.threshold || !weakestDirection) return [];
    const bodies = movingBodies(weakestDirection);
    return [
      {
        title: fill(messages.title, { conditioning: num(conditioning, 3), threshold: options.threshold }),
        body: [
          `σ_r / σ_max = **${num(conditioning, 4)}** (threshold ${options.threshold}). The least-constrained direction:`,
          "",
          ...bodies.map((b) => `- ${b}: ${screwText(weakestDirection, b, layout.units.length)}`),
          "",
          "**Repair.** Spread the contacts further apart, or turn their normals towards this motion.",
        ].join("\n"),
        bodies,
      },
    ];
  },
});
