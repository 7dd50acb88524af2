/** Counting and screw cases of reference-checks.md, each with its source beside it. */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyseConstraint } from "@/lib/analysis/constraint";
import { parseLayoutText } from "@/lib/layout";
import type { Vec3 } from "@/lib/layout/model";
import { makeLayout, type ContactSpec } from "../support/layouts";

const example = (name: string) => {
  const r = parseLayoutText(readFileSync(`examples/${name}.json`, "utf8"));
  if (!r.ok) throw new Error("example does not parse");
  return r.layout;
};

const legs = (pts: [number, number][]): ContactSpec[] => pts.map(([x, y], i) => ({ id: `L${i + 1}`, p: [x, y, 0], n: [0, 0, 1] }));

/** A revolute joint about z at P between two bodies as five contact lines (it removes five freedoms). */
function revolute(tag: string, body: string, on: string, P: Vec3, d = 10): ContactSpec[] {
  const at = (dx: number, dy: number): Vec3 => [P[0] + dx, P[1] + dy, P[2]];
  return [
    { id: `${tag}x`, body, on, p: P, n: [1, 0, 0] },
    { id: `${tag}y`, body, on, p: P, n: [0, 1, 0] },
    { id: `${tag}z0`, body, on, p: P, n: [0, 0, 1] },
    { id: `${tag}z1`, body, on, p: at(d, 0), n: [0, 0, 1] },
    { id: `${tag}z2`, body, on, p: at(0, d), n: [0, 0, 1] },
  ];
}

describe("counting (reference-checks.md, Counting)", () => {
  it.each(["mirror-cell-three-vee", "instrument-plate-socket-vee-flat", "breadboard-three-seats"])(
    "rigid body on a three-vee or trihedral–vee–flat coupling (%s): rank 6, 0 free, 0 redundant — derived from the rank definition [D]",
    (name) => {
      const a = analyseConstraint(example(name));
      expect(a.counts).toMatchObject({ rank: 6, freedoms: 0, redundancies: 0, grubler: 0 });
      expect(a.freeMotions).toEqual([]);
      expect(a.selfStress).toEqual([]);
    },
  );

  it("table on four vertical legs: rank 3; free x, y and rotation about z; one self-stress (1, −1, 1, −1)/2 [D]", () => {
    const a = analyseConstraint(
      makeLayout(
        legs([
          [0, 0],
          [600, 0],
          [600, 450],
          [0, 450],
        ]),
      ),
    );
    expect(a.counts).toMatchObject({ rank: 3, freedoms: 3, redundancies: 1, grubler: 2 });
    const kinds = a.freeMotions.map((m) => m.screws.part);
    expect(kinds[0]).toMatchObject({ kind: "translation", direction: [1, 0, 0] });
    expect(kinds[1]).toMatchObject({ kind: "translation", direction: [0, 1, 0] });
    expect(kinds[2]).toMatchObject({ kind: "rotation", pitch: 0 });
    expect(kinds[2].direction![2]).toBeCloseTo(1, 12);
    // canonical basis: the RREF row of the state (1, −1, 1, −1)/2 is (1, −1, 1, −1)
    expect(a.selfStress).toHaveLength(1);
    expect(a.selfStress[0].pivot).toBe("L1");
    const f = a.selfStress[0].forces;
    for (const [id, v] of Object.entries({ L1: 1, L2: -1, L3: 1, L4: -1 })) expect(f[id]).toBeCloseTo(v, 12);
  });

  it("three-legged stool: rank 3, no self-stress [D]", () => {
    const a = analyseConstraint(
      makeLayout(
        legs([
          [0, 0],
          [300, 0],
          [0, 200],
        ]),
      ),
    );
    expect(a.counts).toMatchObject({ rank: 3, freedoms: 3, redundancies: 0 });
    expect(a.selfStress).toEqual([]);
  });

  it("planar four-bar (4 links, 4 revolute joints): mobility 1; as a spatial chain 6·3 − 20 = −2 with 3 redundant constraints — Grübler–Kutzbach, standard mechanism texts [M], counts [D]", () => {
    const contacts = [
      ...revolute("A", "crank", "ground", [0, 0, 0]),
      ...revolute("B", "coupler", "crank", [40, 30, 0]),
      ...revolute("C", "rocker", "coupler", [140, 60, 0]),
      ...revolute("D", "rocker", "ground", [120, 0, 0]),
    ];
    const a = analyseConstraint(makeLayout(contacts));
    expect(a.counts).toMatchObject({ bodies: 3, contacts: 20, grubler: -2, freedoms: 1, redundancies: 3 });
    // the one free motion is planar: every link turns about an axis parallel to z
    for (const s of Object.values(a.freeMotions[0].screws)) {
      expect(s.kind).toBe("rotation");
      expect(Math.abs(s.direction![2])).toBeCloseTo(1, 9);
    }
  });

  it("rigid body with c point contacts: 6 − c = f − k (Maxwell's rule with Calladine's correction, Pellegrino & Calladine IJSS 22 (1986)) [D]", () => {
    const a = analyseConstraint(example("detector-sled-hidden-count"));
    expect(a.counts.grubler).toBe(0);
    expect(a.counts.freedoms - a.counts.redundancies).toBe(a.counts.grubler);
    expect(a.counts).toMatchObject({ freedoms: 1, redundancies: 1 });
  });

  it("a body with no contacts has six freedoms, rank 0, conditioning 0 and no weakest direction", () => {
    const l = makeLayout([{ body: "a", p: [0, 0, 0], n: [0, 0, 1] }]);
    l.bodies.push({ id: "loose" });
    const a = analyseConstraint(l);
    expect(a.counts).toMatchObject({ bodies: 2, rank: 1, freedoms: 11 });
    const empty = makeLayout([{ body: "a", p: [0, 0, 0], n: [0, 0, 1] }]);
    empty.contacts = [];
    const b = analyseConstraint(empty);
    expect(b.counts).toMatchObject({ rank: 0, freedoms: 6, redundancies: 0 });
    expect(b.conditioning).toBe(0);
    expect(b.weakestDirection).toBeNull();
  });
});

describe("screws (reference-checks.md, Screws)", () => {
  it("a screw of pitch 2 mm/rad about z through the origin, built from five lines reciprocal to it (f·v + m·ω = 0, Ball; Hopkins & Culpepper, Precision Engineering 34 (2010)) [D]", () => {
    const a = analyseConstraint(
      makeLayout([
        { p: [0, 0, 0], n: [1, 0, 0] },
        { p: [0, 0, 0], n: [0, 1, 0] },
        { p: [10, 0, 0], n: [0, -0.2, 1] },
        { p: [-10, 0, 0], n: [0, 0.2, 1] },
        { p: [0, 10, 0], n: [0.2, 0, 1] },
      ]),
    );
    expect(a.counts).toMatchObject({ rank: 5, freedoms: 1 });
    const s = a.freeMotions[0].screws.part;
    expect(s.kind).toBe("screw");
    expect(Math.abs(s.direction![2])).toBeCloseTo(1, 10);
    // pitch h = ω·v/|ω|² is independent of the sign of the twist
    expect(s.pitch).toBeCloseTo(2, 9);
    expect(s.point![0]).toBeCloseTo(0, 9);
    expect(s.point![1]).toBeCloseTo(0, 9);
    // the point nearest the centroid c: on the z axis at c's height
    expect(s.point![2]).toBeCloseTo(a.centroid[2], 9);
  });

  it("every free twist is reciprocal to every contact wrench: n·v + (p × n)·ω = 0 (Ball; Hopkins & Culpepper 2010) [C]", () => {
    for (const name of ["breadboard-four-feet", "flexure-stage-one-freedom", "detector-sled-hidden-count"]) {
      const l = example(name);
      const a = analyseConstraint(l);
      for (const m of a.freeMotions) {
        for (const c of l.contacts) {
          const t = m.twist[c.body];
          const n = c.normal;
          const p = c.point;
          const pxn = [p[1] * n[2] - p[2] * n[1], p[2] * n[0] - p[0] * n[2], p[0] * n[1] - p[1] * n[0]];
          const scaleRef = Math.hypot(...t.v) + Math.hypot(...t.omega) * a.length * 10;
          expect(
            Math.abs(n[0] * t.v[0] + n[1] * t.v[1] + n[2] * t.v[2] + pxn[0] * t.omega[0] + pxn[1] * t.omega[1] + pxn[2] * t.omega[2]) / scaleRef,
          ).toBeLessThan(1e-9);
        }
      }
    }
  });

  it("point of a rotation axis nearest the origin is ω × v / |ω|² (reference-checks.md) and the report gives the one nearest the centroid", () => {
    const l = example("detector-sled-hidden-count");
    const a = analyseConstraint(l);
    const m = a.freeMotions[0];
    const { omega, v } = m.twist["detector-sled"];
    const w2 = omega[0] ** 2 + omega[1] ** 2 + omega[2] ** 2;
    const nearOrigin = [omega[1] * v[2] - omega[2] * v[1], omega[2] * v[0] - omega[0] * v[2], omega[0] * v[1] - omega[1] * v[0]].map((x) => x / w2);
    // the axis is vertical through (80, 40): where the end-stop line (y = 40) and the side-rail line (x = 80) cross [D]
    expect(nearOrigin[0]).toBeCloseTo(80, 9);
    expect(nearOrigin[1]).toBeCloseTo(40, 9);
    expect(m.screws["detector-sled"].point).toEqual([expect.closeTo(80, 9), expect.closeTo(40, 9), expect.closeTo(a.centroid[2], 9)]);
  });

  it("the characteristic length is reported and the moment columns are scaled by it (reference-checks.md: rank with mixed units needs one) [C: conventional]", () => {
    const a = analyseConstraint(
      makeLayout(
        legs([
          [0, 0],
          [600, 0],
          [600, 450],
          [0, 450],
        ]),
      ),
    );
    expect(a.length).toBeCloseTo(375, 12); // half the diagonal: sqrt(300² + 225²)
    expect(a.centroid).toEqual([300, 225, 0]);
    // rows [y′/L, −x′/L, 0, 0, 0, 1]: AᵀA = diag(Σy′²/L², Σx′²/L², 4) = diag(1.44, 2.56, 4), so σ = 1.2, 1.6, 2 and σ_r/σ_max = 0.6 [D]
    expect(a.conditioning).toBeCloseTo(0.6, 12);
  });
});
