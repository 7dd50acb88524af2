/** foundation-coupling: test table. */
import rule from "@/rules/foundation-coupling";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { plate } from "../../support/statics-layouts";

testRule(rule, {
  valid: [
    { name: "three seats: exactly constrained, S = 0", layout: example("breadboard-three-seats") },
    {
      name: "four very soft feet: 1 µm changes forces by less than 1 % of the mean",
      layout: plate(
        [
          [100, 100],
          [-100, 100],
          [-100, -100],
          [100, -100],
        ],
        [0, 0, 1000],
        10,
      ),
    },
  ],
  invalid: [
    {
      name: "four semi-firm feet: 10 N per µm against a 94 N mean seat force",
      layout: example("breadboard-four-feet"),
      findings: [{ title: /10 N per µm/, contacts: ["F1", "F2", "F3", "F4"], body: [/10\.6 % of the mean seated force|% of the mean seated force/] }],
    },
    {
      name: "six pads without stiffness: over-constrained, magnitude unknown",
      layout: example("detector-sled-hidden-count"),
      findings: [{ title: /over-constrained support/, contacts: ["P1", "P2", "P3", "P4"] }],
    },
  ],
});
