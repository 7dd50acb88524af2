/**
 * The constraint matrix and what its rank says (analysis.md §1–§2): counts, free motions as screws in a
 * readable basis, the canonical self-stress basis, conditioning and the least-constrained direction.
 */
import { Matrix, solve } from "ml-matrix";
import { GROUND, type Layout, type Vec3 } from "@/lib/layout/model";
import { alignBasis, columns, nullSpace, rankOf, svdRight } from "./linalg";
import type { SparseRows } from "./sparse/rows";
import { lowSpectrum } from "./sparse/spectrum";
import { minimumDegreeOrder } from "./sparse/cholesky";
import { canonicalStatesSparse } from "./sparse/self-stress";
import { cross, dot, norm, scale, sub, unit } from "./vec";

export interface Screw {
  kind: "translation" | "rotation" | "screw" | "still";
  direction: Vec3 | null;
  point: Vec3 | null;
  pitch: number | null;
}

export interface Motion {
  twist: Record<string, { omega: Vec3; v: Vec3 }>;
  screws: Record<string, Screw>;
  /** the scaled twist [L·ω; v + ω × c] per body, concatenated (unit length) */
  scaled: number[];
}

export interface SelfStressState {
  pivot: string;
  forces: Record<string, number>;
}

export interface ConstraintAnalysis {
  bodyIds: string[];
  centroid: Vec3;
  length: number;
  /** how the rank analysis was computed: dense SVD (small layouts, the reference) or structured (§12) */
  method: EngineMethod;
  /** the scaled constraint matrix, row by row (each row touches at most two bodies) */
  rows: SparseRows;
  /** the same matrix dense, m × 6N (built on first use; the dense path and the tests read it) */
  readonly A: Matrix;
  /** unit normals per contact, in contact order */
  normals: Vec3[];
  /** σ_max of the scaled matrix */
  sigmaMax: number;
  counts: { bodies: number; contacts: number; rank: number; freedoms: number; redundancies: number; grubler: number };
  conditioning: number;
  weakestDirection: Motion | null;
  freeMotions: Motion[];
  /** orthonormal basis of the free-motion space (scaled twists, columns) */
  nullBasis: Matrix;
  selfStressDimension: number;
  selfStress: SelfStressState[];
}

export type EngineMethod = "dense" | "structured";

/**
 * Layouts with more bodies than this go to the structured engine by default (the dense SVD's cost grows
 * with the cube). Its counts, free motions, conditioning, σ_max and canonical self-stress states agree with
 * the dense path (tests); where the canonical form is ill-posed (its pivot block singular to round-off) only
 * the pivots and the balance of each state can agree, so the dense path, the reference, stays the default
 * wherever it answers within the upload time-out.
 */
export const DENSE_MAX_BODIES = 80;

export const MAX_SELF_STRESS_LISTED = 50;
/** relative size below which a twist component counts as zero */
const ZERO = 1e-9;

/** Centroid of all contact points and the characteristic length L (1 when the points coincide or there are none). */
export function scaling(layout: Layout): { centroid: Vec3; length: number } {
  const m = layout.contacts.length;
  if (m === 0) return { centroid: [0, 0, 0], length: 1 };
  const c: Vec3 = [0, 0, 0];
  for (const k of layout.contacts) for (let i = 0; i < 3; i++) c[i] += k.point[i] / m;
  let sum = 0;
  for (const k of layout.contacts) sum += dot(sub(k.point, c), sub(k.point, c));
  const L = Math.sqrt(sum / m);
  const length = L > 0 ? L : 1;
  // round-off of the mean (e.g. 1e-15 for a symmetric layout) is shown as the zero it is
  const spread = Math.max(length, ...c.map(Math.abs));
  return { centroid: c.map((x) => (Math.abs(x) < 1e-12 * spread ? 0 : x)) as Vec3, length };
}

/** Builds the scaled rows: row i = [((pᵢ − c) × n̂ᵢ)ᵀ / L, n̂ᵢᵀ], + in body's columns, − in on's. */
export function buildRows(layout: Layout, bodyIndex: Map<string, number>, centroid: Vec3, L: number): { rows: SparseRows; normals: Vec3[] } {
  const m = layout.contacts.length;
  const N = bodyIndex.size;
  const rows: SparseRows = { m, N, n: 6 * N, b1: new Int32Array(m), b2: new Int32Array(m), v: new Float64Array(6 * m) };
  const normals: Vec3[] = [];
  layout.contacts.forEach((k, i) => {
    const n = unit(k.normal);
    normals.push(n);
    const mom = scale(cross(sub(k.point, centroid), n), 1 / L);
    rows.v.set([...mom, ...n], 6 * i);
    rows.b1[i] = k.body === GROUND ? -1 : bodyIndex.get(k.body)!;
    rows.b2[i] = k.on === GROUND ? -1 : bodyIndex.get(k.on)!;
  });
  return { rows, normals };
}

/** The dense m × 6N matrix of the rows (a row whose two bodies coincide cancels to zero). */
export function denseMatrix(R: SparseRows): Matrix {
  const A = new Matrix(R.m, R.n);
  for (let i = 0; i < R.m; i++) {
    for (const [b, sign] of [
      [R.b1[i], 1],
      [R.b2[i], -1],
    ] as const) {
      if (b < 0) continue;
      for (let j = 0; j < 6; j++) A.set(i, 6 * b + j, A.get(i, 6 * b + j) + sign * R.v[6 * i + j]);
    }
  }
  return A;
}

/** Presents one scaled twist (unit length) as per-body twists about the origin and screws. */
export function toMotion(scaled: number[], bodyIds: string[], c: Vec3, L: number): Motion {
  const len = Math.hypot(...scaled) || 1;
  let s = scaled.map((v) => v / len);
  let big = 0;
  for (const v of s) if (Math.abs(v) > Math.abs(big) + 1e-12) big = v;
  if (big < 0) s = s.map((v) => -v);
  const twist: Motion["twist"] = {};
  const screws: Motion["screws"] = {};
  bodyIds.forEach((id, b) => {
    const sw: Vec3 = [s[6 * b], s[6 * b + 1], s[6 * b + 2]];
    const sv: Vec3 = [s[6 * b + 3], s[6 * b + 4], s[6 * b + 5]];
    const omega = scale(sw, 1 / L);
    const vc = sv;
    const v = sub(vc, cross(omega, c));
    twist[id] = { omega: clean(omega), v: clean(v) };
    const wN = norm(sw);
    const vN = norm(sv);
    if (wN < ZERO && vN < ZERO) {
      screws[id] = { kind: "still", direction: null, point: null, pitch: null };
    } else if (wN < ZERO * Math.max(1, vN) * 10) {
      screws[id] = { kind: "translation", direction: clean(unit(sv)), point: null, pitch: null };
    } else {
      const w2 = dot(omega, omega);
      const pitch = dot(omega, v) / w2;
      const point = clean(sub(c, scale(cross(vc, omega), 1 / w2)));
      const isRotation = Math.abs(pitch) < 1e-7 * L;
      screws[id] = {
        kind: isRotation ? "rotation" : "screw",
        direction: clean(unit(omega)),
        point,
        pitch: isRotation ? 0 : pitch,
      };
    }
  });
  return { twist, screws, scaled: s };
}

function clean(v: Vec3): Vec3 {
  return v.map((x) => (Math.abs(x) < 1e-13 ? 0 : x)) as Vec3;
}

/** Runs the rank analysis of a validated layout: dense SVD for small layouts, the structured engine (§12) beyond. */
export function analyseConstraint(layout: Layout, method: EngineMethod = layout.bodies.length > DENSE_MAX_BODIES ? "structured" : "dense"): ConstraintAnalysis {
  const bodyIds = layout.bodies.map((b) => b.id);
  const bodyIndex = new Map(bodyIds.map((id, i) => [id, i]));
  const N = bodyIds.length;
  const m = layout.contacts.length;
  const { centroid, length } = scaling(layout);
  const { rows, normals } = buildRows(layout, bodyIndex, centroid, length);
  const n = 6 * N;
  let dense: Matrix | null = null;
  const lazyA = () => (dense ??= denseMatrix(rows));
  const common = { bodyIds, centroid, length, rows, normals, method };

  if (method === "structured") {
    const ones = new Float64Array(m).fill(1);
    const spec = lowSpectrum(rows, ones, layout.tolerance, zeroColumns(rows));
    const r = spec.rank;
    const nullBasis = new Matrix(n, spec.nullBasis.length);
    spec.nullBasis.forEach((z, c) => nullBasis.setColumn(c, Array.from(z)));
    const redundancies = m - r;
    const selfStress =
      redundancies > 0
        ? canonicalStatesSparse(
            rows,
            layout.contacts.map((k) => k.id),
            spec,
            minimumDegreeOrder(rows, ones),
            layout.tolerance,
          )
        : [];
    return withDense(
      {
        ...common,
        sigmaMax: spec.sigmaMax,
        counts: { bodies: N, contacts: m, rank: r, freedoms: n - r, redundancies, grubler: 6 * N - m },
        conditioning: r === 0 || !spec.weakest ? 0 : spec.weakest.sigma / spec.sigmaMax,
        weakestDirection: r === 0 || !spec.weakest ? null : toMotion(Array.from(spec.weakest.vector), bodyIds, centroid, length),
        freeMotions: readableMotions(nullBasis, N).map((col) => toMotion(col, bodyIds, centroid, length)),
        nullBasis,
        selfStressDimension: redundancies,
        selfStress,
      },
      lazyA,
    );
  }

  const A = lazyA();
  const right = svdRight(A);
  const s = right.s;
  const r = rankOf(s, layout.tolerance);
  const freedoms = n - r;
  const redundancies = m - r;
  const conditioning = r === 0 ? 0 : s[r - 1] / s[0];
  const weakestDirection = r === 0 ? null : toMotion(right.V.getColumn(r - 1), bodyIds, centroid, length);

  const nullBasis = columns(right.V, r, n);
  const freeMotions = readableMotions(nullBasis, N).map((col) => toMotion(col, bodyIds, centroid, length));

  // Left null space from the SVD of Aᵀ (same singular values, so the same rank r). With no redundancy
  // (r = m, every exactly constrained mount) it is empty, and the second SVD is skipped.
  const selfStressBasis = m === 0 ? new Matrix(0, 0) : redundancies === 0 ? new Matrix(m, 0) : nullSpace(A.transpose(), r);
  const selfStress = canonicalSelfStress(
    selfStressBasis,
    layout.contacts.map((k) => k.id),
  );

  return withDense(
    {
      ...common,
      sigmaMax: s[0] ?? 0,
      counts: { bodies: N, contacts: m, rank: r, freedoms, redundancies, grubler: 6 * N - m },
      conditioning,
      weakestDirection,
      freeMotions,
      nullBasis,
      selfStressDimension: redundancies,
      selfStress,
    },
    lazyA,
  );
}

/** Adds the dense matrix as a property built on first read (and left out of JSON). */
function withDense(a: Omit<ConstraintAnalysis, "A">, dense: () => Matrix): ConstraintAnalysis {
  return Object.defineProperty(a, "A", { get: dense, enumerable: false }) as ConstraintAnalysis;
}

/** Columns no row touches (bodies without contacts): a lower bound on the null dimension. */
function zeroColumns(R: SparseRows): number {
  const touched = new Uint8Array(R.N);
  for (let i = 0; i < R.m; i++) {
    if (R.b1[i] >= 0) touched[R.b1[i]] = 1;
    if (R.b2[i] >= 0) touched[R.b2[i]] = 1;
  }
  return 6 * touched.reduce((s, t) => s + (t ? 0 : 1), 0);
}

/**
 * A readable basis of the free-motion space: pure translations first (the part of the space with no
 * rotation, axes closest to coordinate directions), then the rest with rotation axes closest to
 * coordinate directions, kept orthogonal to the translations (which puts each axis as near the centroid
 * as the space allows and removes pitch that a free translation along the axis would explain).
 */
function readableMotions(Nb: Matrix, N: number): number[][] {
  const f = Nb.columns;
  if (f === 0) return [];
  const omegaRows: number[] = [];
  const vRows: number[] = [];
  for (let b = 0; b < N; b++)
    for (let j = 0; j < 3; j++) {
      omegaRows.push(6 * b + j);
      vRows.push(6 * b + 3 + j);
    }
  const Nw = Nb.selection(omegaRows, [...Array(f).keys()]);
  const { s: sw, V: Vw } = svdRight(Nw);
  const rw = rankOf(sw, 1e-8);
  const Zt = columns(Vw, rw, f);
  const Zr = columns(Vw, 0, rw);
  const out: number[][] = [];
  if (Zt.columns > 0) {
    const T = Nb.mmul(Zt);
    const aligned = alignBasis(T, vRows);
    for (let c = 0; c < aligned.columns; c++) out.push(aligned.getColumn(c));
  }
  if (Zr.columns > 0) {
    const R = Nb.mmul(Zr);
    const Rw = R.selection(omegaRows, [...Array(R.columns).keys()]);
    // orthonormal basis of the ω column space (left singular vectors of Rw), aligned with coordinate axes
    // U = Rw V Σ⁻¹ from the SVD of Rw itself (3N × k, k small): the SVD of its transpose would pad to 3N × 3N
    const rsvd = svdRight(Rw);
    const Qn = Rw.mmul(columns(rsvd.V, 0, Rw.columns));
    for (let c = 0; c < Qn.columns; c++) {
      const sc = rsvd.s[c];
      Qn.setColumn(
        c,
        Qn.getColumn(c).map((v) => v / sc),
      );
    }
    const targets = alignBasis(Qn, [...omegaRows.keys()]);
    const pinv = pseudoInverse(Rw);
    const rotations: number[][] = [];
    for (let c = 0; c < targets.columns; c++) {
      const x = pinv.mmul(Matrix.columnVector(targets.getColumn(c)));
      rotations.push(R.mmul(x).getColumn(0));
    }
    // rotations (pitch ≈ 0) before screws, keeping the axis order otherwise
    const pitchOf = (t: number[]) => {
      let num = 0;
      let den = 0;
      for (let b = 0; b < N; b++)
        for (let j = 0; j < 3; j++) {
          num += t[6 * b + j] * t[6 * b + 3 + j];
          den += t[6 * b + j] ** 2;
        }
      return Math.abs(num) / Math.max(den, 1e-300);
    };
    rotations.sort((a, b) => Number(pitchOf(a) > 1e-7) - Number(pitchOf(b) > 1e-7));
    out.push(...rotations);
  }
  return out;
}

function pseudoInverse(M: Matrix): Matrix {
  // M has full column rank here: (MᵀM)⁻¹Mᵀ through the SVD for stability
  const { s, V } = svdRight(M);
  const k = M.columns;
  const Vk = columns(V, 0, k);
  const U = M.mmul(Vk);
  for (let c = 0; c < k; c++)
    U.setColumn(
      c,
      U.getColumn(c).map((v) => v / (s[c] * s[c])),
    );
  return Vk.mmul(U.transpose());
}

/**
 * The canonical self-stress basis of analysis.md §2: the reduced row-echelon form of the self-stress
 * space with contacts in sorted-id order; coefficients below 1e-9 of a state's largest set to zero.
 *
 * Computed without Gauss–Jordan sweeps (which lose accuracy when a pivot is small): the pivot
 * contacts are the first contacts, in sorted order, whose rows of the orthonormal basis Y are
 * independent of the earlier ones (Gram–Schmidt residual above 1e-8); then R = (Y_Pᵀ)⁻¹ Yᵀ, which is
 * the RREF exactly (R[:, P] = I, and every earlier non-pivot column is a combination of earlier pivots).
 */
export function canonicalSelfStress(Y: Matrix, contactIds: string[]): SelfStressState[] {
  const k = Y.columns;
  if (k === 0) return [];
  const order = contactIds.map((id, i) => [id, i] as const).sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  const basis: number[][] = [];
  const pivots: number[] = [];
  for (let j = 0; j < order.length && pivots.length < k; j++) {
    const y = Y.getRow(order[j][1]);
    const res = y.slice();
    for (let pass = 0; pass < 2; pass++) {
      for (const b of basis) {
        let d = 0;
        for (let c = 0; c < k; c++) d += b[c] * res[c];
        for (let c = 0; c < k; c++) res[c] -= d * b[c];
      }
    }
    const len = Math.hypot(...res);
    if (len > 1e-8) {
      basis.push(res.map((v) => v / len));
      pivots.push(j);
    }
  }
  const sortedYt = new Matrix(k, order.length);
  order.forEach(([, i], j) => sortedYt.setColumn(j, Y.getRow(i)));
  const YPt = new Matrix(k, pivots.length);
  pivots.forEach((j, c) => YPt.setColumn(c, sortedYt.getColumn(j)));
  const R = solve(YPt, sortedYt);
  const states: SelfStressState[] = [];
  for (let si = 0; si < Math.min(pivots.length, MAX_SELF_STRESS_LISTED); si++) {
    const row = R.getRow(si);
    pivots.forEach((pj, c) => (row[pj] = c === si ? 1 : 0));
    const max = Math.max(...row.map(Math.abs));
    const forces: Record<string, number> = {};
    row.forEach((v, j) => {
      if (Math.abs(v) >= 1e-9 * max) forces[order[j][0]] = v;
    });
    states.push({ pivot: order[pivots[si]][0], forces });
  }
  return states;
}
