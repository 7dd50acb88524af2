/**
 * Cross-check of the engine against an independent general-purpose linear-algebra package (numeric.js,
 * a different SVD implementation from the engine's ml-matrix) on 520 seeded random layouts, single- and
 * multi-body (up to 20 bodies), including degenerate ones built on purpose: rank, null space and left
 * null space, and the constraint matrix itself rebuilt from the formulas of analysis.md §1.
 */
import { describe, expect, it } from "vitest";
import numeric from "numeric";
import { analyseConstraint } from "@/lib/analysis/constraint";
import type { Layout } from "@/lib/layout/model";
import { randomLayout } from "../support/layouts";

type M = number[][];

/** The scaled matrix straight from analysis.md §1, written independently of the engine. */
function referenceMatrix(l: Layout): M {
  const m = l.contacts.length;
  const c = [0, 1, 2].map((j) => l.contacts.reduce((s, k) => s + k.point[j], 0) / m);
  const L = Math.sqrt(l.contacts.reduce((s, k) => s + (k.point[0] - c[0]) ** 2 + (k.point[1] - c[1]) ** 2 + (k.point[2] - c[2]) ** 2, 0) / m) || 1;
  const idx = new Map(l.bodies.map((b, i) => [b.id, i]));
  return l.contacts.map((k) => {
    const len = Math.hypot(...k.normal);
    const n = k.normal.map((x) => x / len);
    const r = k.point.map((x, j) => x - c[j]);
    const mom = [r[1] * n[2] - r[2] * n[1], r[2] * n[0] - r[0] * n[2], r[0] * n[1] - r[1] * n[0]].map((x) => x / L);
    const row = new Array(6 * l.bodies.length).fill(0);
    const put = (id: string, s: number) => {
      if (id === "ground") return;
      const b = idx.get(id)!;
      [...mom, ...n].forEach((v, j) => (row[6 * b + j] += s * v));
    };
    put(k.body, 1);
    put(k.on, -1);
    return row;
  });
}

const transpose = (A: M, cols: number): M => Array.from({ length: cols }, (_, j) => A.map((r) => r[j]));
const maxAbsDiff = (A: M, B: M) => Math.max(0, ...A.flatMap((r, i) => r.map((v, j) => Math.abs(v - B[i][j]))));

/**
 * numeric.svd needs rows ≥ columns and is used here only on such matrices (zero-row padding makes it
 * return NaN on rank-deficient input). Returns σ descending and the matching columns of U and V.
 */
function svdTall(A: M): { S: number[]; U: M; V: M } {
  // numeric.svd occasionally returns NaN for a singular value (a square root of a rounding-negative
  // number); a row permutation leaves σ and V unchanged and permutes U's rows, so retry with one.
  let S: number[] = [];
  let U: M = [];
  let V: M = [];
  for (let shift = 0; shift < A.length; shift++) {
    const perm = A.map((_, i) => (i + shift) % A.length);
    const res = numeric.svd(perm.map((i) => A[i].slice()));
    if (res.S.every((x: number) => Number.isFinite(x))) {
      S = res.S;
      V = res.V;
      U = new Array(A.length);
      perm.forEach((src, row) => (U[src] = res.U[row]));
      break;
    }
  }
  if (!S.length) throw new Error("numeric.svd failed on every row order");
  const order = S.map((s: number, i: number) => [s, i])
    .sort((a: number[], b: number[]) => b[0] - a[0])
    .map((x: number[]) => x[1]);
  const pick = (X: M) => X.map((row) => order.map((i: number) => row[i]));
  return { S: order.map((i: number) => S[i]), U: pick(U), V: pick(V) };
}

/** σ, and orthonormal bases of the row space and column space of A (m × n), by numeric.js. */
function spaces(A: M, m: number, n: number, tol: number) {
  const tall = m >= n;
  const { S, U, V } = svdTall(tall ? A : transpose(A, n));
  const r = S.filter((s) => s > tol * S[0]).length;
  const firstCols = (X: M) => X.map((row) => row.slice(0, r));
  return { S, r, row: firstCols(tall ? V : U), col: firstCols(tall ? U : V) };
}

/** Projector onto the complement of span(B) (B: dim × r with orthonormal columns). */
function complementProjector(B: M, dim: number): M {
  return Array.from({ length: dim }, (_, i) => Array.from({ length: dim }, (_, j) => (i === j ? 1 : 0) - B[i].reduce((s, v, k) => s + v * B[j][k], 0)));
}

/** Projector onto the span of k vectors of length dim (k ≤ dim). */
function spanProjector(vectors: M, dim: number): M {
  const { S, U } = svdTall(transpose(vectors, dim));
  const keep = S.filter((s) => s > 1e-9 * S[0]).length;
  return Array.from({ length: dim }, (_, i) => Array.from({ length: dim }, (_, j) => U[i].slice(0, keep).reduce((s, v, k) => s + v * U[j][k], 0)));
}

/**
 * A layout whose singular values sit in the band around the rank threshold has no well-defined rank
 * (both libraries are right within rounding); such layouts are checked only for a rank inside the band.
 */
const clearGap = (S: number[], r: number, tol: number) => (r === 0 || S[r - 1] / S[0] > 10 * tol) && (r >= S.length || S[r] / S[0] < tol / 10);

const tally = { clear: 0, banded: 0 };

describe("engine vs numeric.js on 600 seeded random layouts", () => {
  const seeds = Array.from({ length: 600 }, (_, i) => i);
  const batches = Array.from({ length: 15 }, (_, b) => seeds.slice(b * 40, b * 40 + 40));
  it.each(batches.map((b, i) => [i, b] as const))("batch %i", (_i, batch) => {
    for (const seed of batch) {
      const bodies = 1 + (seed % 20);
      const l = randomLayout(1000 + seed, bodies);
      const a = analyseConstraint(l);
      const n = 6 * bodies;
      const m = l.contacts.length;
      const A = referenceMatrix(l);
      expect(maxAbsDiff(a.A.to2DArray(), A)).toBeLessThan(1e-12);

      const ref = spaces(A, m, n, l.tolerance);
      const r = ref.r;
      if (!clearGap(ref.S, r, l.tolerance)) {
        tally.banded++;
        const lo = ref.S.filter((s) => s > 10 * l.tolerance * ref.S[0]).length;
        const hi = ref.S.filter((s) => s > (l.tolerance / 10) * ref.S[0]).length;
        expect(a.counts.rank).toBeGreaterThanOrEqual(lo);
        expect(a.counts.rank).toBeLessThanOrEqual(hi);
        continue;
      }
      tally.clear++;
      expect(a.counts.rank, `seed ${seed}`).toBe(r);
      expect(a.counts.freedoms).toBe(n - r);
      expect(a.counts.redundancies).toBe(m - r);
      if (r > 0) expect(a.conditioning).toBeCloseTo(ref.S[r - 1] / ref.S[0], 9);

      // null space: the engine's free motions span the complement of numeric's row space
      const nullEng = a.freeMotions.map((mo) => mo.scaled);
      expect(nullEng).toHaveLength(n - r);
      if (n - r > 0) expect(maxAbsDiff(spanProjector(nullEng, n), complementProjector(ref.row, n)), `seed ${seed}`).toBeLessThan(1e-8);

      // left null space: the canonical self-stress states span the complement of numeric's column space
      expect(a.selfStressDimension).toBe(m - r);
      if (m - r > 0 && m - r <= 50) {
        const ids = l.contacts.map((k) => k.id);
        const states = a.selfStress.map((s) => ids.map((id) => s.forces[id] ?? 0));
        expect(states).toHaveLength(m - r);
        expect(maxAbsDiff(spanProjector(states, m), complementProjector(ref.col, m)), `seed ${seed}`).toBeLessThan(1e-6);
      }
    }
  });

  it("checked at least 500 layouts with a clear rank gap, single- and multi-body", () => {
    expect(tally.clear).toBeGreaterThanOrEqual(500);
    expect(tally.clear + tally.banded).toBe(600);
  });
});
