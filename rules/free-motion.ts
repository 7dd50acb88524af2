/** free-motion: the layout leaves more degrees of freedom than it intends. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { motionTable, movingBodies } from "./describe";
import { stoppingContact } from "@/lib/analysis/motion";
import { dir, vec } from "@/lib/analysis/format";
import { unitLabel } from "@/lib/layout/units";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "{motions} where {intended} intended",
};

export default defineRule({
  meta: {
    id: "free-motion",
    severity: "error",
    summary: "Freedoms (6N − rank) exceed the layout's intended freedoms.",
    explanation:
      "Each body has six degrees of freedom; every independent contact removes one. The freedoms left are `6N − rank` of the constraint matrix. A freedom that the design does not intend lets the part wander under any load along it. Each free motion is shown as a screw: its axis, and a point and pitch where it turns.",
    source: "Screw theory: Ball, A Treatise on the Theory of Screws (1900); rank counting as in Hopkins & Culpepper, Precision Engineering 34 (2010)",
    options: z.object({}),
    messages,
  },
  check({ layout, analysis }) {
    const { counts, freeMotions } = analysis.constraint;
    if (counts.freedoms <= layout.intendedFreedoms) return [];
    const u = unitLabel(layout.units.length);
    const extra = counts.freedoms - layout.intendedFreedoms;
    const bodies = [...new Set(freeMotions.flatMap(movingBodies))].sort();
    const hints = freeMotions.map((m, i) => {
      const h = stoppingContact(layout, m);
      if (!h) return `${i + 1}. add a contact on a moving body along its motion`;
      const at = h.contact
        ? `at contact ${h.contact}${h.feature ? ` (feature ${h.feature})` : ""}, point ${vec(h.point, u)}`
        : `at the mass centre of ${h.body}, ${vec(h.point, u)}`;
      return `${i + 1}. a contact ${at}, normal ${dir(h.normal)}, between ${h.body} and ${h.on}`;
    });
    const intended = layout.intendedFreedoms ? ` The layout intends ${layout.intendedFreedoms}; ${extra} more must be stopped.` : "";
    return [
      {
        title: fill(messages.title, {
          motions: `${counts.freedoms} free motion${counts.freedoms === 1 ? "" : "s"}`,
          intended: `${layout.intendedFreedoms} ${layout.intendedFreedoms === 1 ? "is" : "are"}`,
        }),
        body: [
          `Rank ${counts.rank} of ${6 * counts.bodies} leaves **${counts.freedoms} degree${counts.freedoms === 1 ? "" : "s"} of freedom**.${intended}`,
          "",
          motionTable(freeMotions, layout.units.length),
          "",
          "**Repair.** A contact line that would stop each motion without adding a redundant constraint:",
          "",
          ...hints,
        ].join("\n"),
        bodies,
      },
    ];
  },
});
