/** coupling-geometry: test table. */
import rule from "@/rules/coupling-geometry";
import { testRule } from "../../support/rule-tester";
import { example } from "../../support/examples";
import type { Layout } from "@/lib/layout/model";

/** The mirror cell with its first vee turned 90° (groove across the bisector). */
function turnedVee(): Layout {
  const l = example("mirror-cell-three-vee");
  const [a, b] = l.contacts.filter((c) => c.feature === "V1");
  // V1 sits at (0, 80): its radial groove runs along y; rotate the flanks to face ±y instead of ±x
  for (const c of [a, b]) {
    const [nx, , nz] = c.normal;
    c.normal = [0, nx, nz];
    const dx = c.point[0];
    c.point = [0, 80 + dx, c.point[2]];
  }
  return l;
}

testRule(rule, {
  valid: [
    { name: "three radial vees", layout: example("mirror-cell-three-vee") },
    { name: "socket–vee–flat with the vee towards the socket", layout: example("instrument-plate-socket-vee-flat") },
  ],
  invalid: [
    {
      name: "one vee laid across its bisector",
      layout: turnedVee(),
      findings: [{ title: /V1 90° off/, contacts: ["V1a", "V1b"], body: [/bisector/, /Contact angles: .*45°/] }],
    },
  ],
});
