/** thermal-mismatch: test table. */
import rule from "@/rules/thermal-mismatch";
import { testRule } from "../../support/rule-tester";
import { rawLayout } from "../../support/statics-layouts";

/** A bar between two x stops (k each) held otherwise by bilateral rows; optional mass for a seated state. */
const bar = (k: number | undefined, alphaBar: number, mass?: number) =>
  rawLayout({
    bodies: [{ id: "bar", material: "bar-mat", ...(mass ? { mass, centerOfMass: [200, 0, 0] } : {}) }],
    materials: [
      { id: "bar-mat", expansionPerK: alphaBar },
      { id: "base-mat", expansionPerK: 11.6e-6 },
    ],
    groundMaterial: "base-mat",
    contacts: [
      { id: "L", body: "bar", point: [0, 0, 0], normal: [1, 0, 0], sense: "bilateral" },
      { id: "R", body: "bar", point: [400, 0, 0], normal: [-1, 0, 0], sense: "bilateral" },
      { id: "Z1", body: "bar", point: [0, 0, 0], normal: [0, 0, 1] },
      { id: "Z2", body: "bar", point: [400, 0, 0], normal: [0, 0, 1] },
      { id: "Z3", body: "bar", point: [200, 40, 0], normal: [0, 0, 1] },
      { id: "Y1", body: "bar", point: [0, 0, 0], normal: [0, 1, 0], sense: "bilateral" },
      { id: "Y2", body: "bar", point: [400, 0, 0], normal: [0, 1, 0], sense: "bilateral" },
    ].map((c) => (k ? { ...c, stiffness: k } : c)),
  });

// 20 000 N/mm stops, ℓ 400 mm, Δα 11.6e-6 /K → 46.4 N/K (Hooke's law, derived; reference-checks.md)
testRule(rule, {
  valid: [
    { name: "same expansion as the base: nothing to fight", layout: bar(20000, 11.6e-6) },
    { name: "tiny force against a heavy seated bar (below 1 %)", layout: bar(20000, 11.6000001e-6, 500) },
  ],
  invalid: [
    {
      name: "bar between two stops: 46.4 N/K",
      layout: bar(20000, 23.2e-6),
      findings: [{ title: /up to 46\.4 N\/K at L, R/, contacts: ["L", "R"], body: [/\| L \| 46\.4 \|/] }],
    },
    {
      name: "equal stiffness assumed: the loop is named without a magnitude",
      layout: bar(undefined, 23.2e-6),
      findings: [{ title: /fought by L, R/, body: [/not computed/] }],
    },
  ],
});
