/** Seating, load sharing, foundation coupling: the statics tables of reference-checks.md and random-layout properties. */
import { describe, expect, it } from "vitest";
import { analyseLayout } from "@/lib/analysis";
import { validateRaw } from "@/lib/layout/schema";
import type { Layout, Vec3 } from "@/lib/layout/model";
import { example } from "../support/examples";
import { randomLayout, rng } from "../support/layouts";

function layout(raw: Record<string, unknown>): Layout {
  const r = validateRaw({ format: "mount-layout/1", name: "t", ...raw });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.layout;
}
const vertical = (pts: [number, number][], k?: number[]) =>
  pts.map(([x, y], i) => ({ id: `S${i + 1}`, body: "plate", point: [x, y, 0], normal: [0, 0, 1], ...(k ? { stiffness: k[i] } : {}) }));

describe("statics (reference-checks.md, Statics and support)", () => {
  it("E3: three supports (0,0), (300,0), (0,200) mm, 900 N at (100,50) → 375, 300, 225 N (lever rule, barycentric coordinates [D])", () => {
    const l = layout({
      bodies: [{ id: "plate" }],
      contacts: vertical([
        [0, 0],
        [300, 0],
        [0, 200],
      ]),
      loads: [{ id: "P", body: "plate", force: [0, 0, -900], point: [100, 50, 0] }],
    });
    const s = analyseLayout(l).statics.cases[0].seating!;
    expect(s.stiffness).toBe("none");
    expect(s.forces!.S1).toBeCloseTo(375, 9);
    expect(s.forces!.S2).toBeCloseTo(300, 9);
    expect(s.forces!.S3).toBeCloseTo(225, 9);
  });

  it("E2: rigid cap on four equal springs at (±100, ±100) mm, 1000 N at (20, 10) → 325, 225, 175, 275 N (pile-group formula R = P/N + Mx·y/Σy² + My·x/Σx² [C], values [D])", () => {
    const l = layout({
      bodies: [{ id: "plate" }],
      contacts: vertical(
        [
          [100, 100],
          [-100, 100],
          [-100, -100],
          [100, -100],
        ],
        [5e4, 5e4, 5e4, 5e4],
      ),
      loads: [{ id: "P", body: "plate", force: [0, 0, -1000], point: [20, 10, 0] }],
    });
    const s = analyseLayout(l).statics.cases[0].seating!;
    expect(s.stiffness).toBe("file");
    [325, 225, 175, 275].forEach((v, i) => expect(s.forces![`S${i + 1}`]).toBeCloseTo(v, 8));
  });

  it("E5: centred 1000 N on four springs, k1 = 2k → 285.7, 214.3, 285.7, 214.3 N [D]", () => {
    const l = layout({
      bodies: [{ id: "plate" }],
      contacts: vertical(
        [
          [100, 100],
          [-100, 100],
          [-100, -100],
          [100, -100],
        ],
        [2e4, 1e4, 1e4, 1e4],
      ),
      loads: [{ id: "P", body: "plate", force: [0, 0, -1000], point: [0, 0, 0] }],
    });
    const s = analyseLayout(l).statics.cases[0].seating!;
    [2000 / 7, 1500 / 7, 2000 / 7, 1500 / 7].forEach((v, i) => expect(s.forces![`S${i + 1}`]).toBeCloseTo(v, 8));
    expect(Math.round(s.forces!.S1 * 10) / 10).toBe(285.7);
  });

  it("Kelvin coupling (trihedral 3 + vee 2 + flat 1), θ = 45°, 90 N at the triangle's centroid → 14.142, 21.213, 30 N (W/(9 cos θ), W/(6 cos θ), W/3 [D])", () => {
    const base = example("instrument-plate-socket-vee-flat");
    const l: Layout = {
      ...base,
      bodies: [{ id: "instrument-plate" }],
      loads: [{ id: "W", body: "instrument-plate", force: [0, 0, -90], point: [100, 160 / 3, 0] }],
      loadCases: undefined,
    };
    delete l.loadCases;
    const s = analyseLayout(l).statics.cases[0].seating!;
    // the example's normals are written to 6 decimals (0.707107), hence 1e-4 N
    for (const id of ["socketa", "socketb", "socketc"]) expect(s.forces![id]).toBeCloseTo(90 / (9 * Math.SQRT1_2), 4);
    for (const id of ["veea", "veeb"]) expect(s.forces![id]).toBeCloseTo(90 / (6 * Math.SQRT1_2), 4);
    expect(s.forces!.flat).toBeCloseTo(30, 4);
  });

  it("a seat that would pull lifts off; the rest re-solve (active set); a release that frees the part stops with forces null", () => {
    // load outside the support triangle of a stool: S3 must pull
    const l = layout({
      bodies: [{ id: "plate" }],
      contacts: vertical(
        [
          [0, 0],
          [300, 0],
          [0, 200],
        ],
        [1e4, 1e4, 1e4],
      ),
      loads: [{ id: "P", body: "plate", force: [0, 0, -900], point: [200, -50, 0] }],
    });
    const c = analyseLayout(l).statics.cases[0];
    expect(c.driven).toBe(true);
    expect(c.seating!.forces).toBeNull();
    expect(c.seating!.liftOff).toEqual(["S3"]);
    // four springs, load near one edge: the far corner lifts, three carry it (lever rule on the remaining three)
    const four = layout({
      bodies: [{ id: "plate" }],
      contacts: vertical(
        [
          [100, 100],
          [-100, 100],
          [-100, -100],
          [100, -100],
        ],
        [1e4, 1e4, 1e4, 1e4],
      ),
      loads: [{ id: "P", body: "plate", force: [0, 0, -1000], point: [90, 60, 0] }],
    });
    const d = analyseLayout(four).statics.cases[0];
    expect(d.seating!.liftOff).toEqual(["S3"]);
    const f = d.seating!.forces!;
    expect(f.S3).toBe(0);
    // barycentric coordinates of (90, 60) in the triangle S1 (100,100), S2 (−100,100), S4 (100,−100) [D]
    expect(f.S1).toBeCloseTo(1000 * 0.75, 6);
    expect(f.S2).toBeCloseTo(1000 * 0.05, 6);
    expect(f.S4).toBeCloseTo(1000 * 0.2, 6);
  });

  it("Hertz stiffness: the load sharing is found at the fixed point and equals the result for stiffness ∝ F^(1/3)", () => {
    const hz = {
      radii: [
        [5, 5],
        [null, null],
      ],
      angleDeg: 0,
      materials: ["bearing-steel", "bearing-steel"],
    };
    const l = layout({
      bodies: [{ id: "plate" }],
      contacts: vertical([
        [100, 100],
        [-100, 100],
        [-100, -100],
        [100, -100],
      ]).map((c) => ({ ...c, hertz: hz })),
      loads: [{ id: "P", body: "plate", force: [0, 0, -1000], point: [20, 10, 0] }],
    });
    const a = analyseLayout(l);
    const c = a.statics.cases[0];
    expect(c.seating!.stiffness).toBe("hertz");
    const f = c.seating!.forces!;
    // equilibrium
    expect(f.S1 + f.S2 + f.S3 + f.S4).toBeCloseTo(1000, 8);
    // compatibility of a rigid plate: approaches δ ∝ F^(2/3) lie on a plane, δ1 + δ3 = δ2 + δ4 [D]
    const d = (x: number) => Math.pow(x, 2 / 3);
    expect(d(f.S1) + d(f.S3)).toBeCloseTo(d(f.S2) + d(f.S4), 6);
    expect(Object.keys(c.hertz).sort()).toEqual(["S1", "S2", "S3", "S4"]);
  });

  it("load cases: each case solved; top-level seating is the first case's", () => {
    const a = analyseLayout(example("instrument-plate-socket-vee-flat"));
    expect(a.statics.cases.map((c) => c.id)).toEqual(["operating", "shipping-lateral-2g", "inverted"]);
    expect(a.statics.cases[0].seating!.liftOff).toEqual([]);
    expect(a.statics.cases[2].seating!.liftOff.length).toBeGreaterThan(0);
  });
});

describe("foundation coupling (analysis.md §4)", () => {
  it("four semi-firm feet: a 1 µm rise of one foot changes each foot force by k·1 µm/4 = 10 N (40 N/µm feet, warp mode (1, −1, 1, −1)/2) [D]", () => {
    const f = analyseLayout(example("breadboard-four-feet")).statics.foundation!;
    expect(f.maxPerMicrometre).toBeCloseTo(10, 9);
    expect(f.sensitivity.F1).toEqual({ F1: expect.closeTo(10, 9), F2: expect.closeTo(-10, 9), F3: expect.closeTo(10, 9), F4: expect.closeTo(-10, 9) });
    // unit warp: the state (1, −1, 1, −1) scaled to 1 µm moves each foot ±1 µm → each force changes by 40 N
    expect(f.warp[0].forces.F1).toBeCloseTo(40, 9);
  });

  it("three seats: zeros whatever the stiffness", () => {
    const f = analyseLayout(example("breadboard-three-seats")).statics.foundation!;
    expect(f.maxPerMicrometre).toBe(0);
    for (const col of Object.values(f.sensitivity)) for (const v of Object.values(col)) expect(v).toBe(0);
  });

  it("null when only the equal-stiffness assumption is available", () => {
    expect(analyseLayout(example("detector-sled-hidden-count")).statics.foundation).toBeNull();
  });

  it("S = 0 on random exactly constrained layouts, and S·d = 0 for any rigid-body-compatible support motion on random over-constrained ones", () => {
    const r = rng(99);
    for (let t = 0; t < 40; t++) {
      const contacts = 6 + (t % 6);
      const raw = Array.from({ length: contacts }, (_, i) => ({
        id: `c${i}`,
        body: "part",
        point: [r() * 200 - 100, r() * 200 - 100, r() * 50],
        normal: [r() - 0.5, r() - 0.5, 0.5 + r()],
        stiffness: 1e4 * (0.5 + r()),
        sense: "bilateral",
      }));
      const l = layout({ bodies: [{ id: "part" }], contacts: raw });
      const a = analyseLayout(l);
      const f = a.statics.foundation!;
      if (a.constraint.counts.redundancies === 0) {
        expect(f.maxPerMicrometre).toBe(0);
        continue;
      }
      // d = J t for a random rigid motion t of the base: the part follows and no force changes
      const omega: Vec3 = [r() - 0.5, r() - 0.5, r() - 0.5].map((x) => x * 1e-3) as Vec3;
      const v: Vec3 = [r() - 0.5, r() - 0.5, r() - 0.5];
      const d = l.contacts.map((k) => {
        const n = k.normal.map((x) => x / Math.hypot(...k.normal));
        const p = k.point;
        const vel = [v[0] + omega[1] * p[2] - omega[2] * p[1], v[1] + omega[2] * p[0] - omega[0] * p[2], v[2] + omega[0] * p[1] - omega[1] * p[0]];
        return n[0] * vel[0] + n[1] * vel[1] + n[2] * vel[2];
      });
      const ids = l.contacts.map((k) => k.id);
      for (const i of ids) {
        const dF = ids.reduce((s, j, jj) => s + f.sensitivity[j][i] * d[jj], 0);
        expect(Math.abs(dF)).toBeLessThan(1e-9 * f.maxPerMicrometre * contacts);
      }
      expect(f.maxPerMicrometre).toBeGreaterThan(0);
    }
  });
});

describe("equilibrium on random layouts", () => {
  it("Σ forces and moments balance the load to 1e-9 relative (single- and multi-body, bilateral, no free motion)", () => {
    let checked = 0;
    for (let seed = 0; seed < 80; seed++) {
      const base = randomLayout(5000 + seed, 1 + (seed % 6));
      const r = rng(seed);
      base.contacts.forEach((k) => (k.sense = "bilateral"));
      base.bodies.forEach((b) => {
        b.mass = 1 + 10 * r();
        b.centerOfMass = [...base.contacts.find((k) => k.body === b.id)!.point] as Vec3;
      });
      const a = analyseLayout(base);
      const c = a.statics.cases[0];
      // a free motion that the load does not drive (below 1e-9) leaves that part of the load unbalanced by definition
      if (c.driven || a.constraint.counts.freedoms > 0) continue;
      checked++;
      const A = a.constraint.A;
      const lam = base.contacts.map((k) => c.seating!.forces![k.id]);
      // scaled wrench rebuilt here: [((p − c) × F)/L; F] per body
      const n = A.columns;
      const w = new Array(n).fill(0);
      base.bodies.forEach((b, bi) => {
        const F = [0, 0, (-9.80665 * b.mass!) / 1];
        const p = b.centerOfMass!.map((x, j) => x - a.constraint.centroid[j]);
        const M = [p[1] * F[2] - p[2] * F[1], p[2] * F[0] - p[0] * F[2], p[0] * F[1] - p[1] * F[0]];
        for (let j = 0; j < 3; j++) {
          w[6 * bi + j] = M[j] / a.constraint.length;
          w[6 * bi + 3 + j] = F[j];
        }
      });
      const res = Array.from({ length: n }, (_, q) => lam.reduce((s, l, i) => s + A.get(i, q) * l, 0) + w[q]);
      expect(Math.hypot(...res) / Math.hypot(...w), `seed ${seed}`).toBeLessThan(1e-9);
    }
    expect(checked).toBeGreaterThanOrEqual(20);
  });
});

describe("foundation map of a large layout", () => {
  // analysis.md §8: entries below 1e-12 of the largest may be left out; a missing entry is zero
  it("leaves out only negligible entries once the map is large, keeping every coupled one", async () => {
    const { makeLayout, rng } = await import("../support/layouts");
    const { analyseLayout } = await import("@/lib/analysis");
    // a bench of 30 mounts each on seven ground pads (one redundant pad each): coupling stays within a mount
    const r = rng(4242);
    const specs = Array.from({ length: 30 }, (_, b) =>
      Array.from({ length: 7 }, (_, k) => ({
        body: `m${b}`,
        p: [b * 200 + (r() - 0.5) * 60, (r() - 0.5) * 60, (r() - 0.5) * 60] as [number, number, number],
        n: (k < 4 ? [r() * 0.2, r() * 0.2, 1] : [r() - 0.5, r() - 0.5, r() - 0.5]) as [number, number, number],
        stiffness: 1e4,
      })),
    ).flat();
    const l = makeLayout(specs);
    const f = analyseLayout(l).statics.foundation!;
    const m = l.contacts.length;
    expect(m * m).toBeGreaterThan(20000);
    const kept = Object.values(f.sensitivity).reduce((s, col) => s + Object.keys(col).length, 0);
    expect(kept).toBeGreaterThan(0);
    expect(kept).toBeLessThan((m * m) / 10);
    for (const col of Object.values(f.sensitivity)) for (const v of Object.values(col)) expect(Math.abs(v)).toBeGreaterThan(1e-12 * f.maxPerMicrometre);
  }, 60_000);
});
