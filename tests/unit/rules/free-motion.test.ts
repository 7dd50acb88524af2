/** free-motion: test table. */
import rule from "@/rules/free-motion";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { makeLayout } from "../../support/layouts";

const stool = makeLayout([
  { id: "a", p: [0, 0, 0], n: [0, 0, 1] },
  { id: "b", p: [300, 0, 0], n: [0, 0, 1] },
  { id: "c", p: [0, 200, 0], n: [0, 0, 1] },
]);
const stoolIntended3 = { ...stool, intendedFreedoms: 3 };

testRule(rule, {
  valid: [
    { name: "three-vee coupling (exactly constrained)", layout: example("mirror-cell-three-vee") },
    { name: "flexure stage: one freedom, one intended", layout: example("flexure-stage-one-freedom") },
    { name: "stool with three intended planar freedoms", layout: stoolIntended3 },
  ],
  invalid: [
    {
      name: "four feet leave x, y and rotation about z",
      layout: example("breadboard-four-feet"),
      findings: [
        {
          title: /3 free motions where 0 are intended/,
          body: [/translation along \+x/, /translation along \+y/, /rotation about axis \+z through \(300, 225, 0\) mm/, /Repair/],
        },
      ],
    },
    {
      name: "flexure stage locked out of intent by nothing, but with intent 0",
      layout: { ...example("flexure-stage-one-freedom"), intendedFreedoms: 0 },
      findings: [{ title: /1 free motion where 0 are intended/, body: [/translation along \+x/, /normal \(1, 0, 0\)/] }],
    },
  ],
});
