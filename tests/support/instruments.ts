/**
 * Generated whole-instrument layouts for the bench and the large-layout tests: chains, trees, stars (a bench
 * carrying mounts) and meshes with loops, with random contact normals; and the same dressed as an instrument
 * (masses, seat stiffness, materials, scatter, functional points). Invented geometry, not a design.
 */
import type { Layout, Vec3 } from "../../lib/layout/model";
import { rng } from "./layouts";

export type Shape = "chain" | "tree" | "star" | "mesh";

/**
 * A generated layout: `perBody` contacts a body with random normals. chain: each body on the one before;
 * tree: on a random earlier one; star: every body on body 0 (a bench on the ground carrying mounts);
 * mesh: bodies on a grid, each on its left and its upper neighbour (ground at the edges), which closes loops.
 */
export function generate(bodies: number, shape: Shape, seed: number, perBody = 6.5): Layout {
  const r = rng(seed);
  const contacts: Layout["contacts"] = [];
  const side = Math.ceil(Math.sqrt(bodies));
  for (let b = 0; b < bodies; b++) {
    const [gx, gy] = [b % side, Math.floor(b / side)];
    const origin: Vec3 =
      shape === "mesh"
        ? [gx * 150, gy * 150, 0]
        : shape === "star"
          ? [(r() - 0.5) * 2000, (r() - 0.5) * 1200, 100]
          : [b * 120, (r() - 0.5) * 200, (r() - 0.5) * 100];
    const parents =
      b === 0
        ? ["ground"]
        : shape === "chain"
          ? [`b${b - 1}`]
          : shape === "tree"
            ? [`b${Math.floor(r() * b)}`]
            : shape === "star"
              ? ["b0"]
              : [gx > 0 ? `b${b - 1}` : "ground", gy > 0 ? `b${b - side}` : "ground"];
    const count = Math.floor(perBody) + (r() < perBody % 1 ? 1 : 0);
    for (let k = 0; k < count; k++) {
      const n: Vec3 = [r() - 0.5, r() - 0.5, r() - 0.5];
      contacts.push({
        id: `c${contacts.length}`,
        body: `b${b}`,
        on: parents[k % parents.length],
        point: [origin[0] + (r() - 0.5) * 80, origin[1] + (r() - 0.5) * 80, origin[2] + (r() - 0.5) * 80],
        normal: n,
        sense: "bilateral",
      });
    }
  }
  return generatedLayout(`bench ${shape} ${bodies}`, bodies, contacts);
}

/** A layout of bodies b0 … b(n−1) with the given contacts, millimetres and newtons, gravity down, nothing else. */
export function generatedLayout(name: string, bodies: number, contacts: Layout["contacts"]): Layout {
  return {
    format: "mount-layout/1",
    name,
    units: { length: "mm", force: "N" },
    gravity: [0, 0, -9.80665],
    tolerance: 1e-6,
    intendedFreedoms: 0,
    bodies: Array.from({ length: bodies }, (_, i) => ({ id: `b${i}` })),
    materials: [],
    contacts,
    loads: [],
    points: [],
  };
}

/** A chain of bodies, each on six random unilateral seats on the body before: the worker tests' slow upload. */
export function seatedChain(bodies: number, seed: number): Layout {
  const r = rng(seed);
  const contacts: Layout["contacts"] = [];
  for (let b = 0; b < bodies; b++)
    for (let k = 0; k < 6; k++)
      contacts.push({
        id: `c${b}-${k}`,
        body: `b${b}`,
        on: b === 0 ? "ground" : `b${b - 1}`,
        point: [b * 100 + r() * 50, r() * 50, r() * 50],
        normal: [r() - 0.5, r() - 0.5, r() - 0.5],
        sense: "unilateral",
      });
  return generatedLayout("chain", bodies, contacts);
}

/** The generated layout as a whole instrument: masses, seat stiffness, materials, scatter and one functional point a body. */
export function instrument(layout: Layout): Layout {
  const com = (id: string): Vec3 => {
    const pts = layout.contacts.filter((c) => c.body === id).map((c) => c.point);
    return [0, 1, 2].map((j) => pts.reduce((s, p) => s + p[j], 0) / Math.max(1, pts.length)) as Vec3;
  };
  return {
    ...layout,
    materials: [
      { id: "bench-steel", expansionPerK: 11.7e-6 },
      { id: "mount-alloy", expansionPerK: 23e-6 },
    ],
    groundMaterial: "bench-steel",
    defaultScatter: 0.0005,
    bodies: layout.bodies.map((b, i) => ({ ...b, mass: i === 0 ? 150 : 1.5, centerOfMass: com(b.id), material: i === 0 ? "bench-steel" : "mount-alloy" })),
    contacts: layout.contacts.map((c, i) => ({ ...c, stiffness: 2e4 * (1 + (i % 4)) })),
    // a functional point on every 25th body (the surfaces an instrument is aligned by)
    points: layout.bodies.filter((_, i) => i % 25 === 0).map((b) => ({ id: `p-${b.id}`, body: b.id, point: com(b.id) })),
  };
}
