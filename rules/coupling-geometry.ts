/** coupling-geometry: a vee's groove axis is off its guideline; contact angles reported. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { num } from "@/lib/analysis/format";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "{kind} coupling of {body}: {offsets} off",
};

export default defineRule({
  meta: {
    id: "coupling-geometry",
    severity: "info",
    summary: "A vee groove is laid more than the threshold off its guideline (bisector, or line to the socket).",
    explanation:
      "In a three-vee coupling each groove should lie along the bisector of the coupling triangle's angle at its seat; laid across it, the coupling can turn about the vertical. In a socket–vee–flat coupling the vee should point at the socket. Couplings are recognised from feature groups (two contacts a vee, three a socket, one a flat); the seat centre is the mean of its contact points. Contact angles (normal against the triangle plane's normal; 45° is the usual choice) are listed.",
    source:
      "Slocum, Precision Machine Design (1992), kinematic coupling design; Slocum, Precision Engineering 14 (1992) 'Design of three-groove kinematic couplings'",
    options: z.object({ maxOffDeg: z.number().positive().max(90).default(10) }),
    messages,
  },
  check({ analysis, options }) {
    const out = [];
    for (const cp of analysis.couplings) {
      const off = cp.seats.filter((s) => s.grooveOffDeg !== undefined && s.grooveOffDeg > options.maxOffDeg);
      if (!off.length) continue;
      const angles = Object.entries(cp.contactAnglesDeg)
        .map(([id, a]) => `${id} ${num(a, 3)}°`)
        .join(", ");
      out.push({
        title: fill(messages.title, {
          kind: cp.kind === "three-vee" ? "Three-vee" : "Socket–vee–flat",
          body: cp.body,
          offsets: off.map((s) => `${s.feature} ${num(s.grooveOffDeg!, 3)}°`).join(", "),
        }),
        body: [
          ...off.map((s) => `- vee **${s.feature}**: groove axis ${num(s.grooveOffDeg!, 3)}° off the ${s.guideline} (threshold ${options.maxOffDeg}°)`),
          "",
          `Contact angles: ${angles}.`,
        ].join("\n"),
        contacts: off.flatMap((s) => s.contacts).sort(),
        features: off.map((s) => s.feature).sort(),
        bodies: [cp.body],
      });
    }
    return out;
  },
});
