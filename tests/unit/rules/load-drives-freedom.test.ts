/** load-drives-freedom: test table. */
import rule from "@/rules/load-drives-freedom";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { plate, rawLayout } from "../../support/statics-layouts";

const sideLoad = rawLayout({
  bodies: [{ id: "plate" }],
  contacts: [
    [0, 0],
    [300, 0],
    [0, 200],
  ].map(([x, y], i) => ({ id: `S${i + 1}`, body: "plate", point: [x, y, 0], normal: [0, 0, 1] })),
  loads: [{ id: "push", body: "plate", force: [10, 0, -100], point: [100, 50, 0] }],
});

testRule(rule, {
  valid: [
    {
      name: "vertical load on a stool (x, y, rz free but not driven)",
      layout: plate(
        [
          [0, 0],
          [300, 0],
          [0, 200],
        ],
        [100, 50, 900],
      ),
    },
    { name: "three seats under gravity", layout: example("breadboard-three-seats") },
  ],
  invalid: [
    { name: "a sideways push on a stool drives the x translation", layout: sideLoad, findings: [{ title: /Case default: the load drives a free motion/ }] },
    {
      name: "load outside the triangle: a seat lifts and frees the part",
      layout: plate(
        [
          [0, 0],
          [300, 0],
          [0, 200],
        ],
        [200, -50, 900],
      ),
      findings: [{ title: /after S3 lifts off/, contacts: ["S3"] }],
    },
  ],
});
