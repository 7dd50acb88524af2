/** missing-data: test table. */
import rule from "@/rules/missing-data";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";

testRule(rule, {
  valid: [
    { name: "three seats with mass, stiffness and Hertz data", layout: example("breadboard-three-seats") },
    { name: "coupling with mass, loads and Hertz data", layout: example("instrument-plate-socket-vee-flat") },
  ],
  invalid: [
    {
      name: "four feet: no Hertz data, no stiffness magnitude issue (stiffness given)",
      layout: example("breadboard-four-feet"),
      findings: [{ body: [/Contact stress \(Hertz\)/] }],
    },
    {
      name: "six pads: no stiffness for an over-constrained support",
      layout: example("detector-sled-hidden-count"),
      findings: [{ body: [/Foundation coupling magnitude/, /Contact stress/] }],
    },
    {
      name: "stage without mass: seating skipped",
      layout: { ...example("flexure-stage-one-freedom"), bodies: [{ id: "carriage" }] },
      findings: [{ body: [/Seating/] }],
    },
  ],
});
