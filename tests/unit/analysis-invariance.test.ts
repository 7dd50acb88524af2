/**
 * Invariance (analysis.md §1: the scaled matrix makes numbers independent of units and origin): the same
 * counts, screws (mapped) and conditioning in inches, with the origin 10 m away, with contacts
 * reordered and with normals scaled.
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyseConstraint, type ConstraintAnalysis } from "@/lib/analysis/constraint";
import { parseLayoutText } from "@/lib/layout";
import { expandFlexures } from "@/lib/layout/flexures";
import type { Layout, Vec3 } from "@/lib/layout/model";
import { randomLayout, rng } from "../support/layouts";

const examples = ["breadboard-four-feet", "flexure-stage-one-freedom", "detector-sled-hidden-count", "instrument-plate-socket-vee-flat"];
const load = (name: string): Layout => {
  const r = parseLayoutText(readFileSync(`examples/${name}.json`, "utf8"));
  if (!r.ok) throw new Error(name);
  // flexure elements as the rows they expand to (analysis.md §10), so every row moves with the frame
  return expandFlexures(r.layout);
};
const clone = (l: Layout): Layout => JSON.parse(JSON.stringify(l));
const mapPoints = (l: Layout, f: (p: Vec3) => Vec3): Layout => {
  const c = clone(l);
  c.contacts.forEach((k) => (k.point = f(k.point)));
  c.bodies.forEach((b) => b.centerOfMass && (b.centerOfMass = f(b.centerOfMass)));
  return c;
};

/** Compares two analyses of the same physical layout; `toFirst` maps a point of the second back to the first's frame and units. */
function expectSame(a: ConstraintAnalysis, b: ConstraintAnalysis, toFirst: (p: Vec3) => Vec3, lengthRatio: number) {
  expect(b.counts).toEqual(a.counts);
  expect(b.conditioning).toBeCloseTo(a.conditioning, 9);
  expect(b.length * lengthRatio).toBeCloseTo(a.length, 6);
  expect(b.freeMotions.length).toBe(a.freeMotions.length);
  a.freeMotions.forEach((ma, i) => {
    const mb = b.freeMotions[i];
    for (const body of Object.keys(ma.screws)) {
      const sa = ma.screws[body];
      const sb = mb.screws[body];
      expect(sb.kind).toBe(sa.kind);
      if (sa.direction) sa.direction.forEach((d, j) => expect(sb.direction![j]).toBeCloseTo(d, 7));
      if (sa.point) toFirst(sb.point!).forEach((x, j) => expect(x).toBeCloseTo(sa.point![j], 5));
      if (sa.pitch !== null) expect(sb.pitch! * lengthRatio).toBeCloseTo(sa.pitch, 6);
    }
  });
  expect(b.selfStress).toEqual(
    a.selfStress.map((s) => ({
      pivot: s.pivot,
      forces: expect.objectContaining(Object.fromEntries(Object.entries(s.forces).map(([k, v]) => [k, expect.closeTo(v, 8)]))),
    })),
  );
}

describe.each(examples)("%s", (name) => {
  const base = load(name);
  const a = analyseConstraint(base);

  it("in inches instead of millimetres", () => {
    const inch = mapPoints(base, (p) => p.map((x) => x / 25.4) as Vec3);
    inch.units.length = "in";
    expectSame(a, analyseConstraint(inch), (p) => p.map((x) => x * 25.4) as Vec3, 25.4);
  });

  it("with the origin moved 10 m away", () => {
    const off: Vec3 = [10000, -10000, 10000];
    const moved = mapPoints(base, (p) => [p[0] + off[0], p[1] + off[1], p[2] + off[2]]);
    expectSame(a, analyseConstraint(moved), (p) => [p[0] - off[0], p[1] - off[1], p[2] - off[2]], 1);
  });

  it("with the contacts reordered", () => {
    const r = rng(7);
    const shuffled = clone(base);
    shuffled.contacts.sort(() => r() - 0.5);
    expectSame(a, analyseConstraint(shuffled), (p) => p, 1);
  });

  it("with the normals scaled", () => {
    const scaled = clone(base);
    scaled.contacts.forEach((k, i) => (k.normal = k.normal.map((x) => x * (0.01 + 37 * i)) as Vec3));
    expectSame(a, analyseConstraint(scaled), (p) => p, 1);
  });
});

describe("invariance on random multi-body layouts", () => {
  it.each([3, 7, 12])("%i bodies: counts and conditioning survive inches + a 10 m offset", (bodies) => {
    const base = randomLayout(42 + bodies, bodies);
    const moved = mapPoints(base, (p) => p.map((x) => (x + 10000) / 25.4) as Vec3);
    moved.units.length = "in";
    const a = analyseConstraint(base);
    const b = analyseConstraint(moved);
    expect(b.counts).toEqual(a.counts);
    expect(b.conditioning).toBeCloseTo(a.conditioning, 8);
  });
});
