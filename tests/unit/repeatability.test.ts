/**
 * Repeatability (analysis.md §11): the map from seat offsets to body twists recomputed with numeric.js
 * (an independent linear-algebra package), a seeded Monte Carlo of seat offsets, invariance, and a
 * hand-derived two-spring case. Sources beside each check.
 */
import { describe, expect, it } from "vitest";
import numeric from "numeric";
import { analyseLayout } from "@/lib/analysis";
import type { Layout, Vec3 } from "@/lib/layout/model";
import { rawLayout } from "../support/statics-layouts";
import { rng } from "../support/layouts";

const S2 = Math.SQRT1_2;

/** Ball–vee three-groove coupling (radial grooves), equal scatter s on every seat, one point above. */
function coupling(s: number | Record<string, number>, opts: { shift?: Vec3; scale?: number; unit?: "mm" | "um"; k?: number[] } = {}): Layout {
  const shift = opts.shift ?? [0, 0, 0];
  const f = opts.scale ?? 1;
  const contacts = [0, 1, 2].flatMap((k) => {
    const a = (2 * Math.PI * k) / 3;
    const g: Vec3 = [Math.cos(a), Math.sin(a), 0];
    const h: Vec3 = [-g[1], g[0], 0];
    return [1, -1].map((side, i) => {
      const out: Vec3 = [side * h[0] * S2, side * h[1] * S2, -S2];
      const id = `V${k + 1}${"ab"[i]}`;
      return {
        id,
        body: "plate",
        point: [0, 1, 2].map((j) => (80 * g[j] + 5 * out[j] + shift[j]) * f),
        normal: [-out[0], -out[1], -out[2]],
        scatter: (typeof s === "number" ? s : (s[id] ?? 0)) * f,
        ...(opts.k ? { stiffness: opts.k[2 * k + i] / f } : {}),
      };
    });
  });
  return rawLayout({
    units: { length: opts.unit ?? "mm", force: "N" },
    bodies: [{ id: "plate" }],
    contacts,
    points: [{ id: "mirror", body: "plate", point: [(30 + shift[0]) * f, (-10 + shift[1]) * f, (60 + shift[2]) * f] }],
  });
}

describe("repeatability: independent checks", () => {
  // the map G of §11 rebuilt from the unscaled J with numeric.js's pseudo-inverse (exactly constrained:
  // the twist is J⁻¹ δg whatever K), then the point covariance P G diag(s²) Gᵀ Pᵀ
  it("covariance agrees with numeric.js's inverse of J (independent package)", () => {
    const l = coupling({ V1a: 0.2e-3, V1b: 0.1e-3, V2a: 0.3e-3, V2b: 0.05e-3, V3a: 0.1e-3, V3b: 0.25e-3 });
    const rep = analyseLayout(l).repeatability!;
    const J = l.contacts.map((c) => {
      const n = numeric.div(c.normal, numeric.norm2(c.normal)) as number[];
      const p = c.point;
      return [p[1] * n[2] - p[2] * n[1], p[2] * n[0] - p[0] * n[2], p[0] * n[1] - p[1] * n[0], ...n];
    });
    const G = numeric.inv(J) as number[][];
    const q = l.points[0].point;
    // δq = v + ω × q = [−[q]× | I] t
    const P = [
      [0, q[2], -q[1], 1, 0, 0],
      [-q[2], 0, q[0], 0, 1, 0],
      [q[1], -q[0], 0, 0, 0, 1],
    ];
    const S = numeric.diag(l.contacts.map((c) => c.scatter! ** 2));
    const PG = numeric.dot(P, G) as number[][];
    const C = numeric.dot(numeric.dot(PG, S), numeric.transpose(PG)) as number[][];
    const sigmaUm = [0, 1, 2].map((i) => Math.sqrt(C[i][i]) * 1e3);
    sigmaUm.forEach((v, i) => expect(rep.points.mirror.sigmaUm[i]).toBeCloseTo(v, 10));
    const eig = numeric.eig(C);
    const semi = (eig.lambda.x as number[]).map((v) => Math.sqrt(Math.max(0, v)) * 1e3).sort((a, b) => b - a);
    semi.forEach((v, i) => expect(rep.points.mirror.semiAxesUm[i]).toBeCloseTo(v, 9));
  });

  // seeded Monte Carlo of normal seat offsets through the linear model: with n = 40 000 samples the
  // sample variance of each axis has a relative standard error √(2/n) ≈ 0.7 %; we allow 4 % (≈ 5.6 SE)
  it("a seeded Monte Carlo of seat offsets agrees within the sampling error", () => {
    const scat = { V1a: 0.2e-3, V1b: 0.1e-3, V2a: 0.3e-3, V2b: 0.05e-3, V3a: 0.1e-3, V3b: 0.25e-3 };
    const l = coupling(scat);
    const a = analyseLayout(l);
    const rep = a.repeatability!.points.mirror;
    const r = rng(42);
    const gauss = () => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
    const n = 40000;
    const sum = [0, 0, 0];
    const sq = [0, 0, 0];
    const J = l.contacts.map((c) => {
      const nn = numeric.div(c.normal, numeric.norm2(c.normal)) as number[];
      const p = c.point;
      return [p[1] * nn[2] - p[2] * nn[1], p[2] * nn[0] - p[0] * nn[2], p[0] * nn[1] - p[1] * nn[0], ...nn];
    });
    const LU = numeric.LU(J);
    const q = l.points[0].point;
    for (let i = 0; i < n; i++) {
      const g = l.contacts.map((c) => gauss() * c.scatter!);
      const t = numeric.LUsolve(LU, g) as number[];
      const d = [t[3] + t[1] * q[2] - t[2] * q[1], t[4] + t[2] * q[0] - t[0] * q[2], t[5] + t[0] * q[1] - t[1] * q[0]];
      for (let j = 0; j < 3; j++) {
        sum[j] += d[j];
        sq[j] += d[j] * d[j];
      }
    }
    for (let j = 0; j < 3; j++) {
      const varS = sq[j] / n - (sum[j] / n) ** 2;
      expect(Math.sqrt(varS) * 1e3).toBeGreaterThan(rep.sigmaUm[j] * 0.98);
      expect(Math.sqrt(varS) * 1e3).toBeLessThan(rep.sigmaUm[j] * 1.02);
    }
  });
});

describe("repeatability: three-ball coupling with equal scatter", () => {
  it("contributions sum to 1; invariant to moving the origin and to units", () => {
    const base = analyseLayout(coupling(0.1e-3)).repeatability!.points.mirror;
    const sum = Object.values(base.contributions).reduce((a, b) => a + b, 0);
    expect(sum).toBeCloseTo(1, 12);
    const moved = analyseLayout(coupling(0.1e-3, { shift: [500, -300, 40] })).repeatability!.points.mirror;
    const microns = analyseLayout(coupling(0.1e-3, { scale: 1000, unit: "um" })).repeatability!.points.mirror;
    for (const other of [moved, microns]) {
      for (let j = 0; j < 3; j++) {
        expect(other.sigmaUm[j]).toBeCloseTo(base.sigmaUm[j], 9);
        expect(other.semiAxesUm[j]).toBeCloseTo(base.semiAxesUm[j], 9);
      }
      for (const [id, v] of Object.entries(base.contributions)) expect(other.contributions[id]).toBeCloseTo(v, 9);
    }
  });

  it("a seat with zero scatter contributes nothing (left out)", () => {
    const rep = analyseLayout(coupling({ V1a: 0.1e-3, V1b: 0.1e-3, V2a: 0.1e-3, V2b: 0, V3a: 0.1e-3, V3b: 0.1e-3 })).repeatability!.points.mirror;
    expect(rep.contributions.V2b).toBeUndefined();
    expect(Object.keys(rep.contributions)).toHaveLength(5);
  });

  it("semi-axes descend, axes are unit and orthogonal with their largest component positive", () => {
    const rep = analyseLayout(coupling({ V1a: 0.2e-3, V1b: 0.1e-3, V2a: 0.3e-3, V2b: 0.05e-3, V3a: 0.1e-3, V3b: 0.25e-3 })).repeatability!.points.mirror;
    expect(rep.semiAxesUm[0]).toBeGreaterThanOrEqual(rep.semiAxesUm[1]);
    expect(rep.semiAxesUm[1]).toBeGreaterThanOrEqual(rep.semiAxesUm[2]);
    for (const ax of rep.axes) {
      expect(Math.hypot(...ax)).toBeCloseTo(1, 12);
      const big = ax.reduce((b, v, i) => (Math.abs(v) > Math.abs(ax[b]) ? i : b), 0);
      expect(ax[big]).toBeGreaterThan(0);
    }
    const d01 = rep.axes[0].reduce((s, v, i) => s + v * rep.axes[1][i], 0);
    expect(Math.abs(d01)).toBeLessThan(1e-10);
  });

  it("exactly constrained: independent of the contact stiffness", () => {
    const a = analyseLayout(coupling(0.1e-3)).repeatability!.points.mirror;
    const b = analyseLayout(coupling(0.1e-3, { k: [1e3, 5e4, 2e5, 7e3, 3e4, 9e5] })).repeatability!.points.mirror;
    for (let j = 0; j < 3; j++) expect(b.sigmaUm[j]).toBeCloseTo(a.sigmaUm[j], 10);
  });
});

describe("repeatability: over-constrained, two springs in parallel", () => {
  // derived: two rows on one line with stiffness k1, k2 and scatter s1, s2 place the body at the
  // stiffness-weighted mean, δx = (k1 δg1 + k2 δg2)/(k1 + k2), so σx² = (k1² s1² + k2² s2²)/(k1 + k2)²
  it("σ along the doubled line follows the stiffness-weighted mean (derived)", () => {
    const k1 = 3e4;
    const k2 = 1e4;
    const s1 = 0.2e-3;
    const s2 = 0.5e-3;
    const held = (id: string, p: number[], n: number[]) => ({ id, body: "slab", point: p, normal: n, sense: "bilateral", stiffness: 1e5, scatter: 0 });
    const l = rawLayout({
      bodies: [{ id: "slab" }],
      contacts: [
        { id: "X1", body: "slab", point: [0, 0, 0], normal: [1, 0, 0], sense: "bilateral", stiffness: k1, scatter: s1 },
        { id: "X2", body: "slab", point: [0, 0, 0], normal: [1, 0, 0], sense: "bilateral", stiffness: k2, scatter: s2 },
        held("Y1", [0, 0, 0], [0, 1, 0]),
        held("Y2", [100, 0, 0], [0, 1, 0]),
        held("Z1", [0, 0, 0], [0, 0, 1]),
        held("Z2", [100, 0, 0], [0, 0, 1]),
        held("Z3", [0, 100, 0], [0, 0, 1]),
      ],
      points: [{ id: "p", body: "slab", point: [0, 0, 0] }],
    });
    const rep = analyseLayout(l).repeatability!.points.p;
    const expected = Math.sqrt(k1 ** 2 * s1 ** 2 + k2 ** 2 * s2 ** 2) / (k1 + k2);
    expect(rep.sigmaUm[0]).toBeCloseTo(expected * 1e3, 10);
    expect(rep.contributions.X1 + rep.contributions.X2).toBeCloseTo(1, 12);
    expect(rep.contributions.X1).toBeCloseTo((k1 ** 2 * s1 ** 2) / (k1 ** 2 * s1 ** 2 + k2 ** 2 * s2 ** 2), 10);
  });

  it("null without scatter or without points", () => {
    const l = coupling(0);
    expect(analyseLayout(l).repeatability).toBeNull();
    const noPoints = coupling(0.1e-3);
    noPoints.points = [];
    expect(analyseLayout(noPoints).repeatability).toBeNull();
  });
});
