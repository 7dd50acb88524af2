/** contact-overstress: test table. */
import rule from "@/rules/contact-overstress";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import { rawLayout } from "../../support/statics-layouts";

// three Ø2 mm steel balls on aluminium flats under 3 kN: far above the aluminium allowable (440 MPa)
const crushed = rawLayout({
  bodies: [{ id: "plate" }],
  contacts: [
    [0, 0],
    [100, 0],
    [0, 100],
  ].map(([x, y], i) => ({
    id: `B${i + 1}`,
    body: "plate",
    point: [x, y, 0],
    normal: [0, 0, 1],
    hertz: {
      radii: [
        [1, 1],
        [null, null],
      ],
      angleDeg: 0,
      materials: ["bearing-steel", "aluminium-alloy"],
    },
  })),
  loads: [{ id: "P", body: "plate", force: [0, 0, -3000], point: [33.333, 33.333, 0] }],
});

testRule(rule, {
  valid: [
    { name: "breadboard seats (silicon nitride on steel)", layout: example("breadboard-three-seats") },
    { name: "mirror cell: steel balls under a light load", layout: example("mirror-cell-three-vee") },
  ],
  invalid: [
    // one finding per contact, the ellipse in the file's length unit (mm), every case in the table
    {
      name: "small balls on aluminium under 3 kN",
      layout: crushed,
      findings: [
        { title: /B1 at .* MPa exceeds 440 MPa \(load case default\)/, body: [/semi-axes \(mm\)/, /\| default \| [\d.]+ \| 440 \|/] },
        { title: /B2/ },
        { title: /B3/ },
      ],
    },
    {
      name: "two load cases that both exceed: one finding per contact, worst case first",
      layout: {
        ...crushed,
        loads: [...crushed.loads, { id: "Q", body: "plate", force: [0, 0, -6000], point: [33.333, 33.333, 0] }],
        loadCases: [
          { id: "light", gravity: [0, 0, -9.80665], loads: ["P"] },
          { id: "heavy", gravity: [0, 0, -9.80665], loads: ["P", "Q"] },
        ],
      },
      findings: [
        { title: /B1 at .* \(worst of 2 load cases: heavy\)/, contacts: ["B1"], body: [/\| heavy \|[^\n]*\n\| light \|/] },
        { title: /B2/ },
        { title: /B3/ },
      ],
    },
    {
      name: "a derate of 0.01 flags the breadboard seats",
      layout: example("breadboard-three-seats"),
      options: { derate: 0.01 },
      findings: [1, 2, 3, 4, 5, 6].map(() => ({ title: /exceeds/ })),
    },
  ],
});
