/** functional-point-sensitivity: test table. */
import rule from "@/rules/functional-point-sensitivity";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { plate } from "../../support/statics-layouts";

// a point in the plane of a stool's feet, at the centroid: each foot's 1 µm rise lifts it by 1/3 µm [D]
const stool = plate(
  [
    [0, 0],
    [300, 0],
    [0, 300],
  ],
  undefined,
  undefined,
  { points: [{ id: "tip", body: "plate", point: [100, 100, 0] }] },
);

testRule(rule, {
  valid: [{ name: "no functional points", layout: example("detector-sled-hidden-count") }],
  invalid: [
    {
      name: "stool: the centroid rises a third of a foot's rise",
      layout: stool,
      findings: [{ title: /tip: up to 0.3333 µm per µm/, body: [/\| S1 \| \(0, 0, 0.3333\) \| 0.3333 \|/] }],
    },
    { name: "breadboard on four feet", layout: example("breadboard-four-feet"), findings: [{ title: /beam-splitter/, body: [/Under the seated load .* µm/] }] },
  ],
});
