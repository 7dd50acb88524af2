/** missing-data: a check was skipped because the layout lacks mass, loads, stiffness or Hertz data. */
import { z } from "zod";
import { defineRule } from "./types";

export default defineRule({
  meta: {
    id: "missing-data",
    severity: "info",
    summary: "A check was skipped for lack of mass, loads, stiffness or Hertz data.",
    explanation:
      "Counting needs only points and normals. Seating needs a mass or a load; load sharing and foundation coupling of an over-constrained support need contact stiffness (from the file or from Hertz data); contact stress needs Hertz data. This finding lists what was skipped so that a clean report is not mistaken for a complete one.",
    source: "common practice (review completeness)",
    options: z.object({}),
  },
  check({ layout, analysis }) {
    const skipped: string[] = [];
    const hasMass = layout.bodies.some((b) => b.mass !== undefined);
    if (!hasMass && layout.loads.length === 0) skipped.push("**Seating** — no body has a mass and there are no loads.");
    const noHertz = layout.contacts.filter((c) => !c.hertz).map((c) => c.id);
    if (layout.contacts.length && noHertz.length) {
      skipped.push(`**Contact stress (Hertz)** — ${noHertz.length} of ${layout.contacts.length} contacts have no Hertz data${noHertz.length <= 12 ? ` (${noHertz.join(", ")})` : ""}.`);
    }
    const allStiff = layout.contacts.length > 0 && layout.contacts.every((c) => c.stiffness !== undefined);
    const allHertz = layout.contacts.length > 0 && noHertz.length === 0;
    if (analysis.constraint.counts.redundancies > 0 && !allStiff && !allHertz) {
      skipped.push("**Foundation coupling magnitude** — the support is over-constrained but not every contact has a stiffness or Hertz data.");
    }
    if (!skipped.length) return [];
    return [
      {
        title: `${skipped.length} check${skipped.length === 1 ? "" : "s"} skipped for lack of data`,
        body: ["Not checked:", "", ...skipped.map((s) => `- ${s}`)].join("\n"),
        keys: skipped.map((s) => s.slice(2, s.indexOf("**", 2))),
      },
    ];
  },
});
