/**
 * Flexure elements (analysis.md §10): expansion into rows, counts of classic arrangements, stiffness
 * from the section, equivalence with hand-written rows, and JSON/XML agreement. Sources beside each check.
 */
import { describe, expect, it } from "vitest";
import { runEngine } from "@/lib/engine";
import { parseLayoutText } from "@/lib/layout";
import { toXml } from "@/lib/layout/serialize";
import { flexureStiffness } from "@/lib/layout/flexures";
import type { Layout, Vec3 } from "@/lib/layout/model";
import { rawLayout } from "../support/statics-layouts";

const blade = (id: string, root: Vec3, tip: Vec3, extra: Record<string, unknown> = {}) => ({
  id,
  kind: "blade",
  body: "stage",
  root,
  tip,
  widthDirection: [0, 1, 0],
  width: 25,
  thickness: 0.3,
  material: "spring-steel",
  ...extra,
});
const materials = [{ id: "spring-steel", youngsModulusGPa: 200 }];

describe("flexure counts", () => {
  // one blade constrains the three motions in its plane and leaves three free (freedom and constraint
  // topologies, Hopkins & Culpepper, Precision Engineering 34, 2010)
  it("one blade: 3 constraints, 3 freedoms", () => {
    const { report } = runEngine(rawLayout({ bodies: [{ id: "stage" }], materials, contacts: [], flexures: [blade("leaf", [0, 0, 0], [0, 0, 40])] }));
    expect(report.counts).toMatchObject({ contacts: 3, rank: 3, freedoms: 3, redundancies: 0 });
    expect(report.flexures).toEqual([{ id: "leaf", kind: "blade", rows: ["leaf.a", "leaf.b", "leaf.s"] }]);
  });

  // two parallel identical blades: the parallel-spring guide, one translation normal to the blades [C
  // qualitative]; one redundancy (both blades constrain the same in-plane rotation) [D]
  it("two parallel blades: 1 freedom (translation normal to the blades), 1 redundancy", () => {
    const { report } = runEngine(
      rawLayout({
        bodies: [{ id: "stage" }],
        materials,
        contacts: [],
        flexures: [blade("front", [0, 0, 0], [0, 0, 40]), blade("back", [60, 0, 0], [60, 0, 40])],
      }),
    );
    expect(report.counts).toMatchObject({ rank: 5, freedoms: 1, redundancies: 1 });
    const s = report.freeMotions[0].screws.stage;
    expect(s.kind).toBe("translation");
    expect(Math.abs(s.direction![0])).toBeCloseTo(1, 9);
    const loop = report.findings.find((f) => f.rule === "redundant-constraint")!;
    expect(loop.title).toMatch(/back fights front|front fights back/);
  });

  // six wires of a hexapod (Stewart platform) constrain all six freedoms [C]
  it("six inclined wires in a hexapod: exactly constrained", () => {
    const wires = [0, 1, 2, 3, 4, 5].map((i) => {
      const base = ((Math.floor(i / 2) * 120 + (i % 2 ? 15 : -15)) * Math.PI) / 180;
      const top = ((Math.floor(i / 2) * 120 + (i % 2 ? 60 : -60)) * Math.PI) / 180;
      return {
        id: `w${i + 1}`,
        kind: "wire",
        body: "platform",
        from: [100 * Math.cos(base), 100 * Math.sin(base), 0],
        to: [60 * Math.cos(top), 60 * Math.sin(top), 80],
        diameter: 1,
        material: "spring-steel",
      };
    });
    const { report } = runEngine(rawLayout({ bodies: [{ id: "platform" }], materials, contacts: [], flexures: wires }));
    expect(report.counts).toMatchObject({ contacts: 6, rank: 6, freedoms: 0, redundancies: 0 });
  });
});

describe("flexure stiffness", () => {
  // axial stiffness EA/ℓ (elementary strength of materials); in-plane 12EI/ℓ³ of a beam clamped at both
  // ends with one end guided (Roark's Formulas for Stress and Strain, beam table for a guided end),
  // I = t w³/12 → E t w³/ℓ³
  it("wire EA/ℓ, blade axial E·w·t/(2ℓ) each and in-plane E·t·w³/ℓ³ (file units: N/mm)", () => {
    const l = rawLayout({ bodies: [{ id: "stage" }], materials, contacts: [], flexures: [blade("leaf", [0, 0, 0], [0, 0, 40])] });
    const E = 200e9;
    const [w, t, ell] = [25e-3, 0.3e-3, 40e-3];
    const k = flexureStiffness(l, l.flexures![0])!;
    expect(k[0]).toBeCloseTo(((E * w * t) / (2 * ell)) * 1e-3, 6);
    expect(k[1]).toBeCloseTo(k[0], 12);
    expect(k[2]).toBeCloseTo(((E * t * w ** 3) / ell ** 3) * 1e-3, 6);
    const wire = rawLayout({
      bodies: [{ id: "s" }],
      materials,
      contacts: [],
      flexures: [{ id: "w", kind: "wire", body: "s", from: [0, 0, 0], to: [0, 0, 50], diameter: 0.5, material: "spring-steel" }],
    });
    expect(flexureStiffness(wire, wire.flexures![0])![0]).toBeCloseTo(((E * Math.PI * 0.5e-3 ** 2) / 4 / 50e-3) * 1e-3, 6);
  });

  it("unit conversion round-trips: the same wire in inches and lbf gives the same stiffness in SI", () => {
    const inch = 25.4;
    const lbf = 4.4482216152605;
    const mm = rawLayout({
      bodies: [{ id: "s" }],
      materials,
      contacts: [],
      flexures: [{ id: "w", kind: "wire", body: "s", from: [0, 0, 0], to: [0, 0, 50.8], diameter: 0.508, material: "spring-steel" }],
    });
    const ins = rawLayout({
      units: { length: "in", force: "lbf" },
      bodies: [{ id: "s" }],
      materials,
      contacts: [],
      flexures: [{ id: "w", kind: "wire", body: "s", from: [0, 0, 0], to: [0, 0, 2], diameter: 0.02, material: "spring-steel" }],
    });
    const kMm = flexureStiffness(mm, mm.flexures![0])![0] * 1e3; // N/m
    const kIn = (flexureStiffness(ins, ins.flexures![0])![0] * lbf) / (inch * 1e-3); // N/m
    expect(kIn).toBeCloseTo(kMm, 3);
  });

  it("no stiffness without a material modulus or a section", () => {
    const l = rawLayout({ bodies: [{ id: "stage" }], contacts: [], flexures: [blade("leaf", [0, 0, 0], [0, 0, 40], { material: undefined })] });
    expect(flexureStiffness(l, l.flexures![0])).toBeNull();
  });
});

describe("flexure equivalence and encodings", () => {
  const stage = (flex: boolean): Layout => {
    const seats = [
      { id: "s1", body: "stage", point: [0, 0, 0], normal: [0, 0, 1], stiffness: 5e4 },
      { id: "s2", body: "stage", point: [50, 0, 0], normal: [0, 0, 1], stiffness: 5e4 },
      { id: "s3", body: "stage", point: [0, 50, 0], normal: [0, 0, 1], stiffness: 5e4 },
    ];
    const leaf = blade("leaf", [20, 20, -40], [20, 20, 0], { widthDirection: [1, 1, 0] });
    const layout = rawLayout({
      bodies: [{ id: "stage", mass: 2, centerOfMass: [20, 20, 10], material: "alu" }],
      materials: [...materials, { id: "alu", expansionPerK: 23e-6 }, { id: "base", expansionPerK: 11e-6 }],
      groundMaterial: "base",
      contacts: seats,
      flexures: flex ? [leaf] : [],
      points: [{ id: "tip", body: "stage", point: [40, 40, 30] }],
      defaultScatter: 0.0002,
    });
    if (flex) return layout;
    // the three rows written by hand: at tip ± (w/2) ŵ along l̂, and at tip along ŵ (§10)
    const probe = rawLayout({ bodies: [{ id: "stage" }], materials, contacts: [], flexures: [leaf] });
    const k = flexureStiffness(probe, probe.flexures![0])!;
    const wHat: Vec3 = [Math.SQRT1_2, Math.SQRT1_2, 0];
    const half = 12.5;
    layout.contacts.push(
      {
        id: "leaf.a",
        body: "stage",
        on: "ground",
        point: [20 + half * wHat[0], 20 + half * wHat[1], 0],
        normal: [0, 0, 1],
        sense: "bilateral",
        stiffness: k[0],
      },
      {
        id: "leaf.b",
        body: "stage",
        on: "ground",
        point: [20 - half * wHat[0], 20 - half * wHat[1], 0],
        normal: [0, 0, 1],
        sense: "bilateral",
        stiffness: k[1],
      },
      { id: "leaf.s", body: "stage", on: "ground", point: [20, 20, 0], normal: wHat, sense: "bilateral", stiffness: k[2] },
    );
    return layout;
  };

  it("a blade element and its three hand-written rows give identical reports", () => {
    const a = runEngine(stage(true)).report;
    const b = runEngine(stage(false)).report;
    const strip = (r: typeof a) => JSON.parse(JSON.stringify({ ...r, flexures: [], findings: r.findings.map((f) => ({ ...f, body: "", title: "" })) }));
    const close = (x: unknown, y: unknown): void => {
      if (typeof x === "number") expect(x).toBeCloseTo(y as number, 9);
      else if (Array.isArray(x)) x.forEach((v, i) => close(v, (y as unknown[])[i]));
      else if (x && typeof x === "object") {
        expect(Object.keys(x).sort()).toEqual(Object.keys(y as object).sort());
        for (const k of Object.keys(x)) close((x as Record<string, unknown>)[k], (y as Record<string, unknown>)[k]);
      } else expect(x).toEqual(y);
    };
    close(strip(a), strip(b));
    expect(a.thermal).not.toBeNull();
    expect(a.repeatability).not.toBeNull();
  });

  it("XML and JSON of the same flexure layout give the same report", () => {
    const l = stage(true);
    const fromXml = parseLayoutText(toXml(l), { encoding: "xml" });
    expect(fromXml.ok).toBe(true);
    if (!fromXml.ok) return;
    expect(runEngine(fromXml.layout).report).toEqual(runEngine(l).report);
  });
});
