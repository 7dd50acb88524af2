/** low-seating-margin: test table. */
import rule from "@/rules/low-seating-margin";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { plate } from "../../support/statics-layouts";

testRule(rule, {
  valid: [
    {
      name: "centred load on a stool",
      layout: plate(
        [
          [0, 0],
          [300, 0],
          [0, 200],
        ],
        [100, 66.667, 900],
      ),
    },
    {
      name: "margin 0.025 passes a 0.02 threshold",
      layout: plate(
        [
          [0, 0],
          [300, 0],
          [0, 200],
        ],
        [20, 185, 900],
      ),
      options: { threshold: 0.02 },
    },
  ],
  invalid: [
    // lever rule at (20, 185): S1 = 900 (1 − 20/300 − 185/200) = 7.5 N against a mean of 300 N → margin 0.025 [D]
    {
      name: "load close to the S2–S3 edge: S1 carries little",
      layout: plate(
        [
          [0, 0],
          [300, 0],
          [0, 200],
        ],
        [20, 185, 900],
      ),
      findings: [{ title: /seating margin .* at S1/, contacts: ["S1"] }],
    },
    { name: "six pads: side pads carry nothing under gravity", layout: example("detector-sled-hidden-count"), findings: [{ title: /seating margin 0 at/ }] },
  ],
});
