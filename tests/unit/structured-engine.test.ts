/**
 * The structured engine (analysis.md §12: block Cholesky on the body graph, Lanczos, subspace iteration,
 * row-sequential QR for the self-stress pivots) against the dense reference (ml-matrix SVD of the whole
 * matrix) and against an independent package (numeric.js SVD) on seeded random layouts of 1–80 bodies:
 * chains and trees, generic and degenerate (parallel normals, lines through an axis, coplanar normals),
 * and near-singular ones whose smallest singular value sits a decade on either side of the tolerance.
 * Tolerances are the ones the issue sets: counts identical, free-motion subspace within 1e-8 (principal
 * angles), conditioning to 1e-9 relative, σ_max to 1e-12.
 */
import { describe, expect, it } from "vitest";
import numeric from "numeric";
import { Matrix, SingularValueDecomposition } from "ml-matrix";
import { analyseConstraint, type ConstraintAnalysis } from "@/lib/analysis/constraint";
import type { Layout } from "@/lib/layout/model";
import { randomLayout } from "../support/layouts";
import { generate } from "../support/instruments";

/** sin of the largest principal angle between the column spans of two orthonormal bases. */
function spanGap(P: Matrix, Q: Matrix): number {
  if (P.columns !== Q.columns) return Infinity;
  if (P.columns === 0) return 0;
  const R = Q.clone().sub(P.mmul(P.transpose().mmul(Q)));
  return Math.max(0, ...Array.from({ length: R.columns }, (_, c) => Math.hypot(...R.getColumn(c))));
}

function compare(layout: Layout, d: ConstraintAnalysis, s: ConstraintAnalysis, states = true): boolean {
  expect(s.method).toBe("structured");
  expect(s.counts).toEqual(d.counts);
  expect(spanGap(d.nullBasis, s.nullBasis)).toBeLessThan(1e-8);
  expect(Math.abs(s.conditioning - d.conditioning)).toBeLessThanOrEqual(1e-9 * Math.max(d.conditioning, 1e-300));
  expect(Math.abs(s.sigmaMax - d.sigmaMax)).toBeLessThanOrEqual(1e-12 * d.sigmaMax);
  expect(s.selfStressDimension).toBe(d.selfStressDimension);
  // canonical self-stress states, where they are well posed (every coefficient of the reference ≤ 1e3): on
  // ill-conditioned layouts the choice of pivots is itself delicate and the two paths may differ (issue #16)
  const wellPosed = states && d.selfStress.every((st) => Math.max(...Object.values(st.forces).map(Math.abs)) <= 1e3);
  if (wellPosed) {
    expect(s.selfStress.map((x) => x.pivot)).toEqual(d.selfStress.map((x) => x.pivot));
    s.selfStress.forEach((state, i) => {
      const ref = d.selfStress[i].forces;
      const max = Math.max(...Object.values(ref).map(Math.abs));
      for (const id of new Set([...Object.keys(ref), ...Object.keys(state.forces)])) {
        expect(Math.abs((state.forces[id] ?? 0) - (ref[id] ?? 0))).toBeLessThanOrEqual(1e-9 * max);
      }
    });
  }
  // the readable basis of §2 is read off the subspace; it agrees above, and the motions count the same
  expect(s.freeMotions.length).toBe(d.freeMotions.length);
  void layout;
  return wellPosed;
}

const sizes = [1, 2, 3, 5, 8, 13, 21, 34];

describe("structured engine agrees with the dense reference", () => {
  for (const bodies of sizes) {
    it(`random layouts of ${bodies} bodies (8 seeds each)`, () => {
      let statesCompared = 0;
      for (let seed = 1; seed <= 8; seed++) {
        const layout = randomLayout(9000 + 97 * bodies + seed, bodies);
        if (compare(layout, analyseConstraint(layout, "dense"), analyseConstraint(layout, "structured"))) statesCompared++;
      }
      // most random layouts have well-posed states: the comparison above must not be vacuous
      expect(statesCompared).toBeGreaterThanOrEqual(3);
    }, 120_000);
  }

  it("an 80-body layout", () => {
    const layout = randomLayout(4242, 80);
    compare(layout, analyseConstraint(layout, "dense"), analyseConstraint(layout, "structured"));
  }, 120_000);

  it("near-singular layouts: the smallest singular value a decade above and a decade below the tolerance", () => {
    for (let seed = 1; seed <= 12; seed++) {
      const base = randomLayout(700 + seed, 1 + (seed % 4));
      const ref = analyseConstraint(base, "dense");
      if (ref.conditioning === 0) continue;
      for (const factor of [0.1, 10]) {
        const layout = { ...base, tolerance: ref.conditioning * factor };
        const d = analyseConstraint(layout, "dense");
        const s = analyseConstraint(layout, "structured");
        // a singular value a decade from the threshold leaves the pivot choice delicate: states not compared
        compare(layout, d, s, false);
        if (factor < 1) expect(d.counts.rank).toBe(ref.counts.rank);
        else expect(d.counts.rank).toBeLessThan(ref.counts.rank);
      }
    }
  });
});

/** largest ‖P₁ Aᵀ s‖ / (σ_max ‖s‖) over the states, P₁ projecting out the free-motion space (analysis.md §2) */
function stateBalance(a: ConstraintAnalysis, contactIds: string[]): number {
  const A = a.A;
  const N = a.nullBasis;
  let worst = 0;
  for (const st of a.selfStress) {
    const s = Matrix.columnVector(contactIds.map((id) => st.forces[id] ?? 0));
    let f = A.transpose().mmul(s);
    f = f.sub(N.mmul(N.transpose().mmul(f)));
    worst = Math.max(worst, f.norm() / (a.sigmaMax * s.norm()));
  }
  return worst;
}

describe("structured engine on the bench's generated layouts (singular values crowding the threshold)", () => {
  // Regression: on these chains the self-stress solve once returned states that were not self-stresses (the
  // pseudo-inverse left the free-motion part of its residual in place), and the weakest direction stopped
  // at the fixed point of the squared matrix's factor (1e-7 from LAPACK's at 200 bodies). Reference: the
  // dense path (ml-matrix SVD of the whole matrix).
  for (const seed of [1, 2]) {
    it(`an 80-body generated chain (seed ${seed}): states, weakest direction and free motions as the dense path`, () => {
      const layout = generate(80, "chain", seed);
      const d = analyseConstraint(layout, "dense");
      const s = analyseConstraint(layout, "structured");
      // seed 1's states are well posed and compared coefficient by coefficient; seed 2 has coefficients past 1e3
      expect(compare(layout, d, s)).toBe(seed === 1);
      const ids = layout.contacts.map((c) => c.id);
      expect(stateBalance(s, ids)).toBeLessThan(1e-9);
      const [u, v] = [d.weakestDirection!.scaled, s.weakestDirection!.scaled];
      const dist = Math.min(Math.hypot(...u.map((x, i) => x - v[i])), Math.hypot(...u.map((x, i) => x + v[i])));
      expect(dist).toBeLessThan(1e-8);
    }, 120_000);
  }

  it("a 60-body generated mesh with ill-conditioned states (coefficients past 1e6): every state balances", () => {
    // the conjugate gradients of the state solve stall for a while on such basis rows before they converge
    const layout = generate(60, "mesh", 1);
    const s = analyseConstraint(layout, "structured");
    expect(s.selfStress.length).toBeGreaterThan(0);
    expect(
      stateBalance(
        s,
        layout.contacts.map((c) => c.id),
      ),
    ).toBeLessThan(1e-9);
  }, 120_000);

  it("a 60-body generated mesh whose free motion is a near-null direction: pivots taken modulo the free motions", () => {
    // in A itself a row can stand apart from the later ones only along the free motion (σ just under the
    // threshold); the self-stress space of §2 is taken modulo that motion, so such a row is a pivot
    const layout = generate(60, "mesh", 3);
    const d = analyseConstraint(layout, "dense");
    const s = analyseConstraint(layout, "structured");
    compare(layout, d, s, false);
    expect(s.selfStress.map((x) => x.pivot)).toEqual(d.selfStress.map((x) => x.pivot));
    expect(
      stateBalance(
        s,
        layout.contacts.map((c) => c.id),
      ),
    ).toBeLessThan(1e-9);
  }, 120_000);

  it("a 100-body generated mesh whose row QR cannot decide the pivots: the dense path's pivots, states that balance and are independent", () => {
    // Regression: here the basis rows the row QR kept were singular to working precision (ten singular values
    // of A_C below the threshold, checked with numpy), and two listed states came out unbalanced (residual 0.4
    // of the state). The canonical form is itself ill-posed (its pivot block is singular to round-off), so the
    // states are compared by what any answer must satisfy. Reference: the dense path (ml-matrix SVD, its pivot
    // rule on the orthonormal left null basis) and the dense path's own matrix and free motions for the balance.
    const layout = generate(100, "mesh", 5);
    const d = analyseConstraint(layout, "dense");
    const s = analyseConstraint(layout, "structured");
    expect(s.selfStress.map((x) => x.pivot)).toEqual(d.selfStress.map((x) => x.pivot));
    const ids = layout.contacts.map((c) => c.id);
    expect(stateBalance({ ...s, A: d.A, nullBasis: d.nullBasis } as ConstraintAnalysis, ids)).toBeLessThan(1e-9);
    // independent: the states, each scaled to unit length, have no singular value below 1e-6
    const S = new Matrix(s.selfStress.map((st) => ids.map((id) => st.forces[id] ?? 0)).map((r) => r.map((v) => v / Math.hypot(...r))));
    const sv = new SingularValueDecomposition(S.transpose(), { computeLeftSingularVectors: false, computeRightSingularVectors: false }).diagonal;
    expect(Math.min(...sv)).toBeGreaterThan(1e-6);
  }, 120_000);
});

describe("structured engine against an independent package (numeric.js SVD)", () => {
  it("rank and σ_max of 20 random layouts up to 34 bodies", () => {
    for (let seed = 1; seed <= 20; seed++) {
      const layout = randomLayout(31000 + seed, 1 + ((seed * 7) % 34));
      const s = analyseConstraint(layout, "structured");
      const A = s.A.to2DArray();
      // numeric.svd wants rows ≥ columns: the singular values of Aᵀ are those of A
      const tall = A.length >= A[0].length ? A : A[0].map((_, j) => A.map((r) => r[j]));
      const S: number[] = numeric.svd(tall).S.filter((x: number) => Number.isFinite(x));
      const max = Math.max(...S);
      expect(Math.abs(s.sigmaMax - max)).toBeLessThan(1e-10 * max);
      expect(s.counts.rank).toBe(S.filter((x) => x > layout.tolerance * max).length);
    }
  }, 120_000);
});
