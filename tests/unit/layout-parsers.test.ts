/** Every refusal path of the three readers, with its location asserted; and the three encodings agree. */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseLayoutBytes, parseLayoutText, type ParseResult } from "@/lib/layout";
import { metresPer, newtonsPer } from "@/lib/layout/units";
import { expandFlexures } from "@/lib/layout/flexures";
import { exampleNames } from "../support/examples";

const ok = (r: ParseResult) => {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.layout;
};
const errs = (r: ParseResult) => (r.ok ? [] : r.errors);
const base = (extra: Record<string, unknown> = {}, contact: Record<string, unknown> = {}) =>
  JSON.stringify({
    format: "mount-layout/1",
    name: "t",
    bodies: [{ id: "part" }],
    contacts: [{ id: "c1", body: "part", on: "ground", point: [0, 0, 0], normal: [0, 0, 1], ...contact }],
    ...extra,
  });

describe("JSON reader", () => {
  it("accepts a minimal layout and fills the documented defaults", () => {
    const l = ok(parseLayoutText(base(), { encoding: "json" }));
    expect(l.units).toEqual({ length: "mm", force: "N" });
    expect(l.gravity).toEqual([0, 0, -9.80665]);
    expect(l.tolerance).toBe(1e-6);
    expect(l.intendedFreedoms).toBe(0);
    expect(l.contacts[0].sense).toBe("unilateral");
  });

  const cases: [string, string, string, RegExp][] = [
    ["syntax error", '{"format": "mount-layout/1",', "line 1", /not valid JSON/],
    ["not an object", "[1,2]", "/", /one JSON object/],
    ["wrong format", base({ format: "mount-layout/2" }), "/format", /must be "mount-layout\/1"/],
    ["missing format", JSON.stringify({ bodies: [{ id: "p" }], contacts: [] }), "/format", /format/],
    ["missing contacts", JSON.stringify({ format: "mount-layout/1", bodies: [{ id: "p" }] }), "/contacts", /required|list/],
    ["two-element point", base({}, { point: [0, 0] }), "/contacts/0/point", /three numbers/],
    ["string in a vector", base({}, { normal: [0, "x", 1] }), "/contacts/0/normal/1", /number/],
    ["zero normal", base({}, { normal: [0, 0, 0] }), "/contacts/0/normal", /zero length/],
    ["unknown body", base({}, { body: "bench" }), "/contacts/0/body", /'bench' is not declared/],
    ["body is ground", base({}, { body: "ground" }), "/contacts/0/body", /may not be 'ground'/],
    ["on unknown", base({}, { on: "frame" }), "/contacts/0/on", /'frame' is not declared/],
    ["ground declared", base({ bodies: [{ id: "ground" }] }, { body: "ground" }), "/bodies/0/id", /fixed body/],
    ["bad sense", base({}, { sense: "sticky" }), "/contacts/0/sense", /unilateral or bilateral/],
    ["negative stiffness", base({}, { stiffness: -5 }), "/contacts/0/stiffness", /greater than zero/],
    ["bad length unit", base({ units: { length: "cm" } }), "/units/length", /m, mm, um, in/],
    ["mass without centre", base({ bodies: [{ id: "part", mass: 2 }] }), "/bodies/0/centerOfMass", /required when mass/],
    [
      "unknown material",
      base(
        {},
        {
          hertz: {
            radii: [
              [5, 5],
              [null, null],
            ],
            materials: ["unobtainium", "bearing-steel"],
          },
        },
      ),
      "/contacts/0/hertz/materials/0",
      /neither built in/,
    ],
    ["built-in material redefined", base({ materials: [{ id: "alumina", youngsModulusGPa: 300, poissonRatio: 0.2 }] }), "/materials/0/id", /built-in/],
    [
      "zero radius",
      base(
        {},
        {
          hertz: {
            radii: [
              [0, 5],
              [null, null],
            ],
            materials: ["alumina", "alumina"],
          },
        },
      ),
      "/contacts/0/hertz/radii/0/0",
      /zero/,
    ],
    ["load on unknown body", base({ loads: [{ id: "l", body: "x", force: [0, 0, 1], point: [0, 0, 0] }] }), "/loads/0/body", /not declared/],
    ["load case names unknown load", base({ loadCases: [{ id: "op", loads: ["nope"] }] }), "/loadCases/0/loads/0", /not declared/],
    ["negative intended freedoms", base({ intendedFreedoms: -1 }), "/intendedFreedoms", /negative/],
    ["id with a space", base({}, { id: "c 1" }), "/contacts/0/id", /spaces/],
  ];
  it.each(cases)("%s → located error", (_name, text, location, message) => {
    const e = errs(parseLayoutText(text, { encoding: "json" }));
    expect(e.length).toBeGreaterThan(0);
    expect(e.find((x) => x.location === location || x.location.startsWith(location))?.message).toMatch(message);
  });

  it("accepts unknown fields but warns about each one, located, so a misspelt field does not drop data silently", () => {
    const r = parseLayoutText(base({ colour: "red" }, { stifness: 5 }), { encoding: "json" });
    expect(r.ok && r.warnings).toEqual([
      '/colour: unknown field "colour" was ignored (check the spelling)',
      '/contacts/0/stifness: unknown field "stifness" was ignored (check the spelling)',
    ]);
  });

  it("refuses duplicate ids and says where the first one is", () => {
    const text = JSON.stringify({
      format: "mount-layout/1",
      bodies: [{ id: "p" }],
      contacts: [
        { id: "a", body: "p", point: [0, 0, 0], normal: [0, 0, 1] },
        { id: "a", body: "p", point: [1, 0, 0], normal: [0, 0, 1] },
      ],
    });
    expect(errs(parseLayoutText(text))).toEqual([{ location: "/contacts/1/id", message: "contact id 'a' is used twice (first at /contacts/0)" }]);
  });

  it("refuses a body joined to itself", () => {
    const text = JSON.stringify({
      format: "mount-layout/1",
      bodies: [{ id: "p" }],
      contacts: [{ id: "a", body: "p", on: "p", point: [0, 0, 0], normal: [0, 0, 1] }],
    });
    expect(errs(parseLayoutText(text))[0]).toMatchObject({ location: "/contacts/0/on" });
  });

  it("refuses numbers too large to be finite (1e999 reads as Infinity)", () => {
    const text = base().replace('"point":[0,0,0]', '"point":[1e999,0,0]');
    expect(errs(parseLayoutText(text))[0]).toMatchObject({ location: "/contacts/0/point/0" });
  });

  it("enforces the body and contact limits", () => {
    const bodies = Array.from({ length: 501 }, (_, i) => ({ id: `b${i}` }));
    expect(errs(parseLayoutText(base({ bodies }), { encoding: "json" }))[0]).toMatchObject({ location: "/bodies", message: expect.stringMatching(/500/) });
    const contacts = Array.from({ length: 5001 }, (_, i) => ({ id: `c${i}`, body: "part", point: [i, 0, 0], normal: [0, 0, 1] }));
    expect(errs(parseLayoutText(base({ contacts })))[0]).toMatchObject({ location: "/contacts", message: expect.stringMatching(/5000/) });
  });

  it("refuses deeply nested JSON without crashing", () => {
    const deep = "[".repeat(200000) + "]".repeat(200000);
    const e = errs(parseLayoutText(deep, { encoding: "json" }));
    expect(e.length).toBe(1);
  });
});

describe("file-level limits", () => {
  it("refuses files over 5 MB before reading them", () => {
    const big = new Uint8Array(5 * 1024 * 1024 + 1).fill(32);
    expect(errs(parseLayoutBytes(big))[0]).toMatchObject({ location: "file", message: expect.stringMatching(/limit is 5 MB/) });
  });
  it("refuses binary data and non-UTF-8 text", () => {
    expect(errs(parseLayoutBytes(new Uint8Array([0x7b, 0x00, 0x01, 0x02])))[0].message).toMatch(/not UTF-8 text/);
    expect(errs(parseLayoutBytes(new Uint8Array([0x7b, 0xff, 0xfe, 0x7d])))[0].message).toMatch(/not UTF-8 text/);
  });
});

describe("XML reader", () => {
  const xml = (body: string, root = 'format="mount-layout/1" name="t"') => `<?xml version="1.0"?>\n<mount-layout ${root}>\n${body}\n</mount-layout>`;
  const good = '<body id="p"/>\n<contact id="a" body="p" on="ground" point="0 0 0" normal="0 0 1"/>';

  it("reads the documented attributes", () => {
    const l = ok(parseLayoutText(xml(good, 'format="mount-layout/1" name="t" length="in" force="lbf" intended-freedoms="2" tolerance="1e-8"')));
    expect(l.units).toEqual({ length: "in", force: "lbf" });
    expect(l.intendedFreedoms).toBe(2);
    expect(l.tolerance).toBe(1e-8);
  });

  it("warns about unknown attributes with element and attribute", () => {
    const r = parseLayoutText(xml('<body id="p" weight="3"/>\n<contact id="a" body="p" point="0 0 0" normal="0 0 1"/>'));
    expect(r.ok && r.warnings).toEqual(['mount-layout/body[1] @weight: unknown attribute "weight" was ignored (check the spelling)']);
  });

  it("gives no warning for any example file", () => {
    for (const f of ["breadboard-three-seats", "instrument-plate-socket-vee-flat"])
      for (const e of ["json", "xml"]) {
        const r = parseLayoutText(readFileSync(`examples/${f}.${e}`, "utf8"), { fileName: `${f}.${e}` });
        expect(r.ok && r.warnings).toEqual([]);
      }
  });

  it("refuses a DOCTYPE and names its line", () => {
    const text = '<?xml version="1.0"?>\n<!DOCTYPE lolz [<!ENTITY lol "lol">]>\n<mount-layout format="mount-layout/1"/>';
    expect(errs(parseLayoutText(text))[0]).toMatchObject({ location: "line 2", message: expect.stringMatching(/DOCTYPE declarations are not allowed/) });
  });

  it("refuses an entity declaration and never expands entity references", () => {
    expect(errs(parseLayoutText('<!ENTITY x SYSTEM "file:///etc/passwd">'))[0].message).toMatch(/ENTITY/);
    const l = parseLayoutText(xml('<body id="p&amp;q"/>\n<contact id="a" body="p&amp;q" point="0 0 0" normal="0 0 1"/>'));
    expect(l.ok ? l.layout.bodies[0].id : "").toBe("p&amp;q");
  });

  const cases: [string, string, string, RegExp][] = [
    ["malformed", '<mount-layout format="mount-layout/1"><body id="p">', "line", /not well-formed/],
    ["number with a comma", good.replace('normal="0 0 1"', 'normal="0 0 1,5"'), "mount-layout/contact[1] @normal", /not a number/],
    ["NaN", good.replace('point="0 0 0"', 'point="NaN 0 0"'), "mount-layout/contact[1] @point", /not a number/],
    ["two values for a vector", good.replace('point="0 0 0"', 'point="0 0"'), "mount-layout/contact[1] @point", /3 space-separated/],
    ["missing normal", good.replace(' normal="0 0 1"', ""), "mount-layout/contact[1] @normal", /required/],
    ["unknown body", good.replace('body="p" on', 'body="q" on'), "mount-layout/contact[1] @body", /'q' is not declared/],
    ["unknown element", good + "\n<spring id='s'/>", "mount-layout/spring[1]", /unknown element/],
    ["bad mass", '<body id="p" mass="heavy" center-of-mass="0 0 0"/>', "mount-layout/body[1] @mass", /not a number/],
    [
      "bad hertz radii",
      '<body id="p"/><contact id="a" body="p" point="0 0 0" normal="0 0 1"><hertz body-radii="5 round" on-radii="flat flat" materials="alumina alumina"/></contact>',
      "mount-layout/contact[1]/hertz @body-radii",
      /not a number/,
    ],
  ];
  it.each(cases)("%s → located error", (_n, body, location, message) => {
    const e = errs(parseLayoutText(xml(body)));
    expect(e.length).toBeGreaterThan(0);
    expect(e.find((x) => x.location.startsWith(location))?.message).toMatch(message);
  });

  it("refuses a wrong root element", () => {
    expect(errs(parseLayoutText("<layout/>", { encoding: "xml" }))[0].message).toMatch(/root element/);
  });
});

describe("CSV reader", () => {
  const header = "id,body,on,x,y,z,nx,ny,nz,sense,feature";
  it("declares bodies in order of first appearance and takes units from the options", () => {
    const l = ok(
      parseLayoutText(`${header}\na,top,mid,0,0,0,0,0,1,,\nb,mid,ground,1,0,0,0,0,1,bilateral,f1\n`, { encoding: "csv", length: "in", force: "kN" }),
    );
    expect(l.bodies.map((b) => b.id)).toEqual(["top", "mid"]);
    expect(l.units).toEqual({ length: "in", force: "kN" });
    expect(l.contacts[1]).toMatchObject({ sense: "bilateral", feature: "f1" });
  });
  it("without a body column the body is 'part' on ground", () => {
    const l = ok(parseLayoutText("id,x,y,z,nx,ny,nz\na,0,0,0,0,0,1\n", { encoding: "csv" }));
    expect(l.contacts[0]).toMatchObject({ body: "part", on: "ground" });
  });
  it("accepts quoted cells and exponents", () => {
    const l = ok(parseLayoutText('id,x,y,z,nx,ny,nz,feature\n"a",1e-3,0,0,0,0,1,"seat, left"\n', { encoding: "csv" }));
    expect(l.contacts[0].point[0]).toBe(0.001);
    expect(l.contacts[0].feature).toBe("seat, left");
  });
  const cases: [string, string, string, RegExp][] = [
    ["empty file", "", "line 1", /empty/],
    ["unknown column", "id,x,y,z,nx,ny,nz,colour\na,0,0,0,0,0,1,red", "line 1, column 8", /unknown column 'colour'/],
    ["missing column", "id,x,y,z,nx,ny\na,0,0,0,0,0", "line 1", /'nz' is missing/],
    ["short row", "id,x,y,z,nx,ny,nz\na,0,0,0,0,0,1\nb,0,0", "line 3", /3 columns; the header has 7/],
    ["NaN", "id,x,y,z,nx,ny,nz\na,0,NaN,0,0,0,1", "line 2, column 3 (y)", /not a number/],
    ["decimal comma", 'id,x,y,z,nx,ny,nz\na,"1,5",0,0,0,0,1', "line 2, column 2 (x)", /not a number/],
    ["zero normal", "id,x,y,z,nx,ny,nz\na,0,0,0,0,0,0", "line 2, columns 5–7", /zero length/],
    ["missing id", "id,x,y,z,nx,ny,nz\n,0,0,0,0,0,1", "line 2, column 1 (id)", /required/],
    ["unterminated quote", 'id,x,y,z,nx,ny,nz\n"a,0,0,0,0,0,1', "line", /quote|Quote/],
  ];
  it.each(cases)("%s → located error", (_n, text, location, message) => {
    const e = errs(parseLayoutText(text, { encoding: "csv" }));
    expect(e.length).toBeGreaterThan(0);
    expect(e.find((x) => x.location.startsWith(location))?.message).toMatch(message);
  });
});

describe("units", () => {
  it("converts through mathjs's unit definitions", () => {
    // exact definitions: 1 in = 25.4 mm (international yard and pound, 1959); 1 lbf = 4.4482216152605 N (NIST SP 811)
    expect(metresPer("in")).toBeCloseTo(0.0254, 15);
    expect(metresPer("um")).toBeCloseTo(1e-6, 18);
    expect(newtonsPer("lbf")).toBeCloseTo(4.4482216152605, 12);
    expect(newtonsPer("kN")).toBe(1000);
  });
});

describe("the three encodings of every example carry the same layout", () => {
  const names = [...exampleNames];
  it.each(names)("%s", (name) => {
    const j = ok(parseLayoutText(readFileSync(`examples/${name}.json`, "utf8"), { fileName: `${name}.json` }));
    const x = ok(parseLayoutText(readFileSync(`examples/${name}.xml`, "utf8"), { fileName: `${name}.xml` }));
    const c = ok(parseLayoutText(readFileSync(`examples/${name}.csv`, "utf8"), { fileName: `${name}.csv` }));
    expect(x).toEqual(j);
    // CSV carries contacts only: flexures go out as their rows (analysis.md §10)
    expect(c.contacts.map(({ hertz: _h, ...rest }) => rest)).toEqual(expandFlexures(j).contacts.map(({ hertz: _h, flexure: _f, ...rest }) => rest));
  });
});
