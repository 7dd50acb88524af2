/**
 * Writes the example layouts (invented, Larkspur Photonics) in all three encodings. The geometry is
 * computed here so that seats, vees and blades are laid out exactly; run `npx tsx scripts/make-examples.ts`.
 */
import { writeFileSync } from "node:fs";
import type { Contact, Flexure, HertzData, Layout, Material, Vec3 } from "../lib/layout/model";
import { toCsv, toJson, toXml } from "../lib/layout/serialize";
import { expandFlexures } from "../lib/layout/flexures";

const r6 = (x: number) => Math.round(x * 1e6) / 1e6;
const v = (x: number, y: number, z: number): Vec3 => [r6(x), r6(y), r6(z)];
const S2 = Math.SQRT1_2;

function base(name: string, extra: Partial<Layout> = {}): Layout {
  return {
    format: "mount-layout/1",
    name,
    units: { length: "mm", force: "N" },
    gravity: [0, 0, -9.80665],
    tolerance: 1e-6,
    intendedFreedoms: 0,
    bodies: [],
    materials: [],
    contacts: [],
    flexures: [],
    loads: [],
    points: [],
    ...extra,
  };
}

/** A ball of radius R centred at `c` in a vee whose groove runs along unit vector g (horizontal), flanks at 45°. */
function vee(id: string, body: string, c: Vec3, g: [number, number], R: number, extra: Partial<Contact> = {}): Contact[] {
  const h: [number, number] = [-g[1], g[0]];
  return [1, -1].map((side, i) => {
    const dirOut: Vec3 = [side * h[0] * S2, side * h[1] * S2, -S2];
    return {
      id: `${id}${"ab"[i]}`,
      body,
      on: "ground",
      feature: id,
      point: v(c[0] + R * dirOut[0], c[1] + R * dirOut[1], c[2] + R * dirOut[2]),
      normal: v(-dirOut[0], -dirOut[1], -dirOut[2]),
      sense: "unilateral",
      ...extra,
    } as Contact;
  });
}

/** A ball in a trihedral socket: three contacts at 45°, 120° apart, starting at angle a0 (degrees). */
function socket(id: string, body: string, c: Vec3, R: number, a0: number, extra: Partial<Contact> = {}): Contact[] {
  return [0, 1, 2].map((k) => {
    const a = ((a0 + 120 * k) * Math.PI) / 180;
    const dirOut: Vec3 = [Math.cos(a) * S2, Math.sin(a) * S2, -S2];
    return {
      id: `${id}${"abc"[k]}`,
      body,
      on: "ground",
      feature: id,
      point: v(c[0] + R * dirOut[0], c[1] + R * dirOut[1], c[2] + R * dirOut[2]),
      normal: v(-dirOut[0], -dirOut[1], -dirOut[2]),
      sense: "unilateral",
      ...extra,
    } as Contact;
  });
}

const unit2 = (dx: number, dy: number): [number, number] => {
  const l = Math.hypot(dx, dy);
  return [dx / l, dy / l];
};

const ballOnFlat = (materials: [string, string], R: number): HertzData => ({
  radii: [
    [R, R],
    [null, null],
  ],
  angleDeg: 0,
  materials,
});

// the lab's steel table (invented figure for the demo, in the range of carbon steels)
const tableSteel: Material = { id: "table-steel", expansionPerK: 11.7e-6 };

// 1. Breadboard on four semi-firm feet (the "before" state): aluminium board on the steel table
const board = { id: "breadboard", mass: 38.5, centerOfMass: v(300, 225, 30), material: "aluminium-alloy" };
const fourFeet = base("Larkspur interferometer breadboard on four feet", {
  bodies: [board],
  materials: [tableSteel],
  groundMaterial: "table-steel",
  temperatureSwing: 3,
  contacts: [
    [0, 0],
    [600, 0],
    [600, 450],
    [0, 450],
  ].map(([x, y], i) => ({
    id: `F${i + 1}`,
    body: "breadboard",
    on: "ground",
    feature: `foot-${i + 1}`,
    point: v(x, y, 0),
    normal: v(0, 0, 1),
    sense: "unilateral" as const,
    stiffness: 40000,
  })),
  points: [{ id: "beam-splitter", body: "breadboard", point: v(310, 200, 95) }],
});

// 2. The same breadboard on three ball-in-vee seats, grooves along the lines to the seat centroid
const seats: Vec3[] = [v(60, 60, 0), v(540, 60, 0), v(300, 400, 0)];
const g3: Vec3 = [(60 + 540 + 300) / 3, (60 + 60 + 400) / 3, 0];
const threeSeats = base("Larkspur interferometer breadboard on three seats", {
  bodies: [board],
  materials: [tableSteel],
  groundMaterial: "table-steel",
  temperatureSwing: 3,
  contacts: seats.flatMap((s, i) =>
    vee(`S${i + 1}`, "breadboard", s, unit2(g3[0] - s[0], g3[1] - s[1]), 6.35, {
      stiffness: 40000,
      hertz: ballOnFlat(["silicon-nitride", "bearing-steel"], 6.35),
    }),
  ),
  points: [{ id: "beam-splitter", body: "breadboard", point: v(310, 200, 95) }],
});

// 3. Detachable instrument plate on a trihedral socket, a vee and a flat
const plate = { id: "instrument-plate", mass: 6.2, centerOfMass: v(100, 60, 25), material: "low-expansion-alloy" };
const hz = ballOnFlat(["cemented-carbide", "stainless-martensitic"], 5);
const socketC = v(0, 0, 0);
const veeC = v(200, 0, 0);
// seat scatter (1σ along each normal, mm): lapped socket best, the flat worst (invented for the demo)
const kelvin = base("Larkspur detachable instrument plate on socket, vee and flat", {
  bodies: [plate],
  groundMaterial: "aluminium-alloy",
  temperatureSwing: 2,
  contacts: [
    ...socket("socket", "instrument-plate", socketC, 5, 90, { hertz: hz, scatter: 0.00003 }),
    ...vee("vee", "instrument-plate", veeC, unit2(socketC[0] - veeC[0], socketC[1] - veeC[1]), 5, { hertz: hz, scatter: 0.00005 }),
    {
      id: "flat",
      body: "instrument-plate",
      on: "ground",
      feature: "flat",
      point: v(100, 160, -5),
      normal: v(0, 0, 1),
      sense: "unilateral",
      hertz: hz,
      scatter: 0.00012,
    },
  ],
  loads: [{ id: "nest-spring", body: "instrument-plate", force: v(0, 0, -40), point: v(100, 53.333333, 0) }],
  points: [
    { id: "detector-datum", body: "instrument-plate", point: v(100, 60, 40), allowance: 0.0005 },
    { id: "alignment-mark", body: "instrument-plate", point: v(20, 150, 60), allowance: 0.0003 },
  ],
  loadCases: [
    { id: "operating", gravity: [0, 0, -9.80665], loads: ["nest-spring"] },
    { id: "shipping-lateral-2g", gravity: [19.6133, 0, -9.80665], loads: ["nest-spring"] },
    { id: "inverted", gravity: [0, 0, 9.80665], loads: ["nest-spring"] },
  ],
});

// 4. Mirror cell on three vees at 120° with radial grooves
// aluminium cell on a low-expansion bench: the grooves' axes meet at the optical axis, which the thermal
// centre keeps in place (in plan) however much the cell grows
const cell = { id: "mirror-cell", mass: 2.4, centerOfMass: v(0, 0, 18), material: "aluminium-alloy" };
const threeVee = base("Larkspur mirror cell on three radial vees", {
  bodies: [cell],
  groundMaterial: "low-expansion-alloy",
  temperatureSwing: 5,
  points: [{ id: "mirror-vertex", body: "mirror-cell", point: v(0, 0, 35), allowance: 0.005 }],
  contacts: [90, 210, 330].flatMap((deg, i) => {
    const a = (deg * Math.PI) / 180;
    const c = v(80 * Math.cos(a), 80 * Math.sin(a), 0);
    return vee(`V${i + 1}`, "mirror-cell", c, [Math.cos(a), Math.sin(a)], 4, { hertz: ballOnFlat(["bearing-steel", "bearing-steel"], 4) });
  }),
});

// 5. Two-blade flexure stage: blade A a full-width blade element; blade B narrowed to a central strip,
// written as its two rows (with the strip's stiffness) → one intended freedom (x)
const carriage = { id: "carriage", mass: 1.1, centerOfMass: v(50, 0, 20), material: "aluminium-alloy" };
const springSteel: Material = { id: "blade-steel", youngsModulusGPa: 200, poissonRatio: 0.29, expansionPerK: 11.5e-6 };
const bladeOf = (id: string, x: number, width: number): Flexure => ({
  id,
  kind: "blade",
  body: "carriage",
  on: "ground",
  feature: id,
  root: v(x, 0, -40),
  tip: v(x, 0, 0),
  widthDirection: [0, 1, 0],
  width,
  thickness: 0.25,
  material: "blade-steel",
});
const stageCommon = {
  intendedFreedoms: 1,
  bodies: [carriage],
  materials: [springSteel],
  groundMaterial: "blade-steel",
  temperatureSwing: 2,
  points: [{ id: "probe-tip", body: "carriage", point: v(50, 0, 45) }],
};
const stage = base("Larkspur two-blade flexure stage", {
  ...stageCommon,
  flexures: [bladeOf("blade-A", 0, 60)],
  contacts: [
    { id: "B-z", body: "carriage", on: "ground", feature: "blade-B", point: v(100, 0, 0), normal: v(0, 0, 1), sense: "bilateral", stiffness: 1875 },
    { id: "B-y", body: "carriage", on: "ground", feature: "blade-B", point: v(100, 0, 0), normal: v(0, 1, 0), sense: "bilateral", stiffness: 117 },
  ],
});

// 5b. The same stage with both blades full width: one redundant constraint (rotation about y held twice)
const fullBlades = base("Larkspur two-blade flexure stage, both blades full width", {
  ...stageCommon,
  flexures: [bladeOf("blade-A", 0, 60), bladeOf("blade-B", 100, 60)],
});

// 5c. A six-strut platform of wire flexures (a hexapod of thin rods): exactly constrained
const platform = { id: "sensor-platform", mass: 0.8, centerOfMass: v(0, 0, 70) };
const hexapod = base("Larkspur sensor platform on six wire struts", {
  bodies: [platform],
  materials: [springSteel],
  flexures: [0, 1, 2, 3, 4, 5].map((i) => {
    const pair = Math.floor(i / 2);
    const base = ((pair * 120 + (i % 2 ? 20 : -20)) * Math.PI) / 180;
    const top = ((pair * 120 + (i % 2 ? 70 : -70)) * Math.PI) / 180;
    return {
      id: `strut-${i + 1}`,
      kind: "wire",
      body: "sensor-platform",
      on: "ground",
      from: v(90 * Math.cos(base), 90 * Math.sin(base), 0),
      to: v(55 * Math.cos(top), 55 * Math.sin(top), 60),
      diameter: 0.8,
      material: "blade-steel",
    } as Flexure;
  }),
  points: [{ id: "sensor-head", body: "sensor-platform", point: v(0, 0, 90) }],
});

// 6. Detector carriage on six pads: four vertical, two sideways → rank 5, one free and one redundant; 6N − m = 0
const sled = { id: "detector-sled", mass: 3.0, centerOfMass: v(80, 40, 15) };
const hidden = base("Larkspur detector sled on six pads (count reads zero)", {
  bodies: [sled],
  contacts: [
    { id: "P1", body: "detector-sled", on: "ground", feature: "pad-1", point: v(0, 0, 0), normal: v(0, 0, 1), sense: "unilateral" },
    { id: "P2", body: "detector-sled", on: "ground", feature: "pad-2", point: v(160, 0, 0), normal: v(0, 0, 1), sense: "unilateral" },
    { id: "P3", body: "detector-sled", on: "ground", feature: "pad-3", point: v(160, 80, 0), normal: v(0, 0, 1), sense: "unilateral" },
    { id: "P4", body: "detector-sled", on: "ground", feature: "pad-4", point: v(0, 80, 0), normal: v(0, 0, 1), sense: "unilateral" },
    { id: "X1", body: "detector-sled", on: "ground", feature: "end-stop", point: v(0, 40, 10), normal: v(1, 0, 0), sense: "unilateral" },
    { id: "Y1", body: "detector-sled", on: "ground", feature: "side-rail", point: v(80, 0, 10), normal: v(0, 1, 0), sense: "unilateral" },
  ],
});

const all: [string, Layout][] = [
  ["breadboard-four-feet", fourFeet],
  ["breadboard-three-seats", threeSeats],
  ["instrument-plate-socket-vee-flat", kelvin],
  ["mirror-cell-three-vee", threeVee],
  ["flexure-stage-one-freedom", stage],
  ["flexure-stage-full-blades", fullBlades],
  ["hexapod-wire-platform", hexapod],
  ["detector-sled-hidden-count", hidden],
];

for (const [file, layout] of all) {
  writeFileSync(`examples/${file}.json`, toJson(layout));
  writeFileSync(`examples/${file}.xml`, toXml(layout));
  // CSV carries contacts only: flexures go out as the rows they expand to
  writeFileSync(`examples/${file}.csv`, toCsv(expandFlexures(layout)));
}
console.error(`wrote ${all.length * 3} example files`);
