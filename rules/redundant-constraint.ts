/** redundant-constraint: a self-stress state exists (one finding per state of the canonical basis). */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { featuresOf, largestRows, listIds, rowLabel, rowNames } from "./describe";
import { num } from "@/lib/analysis/format";

/** Rows of the coefficient table in a finding (the pivot and the largest coefficients). */
const TABLE_ROWS = 40;

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
      const feature = new Map(layout.contacts.map((k) => [k.id, k.feature]));
      // a loop through a whole instrument can hold thousands of contacts: the table keeps the pivot and the
      // largest coefficients (in contact order), the report's selfStress keeps them all
      const shown = new Set(largestRows(contacts, (c) => (c === state.pivot ? Infinity : state.forces[c]), TABLE_ROWS));
      for (const c of contacts) if (shown.has(c)) table.push(`| ${rowLabel(layout, c)} | ${feature.get(c) ?? "—"} | ${num(state.forces[c])} |`);
      const hidden = contacts.length - shown.size;
      const listed = listIds(contacts);
      return {
        title: fill(messages.title, {
          pivot: pivotName,
          others: others.length > 8 ? `${others.slice(0, 6).join(", ")} and ${others.length - 6} more` : others.join(", ") || "itself",
        }),
        body: [
          `These contact forces (per unit force at the pivot ${state.pivot}) balance each other with no load, so a misfit or a deforming base locks them into the part.${selfStressDimension > selfStress.length ? ` (${selfStressDimension} states in all; the first ${selfStress.length} are listed.)` : ""}`,
          "",
          table.join("\n"),
          ...(hidden > 0 ? ["", `${hidden} more contacts with smaller coefficients are in the report (selfStress).`] : []),
          "",
          `**Repair.** Removing any one of ${listed} ends this loop without adding a free motion${features.length ? ` (features ${features.join(", ")})` : ""}; so does making one of them compliant along its normal.`,
        ].join("\n"),
        contacts: contacts.slice().sort(),
        features,
        pivot: state.pivot,
      };
    });
  },
});
