/** count-mismatch: freedoms and redundancies both non-zero, which the Grübler–Kutzbach count cannot see. */
import { z } from "zod";
import { defineRule, fill } from "./types";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "The count 6N − m = {grubler} hides {freedoms} and {redundancies}",
};

export default defineRule({
  meta: {
    id: "count-mismatch",
    severity: "warning",
    summary: "Freedoms and redundancies are both present; the mobility count hides them.",
    explanation:
      "The Grübler–Kutzbach count for point contacts, `6N − m`, equals `freedoms − redundancies`. When a layout has both, they cancel in the count: it can even read zero for a layout that is both loose and over-constrained. The rank of the constraint matrix tells them apart.",
    source: "Grübler–Kutzbach mobility criterion; Calladine, Int. J. Solids Struct. 14 (1978) (Maxwell's rule: b − 3j + 6 = s − m)",
    options: z.object({}),
    messages,
  },
  check({ analysis }) {
    const { counts } = analysis.constraint;
    if (counts.freedoms === 0 || counts.redundancies === 0) return [];
    return [
      {
        title: fill(messages.title, {
          grubler: counts.grubler,
          freedoms: `${counts.freedoms} freedom${counts.freedoms === 1 ? "" : "s"}`,
          redundancies: `${counts.redundancies} redundanc${counts.redundancies === 1 ? "y" : "ies"}`,
        }),
        body: [
          `Grübler–Kutzbach: 6 × ${counts.bodies} − ${counts.contacts} = **${counts.grubler}**. By rank: ${counts.contacts} contacts give rank ${counts.rank}, so **${counts.freedoms}** free and **${counts.redundancies}** redundant (${counts.freedoms} − ${counts.redundancies} = ${counts.grubler}).`,
          "",
          "Some contacts repeat what others already stop, while another direction is left open. See the free-motion and redundant-constraint findings for which.",
        ].join("\n"),
        keys: [`count:${counts.freedoms}-${counts.redundancies}`],
      },
    ];
  },
});
