/** count-mismatch: test table. */
import rule from "@/rules/count-mismatch";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";

testRule(rule, {
  valid: [
    { name: "exactly constrained coupling", layout: example("mirror-cell-three-vee") },
    { name: "free but not redundant (stage)", layout: example("flexure-stage-one-freedom") },
  ],
  invalid: [
    {
      name: "six pads: the count reads 0 but 1 free and 1 redundant",
      layout: example("detector-sled-hidden-count"),
      findings: [{ title: /6N − m = 0 hides 1 freedom and 1 redundancy/, body: [/6 × 1 − 6 = \*\*0\*\*/] }],
    },
    { name: "four feet: count 2 = 3 − 1", layout: example("breadboard-four-feet"), findings: [{ title: /= 2 hides 3 freedoms and 1 redundancy/ }] },
  ],
});
