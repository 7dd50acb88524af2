/** thermal-drift: test table. */
import rule from "@/rules/thermal-drift";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { plate321Rows, rawLayout } from "../../support/statics-layouts";

/** A plate on three vertical seats and three horizontal stops, with materials; point 200 mm from the seats. */
const plate = (allowance?: number, swing?: number) =>
  rawLayout({
    bodies: [{ id: "plate", material: "aluminium-alloy" }],
    groundMaterial: "bearing-steel",
    ...(swing ? { temperatureSwing: swing } : {}),
    contacts: plate321Rows,
    points: [{ id: "lens", body: "plate", point: [200, 0, 0], ...(allowance ? { allowance } : {}) }],
  });

// the corner stop X1/Y1 fixes the origin: a point 200 mm away drifts by Δα·200 mm per K
// = (23.6 − 11.9)e-6 · 200 mm = 2.34 µm/K (derived from linear expansion; built-in coefficients are values from memory)
testRule(rule, {
  valid: [
    { name: "no materials: no thermal results", layout: example("detector-sled-hidden-count") },
    { name: "a body without a material: no thermal results", layout: { ...example("mirror-cell-three-vee"), bodies: [{ id: "mirror-cell" }] } },
  ],
  invalid: [
    {
      name: "drift listed per K and over 1 K without a swing",
      layout: plate(),
      findings: [{ title: /up to 2\.34 µm\/K/, body: [/\| plate \| \(0, 0, 0\) mm \|/, /\| lens \| \(2\.34, 0, 0\)/] }],
    },
    { name: "drift over a 5 K swing within a 0.02 mm allowance: info", layout: plate(0.02, 5), findings: [{ title: /up to 2\.34 µm\/K/, body: [/11\.7 µm/] }] },
    {
      name: "drift over a 5 K swing beyond a 0.01 mm allowance: warning",
      layout: plate(0.01, 5),
      findings: [{ title: /over the allowance at lens/, severity: "warning", body: [/11\.7 µm \*\*over\*\*/] }],
    },
  ],
});
