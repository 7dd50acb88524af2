/** Projection math of the drawing views: known points land where they should; the fit keeps everything inside. */
import { describe, expect, it } from "vitest";
import { fitPoints, project, scaleBarLength, toSvg, views } from "@/components/layout-views/projection";
import type { Vec3 } from "@/lib/layout/model";

const view = (n: string) => views.find((v) => v.name === n)!;

describe("projections", () => {
  const p: Vec3 = [10, 20, 30];
  it("plan drops z, front drops y, side drops x", () => {
    expect(project(p, view("plan"))).toEqual([10, 20]);
    expect(project(p, view("front"))).toEqual([10, 30]);
    expect(project(p, view("side"))).toEqual([20, 30]);
  });
  it("isometric: the three unit axes project to equal lengths √(2/3) (isometric projection, common drafting practice)", () => {
    for (const axis of [
      [1, 0, 0],
      [0, 1, 0],
      [0, 0, 1],
    ] as Vec3[]) {
      const [x, y] = project(axis, view("axonometric"));
      expect(Math.hypot(x, y)).toBeCloseTo(Math.sqrt(2 / 3), 12);
    }
    // the vertical stays vertical on the page
    expect(project([0, 0, 1], view("axonometric"))[0]).toBeCloseTo(0, 12);
  });
  it("the screen axes of every view are orthonormal", () => {
    for (const v of views) {
      const d = v.right[0] * v.up[0] + v.right[1] * v.up[1] + v.right[2] * v.up[2];
      expect(d).toBeCloseTo(0, 12);
      expect(Math.hypot(...v.right)).toBeCloseTo(1, 12);
      expect(Math.hypot(...v.up)).toBeCloseTo(1, 12);
    }
  });
});

describe("fit", () => {
  it("keeps every point inside the margins and flips y for SVG", () => {
    const pts: [number, number][] = [
      [0, 0],
      [600, 0],
      [600, 450],
      [0, 450],
      [300, 225],
    ];
    const f = fitPoints(pts, 400, 300, 20);
    for (const q of pts) {
      const [x, y] = toSvg(f, q);
      expect(x).toBeGreaterThanOrEqual(20 - 1e-9);
      expect(x).toBeLessThanOrEqual(380 + 1e-9);
      expect(y).toBeGreaterThanOrEqual(20 - 1e-9);
      expect(y).toBeLessThanOrEqual(280 + 1e-9);
    }
    expect(toSvg(f, [0, 450])[1]).toBeLessThan(toSvg(f, [0, 0])[1]);
  });
  it("survives a single point and collinear points", () => {
    const one = fitPoints([[5, 5]], 200, 200);
    expect(Number.isFinite(one.scale)).toBe(true);
    const line = fitPoints(
      [
        [0, 0],
        [100, 0],
      ],
      200,
      200,
      10,
    );
    const [x] = toSvg(line, [100, 0]);
    expect(x).toBeLessThanOrEqual(190 + 1e-9);
  });
  it("picks a 1-2-5 scale bar", () => {
    const f = fitPoints(
      [
        [0, 0],
        [600, 450],
      ],
      400,
      300,
      20,
    );
    expect([1, 2, 5].map((m) => [m, m * 10, m * 100]).flat()).toContain(scaleBarLength(f));
  });
});
