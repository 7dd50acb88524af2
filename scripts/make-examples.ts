/**
 * Writes the example layouts (invented, Larkspur Photonics) in all three encodings. The geometry is
 * computed here so that seats, vees and blades are laid out exactly; run `npx tsx scripts/make-examples.ts`.
 */
import { writeFileSync } from "node:fs";
import type { Contact, HertzData, Layout, Vec3 } from "../lib/layout/model";
import { toCsv, toJson, toXml } from "../lib/layout/serialize";

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

const ballOnFlat = (materials: [string, string], R: number): HertzData => ({ radii: [[R, R], [null, null]], angleDeg: 0, materials });

// 1. Breadboard on four semi-firm feet (the "before" state)
const board = { id: "breadboard", mass: 38.5, centerOfMass: v(300, 225, 30) };
const fourFeet = base("Larkspur interferometer breadboard on four feet", {
  bodies: [board],
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
  contacts: seats.flatMap((s, i) =>
    vee(`S${i + 1}`, "breadboard", s, unit2(g3[0] - s[0], g3[1] - s[1]), 6.35, {
      stiffness: 40000,
      hertz: ballOnFlat(["silicon-nitride", "bearing-steel"], 6.35),
    }),
  ),
  points: [{ id: "beam-splitter", body: "breadboard", point: v(310, 200, 95) }],
});

// 3. Detachable instrument plate on a trihedral socket, a vee and a flat
const plate = { id: "instrument-plate", mass: 6.2, centerOfMass: v(100, 60, 25) };
const hz = ballOnFlat(["cemented-carbide", "stainless-martensitic"], 5);
const socketC = v(0, 0, 0);
const veeC = v(200, 0, 0);
const flatC = v(100, 160, 0);
const kelvin = base("Larkspur detachable instrument plate on socket, vee and flat", {
  bodies: [plate],
  contacts: [
    ...socket("socket", "instrument-plate", socketC, 5, 90, { hertz: hz }),
    ...vee("vee", "instrument-plate", veeC, unit2(socketC[0] - veeC[0], socketC[1] - veeC[1]), 5, { hertz: hz }),
    { id: "flat", body: "instrument-plate", on: "ground", feature: "flat", point: v(100, 160, -5), normal: v(0, 0, 1), sense: "unilateral", hertz: hz },
  ],
  loads: [{ id: "nest-spring", body: "instrument-plate", force: v(0, 0, -40), point: v(100, 53.333333, 0) }],
  points: [{ id: "detector-datum", body: "instrument-plate", point: v(100, 60, 40) }],
  loadCases: [
    { id: "operating", gravity: [0, 0, -9.80665], loads: ["nest-spring"] },
    { id: "shipping-lateral-2g", gravity: [19.6133, 0, -9.80665], loads: ["nest-spring"] },
    { id: "inverted", gravity: [0, 0, 9.80665], loads: ["nest-spring"] },
  ],
});

// 4. Mirror cell on three vees at 120° with radial grooves
const cell = { id: "mirror-cell", mass: 2.4, centerOfMass: v(0, 0, 18) };
const threeVee = base("Larkspur mirror cell on three radial vees", {
  bodies: [cell],
  contacts: [90, 210, 330].flatMap((deg, i) => {
    const a = (deg * Math.PI) / 180;
    const c = v(80 * Math.cos(a), 80 * Math.sin(a), 0);
    return vee(`V${i + 1}`, "mirror-cell", c, [Math.cos(a), Math.sin(a)], 4, { hertz: ballOnFlat(["bearing-steel", "bearing-steel"], 4) });
  }),
});

// 5. Two-blade flexure stage: blade A full width, blade B narrowed to a central strip → one intended freedom (x)
const carriage = { id: "carriage", mass: 1.1, centerOfMass: v(50, 0, 20) };
const stage = base("Larkspur two-blade flexure stage", {
  intendedFreedoms: 1,
  bodies: [carriage],
  contacts: [
    { id: "A-z1", body: "carriage", on: "ground", feature: "blade-A", point: v(0, -30, 0), normal: v(0, 0, 1), sense: "bilateral" },
    { id: "A-z2", body: "carriage", on: "ground", feature: "blade-A", point: v(0, 30, 0), normal: v(0, 0, 1), sense: "bilateral" },
    { id: "A-y", body: "carriage", on: "ground", feature: "blade-A", point: v(0, 0, 0), normal: v(0, 1, 0), sense: "bilateral" },
    { id: "B-z", body: "carriage", on: "ground", feature: "blade-B", point: v(100, 0, 0), normal: v(0, 0, 1), sense: "bilateral" },
    { id: "B-y", body: "carriage", on: "ground", feature: "blade-B", point: v(100, 0, 0), normal: v(0, 1, 0), sense: "bilateral" },
  ],
  points: [{ id: "probe-tip", body: "carriage", point: v(50, 0, 45) }],
});

// 5b. The same stage with both blades full width: one redundant constraint (rotation about y held twice)
const fullBlades = base("Larkspur two-blade flexure stage, both blades full width", {
  intendedFreedoms: 1,
  bodies: [carriage],
  contacts: [
    ...stage.contacts.filter((c) => c.id !== "B-z"),
    { id: "B-z1", body: "carriage", on: "ground", feature: "blade-B", point: v(100, -30, 0), normal: v(0, 0, 1), sense: "bilateral" },
    { id: "B-z2", body: "carriage", on: "ground", feature: "blade-B", point: v(100, 30, 0), normal: v(0, 0, 1), sense: "bilateral" },
  ],
  points: stage.points,
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
  ["detector-sled-hidden-count", hidden],
];

for (const [file, layout] of all) {
  writeFileSync(`examples/${file}.json`, toJson(layout));
  writeFileSync(`examples/${file}.xml`, toXml(layout));
  writeFileSync(`examples/${file}.csv`, toCsv(layout));
}
console.error(`wrote ${all.length * 3} example files`);
