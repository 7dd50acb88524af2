/** The format fields of 2026-12: flexures, materials per body, temperature, scatter, allowance — located errors in JSON, XML and CSV. */
import { describe, expect, it } from "vitest";
import { parseLayoutText, type ParseResult } from "@/lib/layout";

const errs = (r: ParseResult) => (r.ok ? [] : r.errors);
const ok = (r: ParseResult) => {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.layout;
};
const wire = { id: "w1", kind: "wire", body: "part", from: [0, 0, 0], to: [0, 0, 50], diameter: 1 };
const blade = { id: "leaf", kind: "blade", body: "part", root: [0, 0, 0], tip: [0, 0, 40], widthDirection: [0, 1, 0], width: 25, thickness: 0.3 };
const base = (extra: Record<string, unknown> = {}) =>
  JSON.stringify({
    format: "mount-layout/1",
    bodies: [{ id: "part" }],
    contacts: [{ id: "c1", body: "part", point: [0, 0, 0], normal: [0, 0, 1] }],
    ...extra,
  });

describe("JSON: new fields refused with their location", () => {
  const cases: [string, string, string, RegExp][] = [
    ["unknown flexure kind", base({ flexures: [{ ...wire, kind: "spring" }] }), "/flexures/0/kind", /wire.*blade/],
    ["wire without ends", base({ flexures: [{ id: "w", kind: "wire", body: "part" }] }), "/flexures/0/from", /required/],
    ["wire of zero length", base({ flexures: [{ ...wire, to: [0, 0, 0] }] }), "/flexures/0/to", /zero length/],
    ["blade width along its length", base({ flexures: [{ ...blade, widthDirection: [0, 0, 2] }] }), "/flexures/0/widthDirection", /parallel/],
    ["blade of zero thickness", base({ flexures: [{ ...blade, thickness: 0 }] }), "/flexures/0/thickness", /greater than zero/],
    ["negative diameter", base({ flexures: [{ ...wire, diameter: -1 }] }), "/flexures/0/diameter", /greater than zero/],
    ["flexure id equal to a contact id", base({ flexures: [{ ...wire, id: "c1" }] }), "/flexures/0/id", /collides/],
    [
      "blade row id equal to a contact id",
      base({ contacts: [{ id: "leaf.s", body: "part", point: [0, 0, 0], normal: [0, 0, 1] }], flexures: [blade] }),
      "/flexures/0/id",
      /row leaf\.s/,
    ],
    ["flexure with an unknown material", base({ flexures: [{ ...wire, material: "unobtainium" }] }), "/flexures/0/material", /neither built in/],
    ["flexure on an undeclared body", base({ flexures: [{ ...wire, on: "bench" }] }), "/flexures/0/on", /not declared/],
    ["body with an unknown material", base({ bodies: [{ id: "part", material: "cheese" }] }), "/bodies/0/material", /neither built in/],
    ["unknown ground material", base({ groundMaterial: "cheese" }), "/groundMaterial", /neither built in/],
    ["negative expansion", base({ materials: [{ id: "m", expansionPerK: -1e-6 }] }), "/materials/0/expansionPerK", /negative/],
    ["swing of zero", base({ temperatureSwing: 0 }), "/temperatureSwing", /greater than zero/],
    [
      "negative scatter",
      base({ contacts: [{ id: "c1", body: "part", point: [0, 0, 0], normal: [0, 0, 1], scatter: -0.1 }] }),
      "/contacts/0/scatter",
      /negative/,
    ],
    ["negative default scatter", base({ defaultScatter: -1 }), "/defaultScatter", /negative/],
    ["zero allowance", base({ points: [{ id: "p", body: "part", point: [0, 0, 0], allowance: 0 }] }), "/points/0/allowance", /greater than zero/],
  ];
  it.each(cases)("%s → located error", (_name, text, location, message) => {
    const e = errs(parseLayoutText(text, { encoding: "json" }));
    expect(e.length).toBeGreaterThan(0);
    expect(e.find((x) => x.location.startsWith(location))?.message ?? JSON.stringify(e)).toMatch(message);
  });

  it("accepts every new field and keeps older files unchanged", () => {
    const l = ok(
      parseLayoutText(
        base({
          bodies: [{ id: "part", material: "aluminium-alloy" }],
          materials: [{ id: "granite-slab", expansionPerK: 7e-6 }],
          groundMaterial: "granite-slab",
          temperatureSwing: 3,
          defaultScatter: 0.0001,
          flexures: [wire, blade],
          points: [{ id: "p", body: "part", point: [0, 0, 0], allowance: 0.002 }],
        }),
      ),
    );
    expect(l.flexures).toHaveLength(2);
    expect(l.temperatureSwing).toBe(3);
    expect(ok(parseLayoutText(base())).flexures).toEqual([]);
  });

  it("a material may give only some of its values (a check that needs a missing one is skipped)", () => {
    expect(ok(parseLayoutText(base({ materials: [{ id: "m", expansionPerK: 5e-6 }] }))).materials[0]).toEqual({ id: "m", expansionPerK: 5e-6 });
  });
});

describe("XML and CSV: new attributes and columns", () => {
  const xml = (inner: string, root = "") =>
    `<mount-layout format="mount-layout/1" name="x"${root}><body id="part" material="aluminium-alloy"/><contact id="c1" body="part" point="0 0 0" normal="0 0 1" scatter="0.0001"/>${inner}</mount-layout>`;

  it("reads flexures, materials, swing, scatter and allowance", () => {
    const l = ok(
      parseLayoutText(
        xml(
          '<material id="slab" expansion-per-k="7e-6"/><flexure id="w1" kind="wire" body="part" on="ground" from="0 0 0" to="0 0 50" diameter="1" scatter="0.0002"/><flexure id="leaf" kind="blade" body="part" root="10 0 0" tip="10 0 40" width-direction="0 1 0" width="25" thickness="0.3"/><point id="p" body="part" at="0 0 0" allowance="0.002"/>',
          ' ground-material="slab" temperature-swing="2" default-scatter="0.0003"',
        ),
        { encoding: "xml" },
      ),
    );
    expect(l.groundMaterial).toBe("slab");
    expect(l.temperatureSwing).toBe(2);
    expect(l.defaultScatter).toBe(0.0003);
    expect(l.contacts[0].scatter).toBe(0.0001);
    expect(l.bodies[0].material).toBe("aluminium-alloy");
    expect(l.flexures!.map((f) => f.kind)).toEqual(["wire", "blade"]);
    expect(l.points[0].allowance).toBe(0.002);
  });

  it("locates a bad flexure attribute by element and attribute", () => {
    const e = errs(
      parseLayoutText(xml('<flexure id="leaf" kind="blade" body="part" root="0 0 0" tip="0 0 40" width-direction="0 0 1" width="25"/>'), { encoding: "xml" }),
    );
    expect(e[0].location).toBe("mount-layout/flexure[1] @width-direction");
    expect(e[0].message).toMatch(/parallel/);
  });

  it("CSV scatter column, with a located error for a negative value", () => {
    const good = ok(parseLayoutText("id,x,y,z,nx,ny,nz,scatter\na,0,0,0,0,0,1,0.0002\n", { encoding: "csv" }));
    expect(good.contacts[0].scatter).toBe(0.0002);
    const bad = errs(parseLayoutText("id,x,y,z,nx,ny,nz,scatter\na,0,0,0,0,0,1,-1\n", { encoding: "csv" }));
    expect(bad[0]).toMatchObject({ location: "line 2, column 8 (scatter)" });
  });
});

describe("every error of a file in one answer, naming the item and the value", () => {
  it("JSON: a string in a normal and an undeclared body come together, each with the contact id and the value", () => {
    const text = JSON.stringify({
      format: "mount-layout/1",
      bodies: [{ id: "plate" }],
      contacts: [
        { id: "S1", body: "plate", point: [0, 0, 0], normal: [0, 0, "up"] },
        { id: "S2", body: "bench", point: [1, 0, 0], normal: [0, 0, 1] },
      ],
    });
    expect(errs(parseLayoutText(text, { encoding: "json" }))).toEqual([
      { location: "/contacts/0/normal/2", message: "contact 'S1': normal[2] must be a number (got \"up\")" },
      { location: "/contacts/1/body", message: "body 'bench' is not declared" },
    ]);
  });

  it("CSV: a row of the wrong width does not hide a bad cell further down", () => {
    const e = errs(parseLayoutText("id,x,y,z,nx,ny,nz\na,0,0,0,0,0,1,9\nb,1,x,0,0,0,1\n", { encoding: "csv" }));
    expect(e.map((x) => x.location)).toEqual(["line 2", "line 3, column 3 (y)"]);
    expect(e[0].message).toMatch(/8 columns; the header has 7/);
  });
});
