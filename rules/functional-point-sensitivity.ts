/** functional-point-sensitivity: the error motion of each functional point per µm of support rise and under load. */
import { z } from "zod";
import { defineRule, fill } from "./types";
import { num, vec } from "@/lib/analysis/format";

/** Message templates: {name} is filled with the finding's values (`fill`, rules/types.ts). */
const messages = {
  title: "{point}: up to {motion} µm per µm of support rise",
};

export default defineRule({
  meta: {
    id: "functional-point-sensitivity",
    severity: "info",
    summary: "How far each functional point moves per µm rise of each support, and under the seated load.",
    explanation:
      "A functional point (an optic vertex, a probe tip) moves with its body. For a 1 µm rise of one ground support the body moves by u = (JᵀKJ)⁺JᵀK d (rigidly when the support is exactly constrained, whatever the stiffness); under the seated load it sinks by the contact compliance (secant stiffness F/δ for Hertz contacts). The table gives the point's displacement for each.",
    source: "Rigid-body kinematics of the twist (v + ω × p); stiffness method for the compliant support",
    options: z.object({}),
    messages,
  },
  check({ analysis }) {
    const entries = Object.entries(analysis.statics.points);
    if (!entries.length) return [];
    return entries.map(([id, pm]) => {
      const rows = ["| support rises 1 µm | point moves (µm) | magnitude (µm) |", "|---|---|---|"];
      let worst = 0;
      for (const [g, d] of Object.entries(pm.perMicrometre)) {
        const mag = Math.hypot(...d);
        worst = Math.max(worst, mag);
        rows.push(`| ${g} | ${vec(d)} | ${num(mag)} |`);
      }
      const seated = pm.seatedUm
        ? `Under the seated load (first load case) the point moves ${vec(pm.seatedUm, "µm")}.`
        : "The seated displacement needs contact stiffness (file or Hertz data) and a load.";
      return {
        title: fill(messages.title, { point: id, motion: num(worst) }),
        body: [`Functional point **${id}** on ${pm.body}.`, "", rows.join("\n"), "", seated].join("\n"),
        bodies: [pm.body],
        keys: [`point:${id}`],
      };
    });
  },
});
