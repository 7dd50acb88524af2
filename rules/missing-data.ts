/** missing-data: a check was skipped because the layout lacks mass, loads, stiffness, Hertz, material or scatter data. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { GROUND } from "@/lib/layout/model";
import { hertzUsable } from "@/lib/analysis/statics";
import { expansionCoefficients } from "@/lib/analysis/thermal";

/** Ids listed in full up to this many; beyond, only the count. */
const LISTED = 12;
const list = (ids: string[]) => (ids.length <= LISTED ? ` (${ids.join(", ")})` : "");

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "{checks} skipped for lack of data",
};

export default defineRule({
  meta: {
    id: "missing-data",
    severity: "info",
    summary: "A check was skipped for lack of mass, loads, stiffness, Hertz, material or scatter data.",
    explanation:
      "Counting needs only points and normals. Seating needs a mass or a load; load sharing and foundation coupling of an over-constrained support need contact stiffness (from the file, from flexure sections or from Hertz data); contact stress needs Hertz data with Young's modulus and Poisson's ratio of both materials; the temperature analysis needs an expansion coefficient for the ground and every body; repeatability needs seat scatter. This finding lists what was skipped so that a clean report is not mistaken for a complete one.",
    source: "common practice (review completeness)",
    options: z.object({}),
    messages,
  },
  check({ layout, analysis }) {
    // each entry: a stable key (part of the fingerprint, never reworded) and its sentence
    const skipped: { key: string; text: string }[] = [];
    const hasMass = layout.bodies.some((b) => b.mass !== undefined);
    if (!hasMass && layout.loads.length === 0) skipped.push({ key: "Seating", text: "**Seating** — no body has a mass and there are no loads." });
    const seats = layout.contacts.filter((c) => !c.flexure);
    const noHertz = seats.filter((c) => !c.hertz).map((c) => c.id);
    if (seats.length && noHertz.length) {
      skipped.push({
        key: "Contact stress (Hertz)",
        text: `**Contact stress (Hertz)** — ${noHertz.length} of ${seats.length} contacts have no Hertz data${list(noHertz)}.`,
      });
    }
    const unusable = seats.filter((c) => c.hertz && !hertzUsable(layout, c)).map((c) => c.id);
    if (unusable.length) {
      skipped.push({
        key: "hertz-materials",
        text: `**Contact stress (Hertz)** — ${unusable.length} contacts name a material without Young's modulus or Poisson's ratio${list(unusable)}.`,
      });
    }
    const rows = layout.contacts;
    const unstiff = rows.filter((c) => c.stiffness === undefined).map((c) => c.id);
    if (unstiff.length && unstiff.length < rows.length) {
      skipped.push({
        key: "row-stiffness",
        text: `**File and flexure stiffness** — ${unstiff.length} of ${rows.length} rows have none${list(unstiff)}, so no row's own stiffness is used (Hertz data or equal stiffness instead).`,
      });
    }
    const allStiff = rows.length > 0 && unstiff.length === 0;
    const allHertz = rows.length > 0 && rows.every((c) => hertzUsable(layout, c));
    if (analysis.constraint.counts.redundancies > 0 && !allStiff && !allHertz) {
      skipped.push({
        key: "Foundation coupling magnitude",
        text: "**Foundation coupling magnitude** — the support is over-constrained but not every contact has a stiffness or Hertz data.",
      });
    }
    const someMaterial = layout.groundMaterial !== undefined || layout.bodies.some((b) => b.material !== undefined);
    if (someMaterial) {
      const { missing } = expansionCoefficients(layout);
      if (missing.length) {
        const named = missing.map((id) => (id === GROUND ? "the ground (groundMaterial)" : id));
        skipped.push({ key: "thermal", text: `**Temperature** — no expansion coefficient for ${named.join(", ")}.` });
      }
    }
    const scatterGiven = layout.defaultScatter !== undefined || rows.some((c) => c.scatter !== undefined);
    if (!scatterGiven && layout.points.some((p) => p.allowance !== undefined)) {
      skipped.push({
        key: "repeatability",
        text: "**Repeatability** — functional points have an allowance but no contact or flexure gives a scatter (nor defaultScatter).",
      });
    }
    if (!skipped.length) return [];
    return [
      {
        title: fill(messages.title, { checks: `${skipped.length} check${skipped.length === 1 ? "" : "s"}` }),
        body: ["Not checked:", "", ...skipped.map((s) => `- ${s.text}`)].join("\n"),
        keys: skipped.map((s) => s.key),
      },
    ];
  },
});
