/** weak-constraint: test table. */
import rule from "@/rules/weak-constraint";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { makeLayout } from "../../support/layouts";

// three vees whose seats nearly coincide: rotation about the vertical is held by a 1 mm lever
const cramped = makeLayout(
  [0, 120, 240]
    .flatMap((deg, i) => {
      const a = (deg * Math.PI) / 180;
      const c = [Math.cos(a), Math.sin(a)];
      const h = [-c[1], c[0]];
      return [1, -1].map((s, j) => ({
        id: `V${i + 1}${"ab"[j]}`,
        p: [c[0] + s * h[0] * 0.7, c[1] + s * h[1] * 0.7, -0.7] as [number, number, number],
        n: [-s * h[0] * 0.7, -s * h[1] * 0.7, 0.7] as [number, number, number],
      }));
    })
    .concat([{ id: "W", p: [200, 0, 0], n: [0, 0, 1] }]),
);

testRule(rule, {
  valid: [
    { name: "three radial vees", layout: example("mirror-cell-three-vee") },
    { name: "threshold lowered below the layout's conditioning", layout: example("breadboard-four-feet"), options: { threshold: 0.5 } },
  ],
  invalid: [
    {
      name: "threshold above the layout's conditioning (0.6)",
      layout: example("breadboard-four-feet"),
      options: { threshold: 0.7 },
      findings: [{ title: /conditioning 0.6 is below 0.7/ }],
    },
    { name: "seats crowded together", layout: cramped, findings: [{ title: /Weakly held/, body: [/least-constrained direction/] }] },
  ],
});
