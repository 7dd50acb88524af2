/** redundant-constraint: a self-stress state exists (one finding per state of the canonical basis). */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { featuresOf, rowLabel, rowNames } from "./describe";
import { num } from "@/lib/analysis/format";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "Over-constrained loop: {pivot} fights {others}",
};

export default defineRule({
  meta: {
    id: "redundant-constraint",
    severity: "error",
    summary: "An over-constrained loop: contact forces that can balance each other with no load.",
    explanation:
      "A self-stress state is a set of contact forces in equilibrium with no external load (the left null space of the constraint matrix). Any misfit of the part or any deformation of the base drives such forces: the part is stressed, its shape follows the base, and the seats wear. Each state is listed in the canonical basis (reduced row-echelon form over sorted contact ids): the pivot contact and the contacts that fight it.",
    source: "Maxwell's rule with Calladine's correction, Int. J. Solids Struct. 14 (1978); Pellegrino & Calladine, IJSS 22 (1986)",
    options: z.object({}),
    messages,
  },
  check({ layout, analysis }) {
    const { selfStress, selfStressDimension } = analysis.constraint;
    return selfStress.map((state) => {
      const contacts = Object.keys(state.forces);
      const [pivotName] = rowNames(layout, [state.pivot]);
      const others = rowNames(layout, contacts).filter((c) => c !== pivotName);
      const features = featuresOf(layout, contacts);
      const table = ["| contact | feature | coefficient |", "|---|---|---|"];
      for (const c of contacts) {
        const f = layout.contacts.find((k) => k.id === c)?.feature ?? "—";
        table.push(`| ${rowLabel(layout, c)} | ${f} | ${num(state.forces[c])} |`);
      }
      return {
        title: fill(messages.title, {
          pivot: pivotName,
          others: others.length > 8 ? `${others.slice(0, 6).join(", ")} and ${others.length - 6} more` : others.join(", ") || "itself",
        }),
        body: [
          `These contact forces (per unit force at the pivot ${state.pivot}) balance each other with no load, so a misfit or a deforming base locks them into the part.${selfStressDimension > selfStress.length ? ` (${selfStressDimension} states in all; the first ${selfStress.length} are listed.)` : ""}`,
          "",
          table.join("\n"),
          "",
          `**Repair.** Removing any one of ${contacts.join(", ")} ends this loop without adding a free motion${features.length ? ` (features ${features.join(", ")})` : ""}; so does making one of them compliant along its normal.`,
        ].join("\n"),
        contacts: contacts.slice().sort(),
        features,
        pivot: state.pivot,
      };
    });
  },
});
