/** redundant-constraint: test table (one finding per canonical self-stress state). */
import rule from "@/rules/redundant-constraint";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { makeLayout } from "../../support/layouts";

const twoTables = makeLayout([
  ...[
    [0, 0],
    [100, 0],
    [100, 100],
    [0, 100],
    [50, 50],
  ].map(([x, y], i) => ({ id: `T${i + 1}`, p: [x, y, 0] as [number, number, number], n: [0, 0, 1] as [number, number, number] })),
]);

testRule(rule, {
  valid: [
    { name: "socket–vee–flat coupling", layout: example("instrument-plate-socket-vee-flat") },
    { name: "flexure stage with a narrowed blade", layout: example("flexure-stage-one-freedom") },
  ],
  invalid: [
    {
      name: "four feet: one loop, pivot F1 fights F2, F3, F4",
      layout: example("breadboard-four-feet"),
      findings: [
        {
          title: /F1 fights F2, F3, F4/,
          contacts: ["F1", "F2", "F3", "F4"],
          pivot: "F1",
          body: [/\| F2 \| foot-2 \| -1 \|/, /Removing any one of F1, F2, F3, F4/],
        },
      ],
    },
    {
      // Σλ = Σλx = Σλy = 0 with λ_T1 = 1, λ_T2 = 0 gives (T1, T3, T5) = (1, 1, −2); with λ_T1 = 0, λ_T2 = 1 gives (T2, T4, T5) = (1, 1, −2) [D]
      name: "five vertical legs: two states in row-echelon form",
      layout: twoTables,
      findings: [
        { pivot: "T1", contacts: ["T1", "T3", "T5"], body: [/\| T3 \| — \| 1 \|/, /\| T5 \| — \| -2 \|/] },
        { pivot: "T2", contacts: ["T2", "T4", "T5"], body: [/\| T4 \| — \| 1 \|/, /\| T5 \| — \| -2 \|/] },
      ],
    },
  ],
});
