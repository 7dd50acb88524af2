/** point-repeatability: test table. */
import rule from "@/rules/point-repeatability";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { plate321Rows, rawLayout } from "../../support/statics-layouts";

/** A plate on six orthogonal rows (3-2-1), scatter s on each; the point sits at the origin stop. */
const plate = (s: number, allowance?: number) =>
  rawLayout({
    bodies: [{ id: "plate" }],
    defaultScatter: s,
    contacts: plate321Rows,
    points: [{ id: "probe", body: "plate", point: [0, 0, 0], ...(allowance ? { allowance } : {}) }],
  });

// at the origin only Z1, X1 and Y1 move the point, each one-to-one along its own axis: σ = s on every
// axis, the covariance is s² I, 3σ = 3 s; each of the three has a third of the variance (derived)
testRule(rule, {
  valid: [
    { name: "no scatter given", layout: example("mirror-cell-three-vee") },
    { name: "scatter but no functional point", layout: { ...plate(0.001), points: [] } },
  ],
  invalid: [
    {
      name: "1 µm scatter: σ 1 µm per axis, 3σ 3 µm",
      layout: plate(0.001),
      findings: [{ title: /3σ up to 3 µm/, body: [/\| probe \| \(1, 1, 1\) \| 3 µm \|/, /33\.3 %/] }],
    },
    {
      name: "3σ beyond a 2 µm allowance: warning",
      layout: plate(0.001, 0.002),
      findings: [{ title: /over the allowance at probe/, severity: "warning", body: [/\*\*over\*\*/] }],
    },
  ],
});
