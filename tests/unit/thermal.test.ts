/**
 * Temperature (analysis.md §9): thermal centre, drift and thermal forces against published properties,
 * hand-derived values and invariants. Sources beside each check.
 */
import { describe, expect, it } from "vitest";
import { analyseLayout } from "@/lib/analysis";
import type { Layout, Vec3 } from "@/lib/layout/model";
import { rawLayout } from "../support/statics-layouts";
import { randomLayout, rng } from "../support/layouts";

const S2 = Math.SQRT1_2;

/** Three vees at 120° on radius R, groove axes radial (meeting at the origin), balls at z = 0. */
function threeVee(alphaBody: number, alphaBase: number, extra: Record<string, unknown> = {}, shift: Vec3 = [0, 0, 0], scale = 1): Layout {
  const contacts = [0, 1, 2].flatMap((k) => {
    const a = (2 * Math.PI * k) / 3 + 0.3;
    const g: Vec3 = [Math.cos(a), Math.sin(a), 0];
    const h: Vec3 = [-g[1], g[0], 0];
    const c: Vec3 = [100 * g[0], 100 * g[1], 0];
    return [1, -1].map((side, i) => {
      const out: Vec3 = [side * h[0] * S2, side * h[1] * S2, -S2];
      return {
        id: `V${k + 1}${"ab"[i]}`,
        body: "plate",
        feature: `vee-${k + 1}`,
        point: [0, 1, 2].map((j) => (c[j] + 6 * out[j] + shift[j]) * scale),
        normal: [-out[0], -out[1], -out[2]],
      };
    });
  });
  return rawLayout({
    bodies: [{ id: "plate", material: "plate-mat" }],
    materials: [
      { id: "plate-mat", expansionPerK: alphaBody },
      { id: "base-mat", expansionPerK: alphaBase },
    ],
    groundMaterial: "base-mat",
    contacts,
    ...extra,
  });
}

/** A bar between two stops along x (stiffness k1, k2, length ℓ), its other freedoms held by bilateral rows. */
function bar(k1: number, k2: number, ell: number, alphaBar: number, alphaBase: number, unit: "mm" | "in" = "mm"): Layout {
  const s = unit === "in" ? 1 / 25.4 : 1;
  const held = (id: string, p: Vec3, n: Vec3) => ({
    id,
    body: "bar",
    point: p.map((x) => x * s),
    normal: n,
    sense: "bilateral",
    stiffness: 5e4 * (unit === "in" ? 25.4 : 1),
  });
  return rawLayout({
    units: { length: unit, force: "N" },
    bodies: [{ id: "bar", material: "bar-mat" }],
    materials: [
      { id: "bar-mat", expansionPerK: alphaBar },
      { id: "base-mat", expansionPerK: alphaBase },
    ],
    groundMaterial: "base-mat",
    contacts: [
      { id: "L", body: "bar", point: [0, 0, 0], normal: [1, 0, 0], stiffness: k1 * (unit === "in" ? 25.4 : 1) },
      { id: "R", body: "bar", point: [ell * s, 0, 0], normal: [-1, 0, 0], stiffness: k2 * (unit === "in" ? 25.4 : 1) },
      held("Z1", [0, 0, 0], [0, 0, 1]),
      held("Z2", [ell, 0, 0], [0, 0, 1]),
      held("Z3", [ell / 2, 40, 0], [0, 0, 1]),
      held("Y1", [0, 0, 0], [0, 1, 0]),
      held("Y2", [ell, 0, 0], [0, 1, 0]),
    ],
    points: [{ id: "end", body: "bar", point: [ell * s, 0, 0] }],
  });
}

describe("thermal centre", () => {
  // a published property of three-groove couplings: grooves whose axes meet in one point keep that
  // point fixed (in plan) for any expansion mismatch (symmetry; numbers derived)
  it.each([
    [23.6e-6, 11.9e-6],
    [0.55e-6, 23.6e-6],
    [1.3e-6, 1.2e-6],
  ])("three radial vees (α_body %d, α_base %d): centre on the vertical through the groove intersection, no force", (ab, ag) => {
    const a = analyseLayout(threeVee(ab, ag));
    const t = a.thermal!;
    expect(t.undetermined).toBe(false);
    const centre = t.bodies.plate.centre!;
    expect(Math.hypot(centre[0], centre[1])).toBeLessThan(1e-9);
    for (const v of Object.values(t.forcesPerK!)) expect(v).toBe(0);
  });

  it("the centre moves with the origin; drift and forces do not change (invariance)", () => {
    const pt = { points: [{ id: "M", body: "plate", point: [30, -20, 40] }] };
    const a = analyseLayout(threeVee(23.6e-6, 11.9e-6, pt)).thermal!;
    const shift: Vec3 = [250, -75, 12];
    const b = analyseLayout(threeVee(23.6e-6, 11.9e-6, { points: [{ id: "M", body: "plate", point: [280, -95, 52] }] }, shift)).thermal!;
    const ca = a.bodies.plate.centre!;
    const cb = b.bodies.plate.centre!;
    for (let j = 0; j < 3; j++) expect(cb[j]).toBeCloseTo(ca[j] + shift[j], 8);
    for (let j = 0; j < 3; j++) expect(b.points.M.driftUmPerK[j]).toBeCloseTo(a.points.M.driftUmPerK[j], 10);
  });

  it("same material everywhere: no drift relative to the base, no force, no centre (§9)", () => {
    const t = analyseLayout(threeVee(11.9e-6, 11.9e-6, { points: [{ id: "M", body: "plate", point: [30, -20, 40] }] })).thermal!;
    expect(t.bodies.plate.centre).toBeNull();
    for (const v of t.points.M.driftUmPerK) expect(Math.abs(v)).toBeLessThan(1e-15);
    for (const v of Object.values(t.forcesPerK!)) expect(v).toBe(0);
  });

  it("is null when a body lacks an expansion coefficient; missing-data names it", () => {
    const l = threeVee(23.6e-6, 11.9e-6);
    l.bodies[0].material = undefined;
    const a = analyseLayout(l);
    expect(a.thermal).toBeNull();
  });
});

describe("thermal forces", () => {
  // derived from Hooke's law: a bar between stops k1, k2 over ℓ with mismatch Δα pushes with
  // k1·k2/(k1 + k2)·Δα·ℓ per kelvin; 20 000 N/mm each, ℓ 400 mm, Δα 11.6e-6 /K → 46.4 N/K (reference-checks.md)
  it("bar between two stops: 46.4 N/K (derived)", () => {
    const t = analyseLayout(bar(20000, 20000, 400, 23.2e-6, 11.6e-6)).thermal!;
    expect(t.forcesPerK!.L).toBeCloseTo(46.4, 9);
    expect(t.forcesPerK!.R).toBeCloseTo(46.4, 9);
  });

  it("unequal stops: k1·k2/(k1 + k2)·Δα·ℓ (derived); the end drifts by Δα times its distance from the centre", () => {
    const k1 = 30000;
    const k2 = 10000;
    const t = analyseLayout(bar(k1, k2, 250, 23.6e-6, 1.3e-6)).thermal!;
    const expected = ((k1 * k2) / (k1 + k2)) * (23.6e-6 - 1.3e-6) * 250;
    expect(t.forcesPerK!.L).toBeCloseTo(expected, 9);
    expect(t.forcesPerK!.R).toBeCloseTo(expected, 9);
  });

  it("units: the same bar in inches gives the same force and drift (invariance)", () => {
    const mm = analyseLayout(bar(20000, 20000, 400, 23.2e-6, 11.6e-6)).thermal!;
    const inch = analyseLayout(bar(20000, 20000, 400, 23.2e-6, 11.6e-6, "in")).thermal!;
    expect(inch.forcesPerK!.L).toBeCloseTo(mm.forcesPerK!.L, 8);
    for (let j = 0; j < 3; j++) expect(inch.points.end.driftUmPerK[j]).toBeCloseTo(mm.points.end.driftUmPerK[j], 8);
  });

  it("equal stiffness assumed on an over-constrained support: forces null, the loop still found", () => {
    const l = bar(20000, 20000, 400, 23.2e-6, 11.6e-6);
    for (const c of l.contacts) delete c.stiffness;
    const t = analyseLayout(l).thermal!;
    expect(t.forcesPerK).toBeNull();
    expect(t.fought).toBe(true);
    expect(t.fightingRows).toEqual(["L", "R"]);
  });
});

describe("thermal forces on random layouts", () => {
  const withMaterials = (seed: number, bodies: number): Layout => {
    const l = randomLayout(seed, bodies);
    const r = rng(seed + 99);
    l.materials = [{ id: "base", expansionPerK: 11e-6 }, ...l.bodies.map((b) => ({ id: `m-${b.id}`, expansionPerK: 1e-6 + 25e-6 * r() }))];
    l.groundMaterial = "base";
    l.bodies.forEach((b) => (b.material = `m-${b.id}`));
    l.contacts.forEach((c) => (c.stiffness = 1e4 * (0.2 + r())));
    return l;
  };
  const seeds = Array.from({ length: 40 }, (_, i) => 7000 + i);

  // exact constraint: a rigid-body motion absorbs the mismatch, so no force changes [D]
  // over-constraint: thermal forces are a self-stress, Jᵀ Δλ = 0 [D]
  it.each(seeds)("seed %d: zero forces when exactly constrained, a self-stress otherwise", (seed) => {
    const l = withMaterials(seed, 1 + (seed % 3));
    const a = analyseLayout(l);
    const t = a.thermal!;
    const f = l.contacts.map((c) => t.forcesPerK![c.id]);
    if (a.rowMap!.redundancies === 0) {
      for (const v of f) expect(v).toBe(0);
      return;
    }
    const A = a.constraint.A;
    const n = A.columns;
    const fMax = Math.max(...f.map(Math.abs));
    const colMax = Math.max(...f.map((v, i) => Math.abs(v) * Math.hypot(...A.getRow(i))));
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let i = 0; i < f.length; i++) s += A.get(i, j) * f[i];
      expect(Math.abs(s)).toBeLessThanOrEqual(1e-9 * Math.max(colMax, fMax, 1e-300));
    }
  });
});
