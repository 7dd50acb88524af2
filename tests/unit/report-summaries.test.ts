/** Report summaries: seating over every load case states the worst case; the service sections carry their numbers with units. */
import { describe, expect, it } from "vitest";
import { runEngine } from "@/lib/engine";
import { summariseLoadCases } from "@/lib/report/load-case-summary";
import { serviceSections } from "@/lib/report/service-sections";
import { example } from "../support/examples";

describe("seating summary over load cases", () => {
  it("the instrument plate is not held in two of three cases: the summary says so, not the first case's margin", () => {
    const s = summariseLoadCases(runEngine(example("instrument-plate-socket-vee-flat")).report)!;
    expect(s.notHeld).toEqual(["shipping-lateral-2g", "inverted"]);
    expect(s.text).toMatch(/^Seating over 3 load cases: not held in 2 of 3 \(shipping-lateral-2g, inverted\); smallest seating margin [\d.]+ in operating\.$/);
  });

  it("a layout held in every case says so", () => {
    expect(summariseLoadCases(runEngine(example("breadboard-three-seats")).report)!.text).toMatch(
      /^Seating over 1 load case: held in all 1; smallest seating margin/,
    );
  });

  it("no load: no summary", () => {
    const l = example("mirror-cell-three-vee");
    l.bodies = l.bodies.map((b) => ({ id: b.id, material: b.material }));
    expect(summariseLoadCases(runEngine(l).report)).toBeNull();
  });
});

describe("service sections", () => {
  it("flexures, temperature and repeatability with units", () => {
    const md = serviceSections(runEngine(example("instrument-plate-socket-vee-flat")).report).join("\n");
    expect(md).toMatch(/## Temperature/);
    expect(md).toMatch(/\| body \| thermal centre \(mm\) \|/);
    expect(md).toMatch(/over 2 K \(µm\)/);
    expect(md).toMatch(/## Repeatability[\s\S]*\| alignment-mark \|/);
    const stage = serviceSections(runEngine(example("flexure-stage-full-blades")).report).join("\n");
    expect(stage).toMatch(/\| blade-A \| blade \| blade-A\.a, blade-A\.b, blade-A\.s \|/);
  });
});
