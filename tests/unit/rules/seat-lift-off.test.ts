/** seat-lift-off: test table. */
import rule from "@/rules/seat-lift-off";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { plate } from "../../support/statics-layouts";

testRule(rule, {
  valid: [
    {
      name: "centred load on four springs",
      layout: plate(
        [
          [100, 100],
          [-100, 100],
          [-100, -100],
          [100, -100],
        ],
        [0, 0, 1000],
        1e4,
      ),
    },
    { name: "mirror cell under gravity", layout: example("mirror-cell-three-vee") },
  ],
  invalid: [
    {
      name: "load near one corner of four springs: the far corner lifts",
      layout: plate(
        [
          [100, 100],
          [-100, 100],
          [-100, -100],
          [100, -100],
        ],
        [90, 60, 1000],
        1e4,
      ),
      findings: [{ title: /Case default: S3 lifts off/, contacts: ["S3"] }],
    },
    {
      name: "instrument plate: lateral shipping and inverted cases lift seats",
      layout: example("instrument-plate-socket-vee-flat"),
      findings: [{ title: /shipping-lateral-2g/ }, { title: /inverted: flat lifts off/, contacts: ["flat"] }],
    },
  ],
});
