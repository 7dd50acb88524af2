/**
 * Seating, load sharing, lift-off, Hertz stress, foundation coupling and functional-point motion
 * (analysis.md §3–§5). Everything is solved on the scaled constraint matrix A of §1: a scaled twist
 * s = [L·ω; v + ω × c] pairs with the scaled wrench w = [M_c / L; F] (M_c the moment about c), so
 * A s gives normal separations and Aᵀλ + w = 0 is equilibrium. Lengths and forces are in file units.
 */
import { Matrix } from "ml-matrix";
import { GROUND, type Layout, type Vec3 } from "@/lib/layout/model";
import { metresPer, newtonsPer } from "@/lib/layout/units";
import { builtinMaterials } from "@/lib/layout/materials";
import type { ConstraintAnalysis } from "./constraint";
import { svdRight, rankOf } from "./linalg";
import { hertzContact, type HertzResult } from "./hertz";
import { add, cross, scale, sub } from "./vec";

export type StiffnessSource = "file" | "hertz" | "equal" | "none";

export interface HertzEntry {
  semiMajor: number;
  semiMinor: number;
  maxPressureMPa: number;
  approachUm: number;
  stiffness: number;
  /** lower allowable maximum pressure of the two materials, MPa (null when neither gives one) */
  allowableMPa: number | null;
  ellipticity: number;
}

export interface SeatingResult {
  forces: Record<string, number> | null;
  liftOff: string[];
  stiffness: StiffnessSource;
  margin: number | null;
}

export interface CaseResult {
  id: string;
  gravity: Vec3;
  /** true when some load has a component along a free motion of the (active) support */
  driven: boolean;
  seating: SeatingResult | null;
  /** seats that carry nothing (the part rocks on them) */
  unloaded: string[];
  hertz: Record<string, HertzEntry>;
  /** per-contact force in contact order (null when not solved) */
  force: number[] | null;
  active: boolean[];
  /** scaled displacement under the seated load from contact compliance (null when no stiffness magnitude) */
  displacement: number[] | null;
  /** tangent stiffness per contact, file units (null when unknown) */
  tangent: number[] | null;
}

export interface FoundationResult {
  sensitivity: Record<string, Record<string, number>>;
  maxPerMicrometre: number;
  /** response to each self-stress state scaled to 1 µm of support warp */
  warp: { pivot: string; forces: Record<string, number> }[];
  stiffness: StiffnessSource;
}

export interface PointMotion {
  /** displacement of the point (µm) per 1 µm rise of each ground support */
  perMicrometre: Record<string, Vec3>;
  /** displacement under the first case's seated load from contact compliance (µm), or null */
  seatedUm: Vec3 | null;
  body: string;
}

export interface StaticsResult {
  hasLoad: boolean;
  stiffnessSource: StiffnessSource;
  /** per row, when every row (contact or flexure) has a file stiffness */
  fileStiffness: number[] | null;
  cases: CaseResult[];
  foundation: FoundationResult | null;
  points: Record<string, PointMotion>;
}

const LIFT = 1e-9;

interface Ctx {
  layout: Layout;
  c: ConstraintAnalysis;
  m: number;
  n: number;
  toMetre: number;
  toNewton: number;
  bodyIndex: Map<string, number>;
  materials: Map<string, { E?: number; nu?: number; allowable?: number }>;
}

function materialTable(layout: Layout) {
  const map = new Map<string, { E?: number; nu?: number; allowable?: number }>();
  for (const m of [...builtinMaterials, ...layout.materials]) {
    map.set(m.id, { E: m.youngsModulusGPa === undefined ? undefined : m.youngsModulusGPa * 1e9, nu: m.poissonRatio, allowable: m.allowableContactPressureMPa });
  }
  return map;
}

/** A contact's Hertz data is usable when both materials give Young's modulus and Poisson's ratio. */
export function hertzUsable(layout: Layout, contact: Layout["contacts"][number]): boolean {
  if (!contact.hertz) return false;
  return contact.hertz.materials.every((id) => {
    const m = layout.materials.find((x) => x.id === id) ?? builtinMaterials.find((x) => x.id === id);
    return m?.youngsModulusGPa !== undefined && m.poissonRatio !== undefined;
  });
}

/** Scaled wrench of one load case (file force units). */
function caseWrench(ctx: Ctx, gravity: Vec3, loadIds: string[] | undefined): number[] {
  const { layout, c } = ctx;
  const w = new Array<number>(ctx.n).fill(0);
  const addForce = (body: string, F: Vec3, p: Vec3, M: Vec3 = [0, 0, 0]) => {
    const b = ctx.bodyIndex.get(body)!;
    const Mc = add(cross(sub(p, c.centroid), F), M);
    for (let j = 0; j < 3; j++) {
      w[6 * b + j] += Mc[j] / c.length;
      w[6 * b + 3 + j] += F[j];
    }
  };
  for (const body of layout.bodies) {
    if (body.mass === undefined || !body.centerOfMass) continue;
    addForce(body.id, scale(gravity, body.mass / ctx.toNewton), body.centerOfMass);
  }
  for (const load of layout.loads) {
    if (loadIds && !loadIds.includes(load.id)) continue;
    addForce(load.body, load.force, load.point, load.moment ?? [0, 0, 0]);
  }
  return w;
}

interface Solve {
  u: number[];
  lambda: number[];
  driven: boolean;
}

interface Factor {
  k: number[];
  rows: number[];
  s: number[];
  V: Matrix;
  r: number;
}

/** The SVD of K^½ A over the active contacts: factor once, solve for many load vectors. */
function factorStiff(ctx: Ctx, k: number[], active: boolean[]): Factor {
  const rows = active.map((a, i) => (a ? i : -1)).filter((i) => i >= 0);
  const B = new Matrix(Math.max(rows.length, 1), ctx.n);
  rows.forEach((i, r) => {
    const sk = Math.sqrt(k[i]);
    for (let j = 0; j < ctx.n; j++) B.set(r, j, sk * ctx.c.A.get(i, j));
  });
  const { s, V } = svdRight(B);
  return { k, rows, s, V, r: rankOf(s, ctx.layout.tolerance) };
}

/** u = (AᵀKA)⁺ w over the active contacts, λ = −K A u; `driven` when w has a part along a free motion. */
function solveStiff(ctx: Ctx, k: number[], active: boolean[], w: number[]): Solve {
  return solveWith(ctx, factorStiff(ctx, k, active), w);
}

function solveWith(ctx: Ctx, f: Factor, w: number[]): Solve {
  const { k, rows, s, V, r } = f;
  // u = V Σ⁻² Vᵀ w on the kept singular directions, then iterative refinement
  // (r = P w − BᵀB u) to bring the equilibrium residual down to rounding
  const applyPinv = (rhs: number[]): number[] => {
    const out = new Array<number>(ctx.n).fill(0);
    for (let j = 0; j < r; j++) {
      let d = 0;
      for (let q = 0; q < ctx.n; q++) d += V.get(q, j) * rhs[q];
      d /= s[j] * s[j];
      for (let q = 0; q < ctx.n; q++) out[q] += d * V.get(q, j);
    }
    return out;
  };
  const project = (vec: number[]): number[] => {
    const out = new Array<number>(ctx.n).fill(0);
    for (let j = 0; j < r; j++) {
      let d = 0;
      for (let q = 0; q < ctx.n; q++) d += V.get(q, j) * vec[q];
      for (let q = 0; q < ctx.n; q++) out[q] += d * V.get(q, j);
    }
    return out;
  };
  const u = applyPinv(w);
  // part of the load along the null space of the active support
  const wNorm = Math.hypot(...w);
  let along = 0;
  for (let j = r; j < ctx.n; j++) {
    let d = 0;
    for (let q = 0; q < ctx.n; q++) d += V.get(q, j) * w[q];
    along = Math.max(along, Math.abs(d));
  }
  const lambda = new Array<number>(ctx.m).fill(0);
  const applyKA = (du: number[], sign: number) => {
    for (const i of rows) {
      let au = 0;
      for (let q = 0; q < ctx.n; q++) au += ctx.c.A.get(i, q) * du[q];
      lambda[i] += sign * k[i] * au;
    }
  };
  applyKA(u, -1);
  // iterative refinement on the forces themselves: res = Aᵀλ + P w, δu = (AᵀKA)⁺ res, λ −= K A δu
  // (recomputing λ from a refined u cannot beat the rounding of A u when u is large)
  const target = project(w);
  for (let step = 0; step < 3; step++) {
    const res = target.slice();
    for (const i of rows) if (lambda[i] !== 0) for (let q = 0; q < ctx.n; q++) res[q] += ctx.c.A.get(i, q) * lambda[i];
    const du = applyPinv(res);
    for (let q = 0; q < ctx.n; q++) u[q] += du[q];
    applyKA(du, -1);
  }
  return { u, lambda, driven: wNorm > 0 && along / wNorm > 1e-9 };
}

/** Normal separation (A u)_i of one contact. */
function separation(ctx: Ctx, i: number, u: number[]): number {
  let au = 0;
  for (let q = 0; q < ctx.n; q++) au += ctx.c.A.get(i, q) * u[q];
  return au;
}

/** The active-set loop of analysis.md §3 for one stiffness vector. */
function activeSet(ctx: Ctx, k: number[], w: number[], start?: boolean[]): { solve: Solve; active: boolean[] } {
  const { layout } = ctx;
  const active = start ? start.slice() : new Array<boolean>(ctx.m).fill(true);
  let solve = solveStiff(ctx, k, active, w);
  for (let iter = 0; iter < 4 * ctx.m + 10; iter++) {
    if (solve.driven) break;
    const max = Math.max(...solve.lambda.map(Math.abs), 0);
    let worst = -1;
    for (let i = 0; i < ctx.m; i++) {
      if (!active[i] || layout.contacts[i].sense !== "unilateral") continue;
      if (solve.lambda[i] < -LIFT * max && (worst < 0 || solve.lambda[i] < solve.lambda[worst])) worst = i;
    }
    if (worst >= 0) {
      active[worst] = false;
      solve = solveStiff(ctx, k, active, w);
      continue;
    }
    const scaleU = Math.max(...solve.u.map(Math.abs), 1e-300);
    let readded = false;
    for (let i = 0; i < ctx.m; i++) {
      if (!active[i] && separation(ctx, i, solve.u) < -1e-9 * scaleU) {
        active[i] = true;
        readded = true;
      }
    }
    if (!readded) break;
    solve = solveStiff(ctx, k, active, w);
  }
  return { solve, active };
}

function hertzAt(ctx: Ctx, i: number, forceFile: number): HertzResult | null {
  const h = ctx.layout.contacts[i].hertz;
  if (!h || !(forceFile > 0)) return null;
  const m1 = ctx.materials.get(h.materials[0])!;
  const m2 = ctx.materials.get(h.materials[1])!;
  if (m1.E === undefined || m1.nu === undefined || m2.E === undefined || m2.nu === undefined) return null;
  const r = (x: number | null) => (x === null ? null : x * ctx.toMetre);
  try {
    return hertzContact({
      radii: [
        [r(h.radii[0][0]), r(h.radii[0][1])],
        [r(h.radii[1][0]), r(h.radii[1][1])],
      ],
      angleDeg: h.angleDeg,
      E1: m1.E,
      nu1: m1.nu,
      E2: m2.E,
      nu2: m2.nu,
      force: forceFile * ctx.toNewton,
    });
  } catch {
    return null;
  }
}

/** N/m → file force per file length. */
const stiffToFile = (ctx: Ctx, kSI: number) => (kSI * ctx.toMetre) / ctx.toNewton;

function solveCase(ctx: Ctx, id: string, gravity: Vec3, loadIds: string[] | undefined, source: StiffnessSource): CaseResult {
  const { layout } = ctx;
  const w = caseWrench(ctx, gravity, loadIds);
  const ones = new Array<number>(ctx.m).fill(1);
  const fileK = layout.contacts.map((k) => k.stiffness ?? 1);
  const k = source === "file" ? fileK : ones;
  let { solve, active } = activeSet(ctx, k, w);
  let secant: number[] | null = source === "file" ? fileK : null;
  let tangent: number[] | null = source === "file" ? fileK : null;
  if (source === "hertz" && !solve.driven) {
    // fixed point: secant stiffness F/δ at the solved forces (uniform 3/2 to the tangent, so either gives the same sharing)
    for (let iter = 0; iter < 60; iter++) {
      const next = layout.contacts.map((_, i) => {
        const h = active[i] ? hertzAt(ctx, i, solve.lambda[i]) : null;
        return h ? stiffToFile(ctx, h.secant) : 0;
      });
      const maxK = Math.max(...next, 0);
      if (!(maxK > 0)) break;
      const kk = next.map((v) => (v > 0 ? v : maxK * 1e-6));
      const prev = solve.lambda;
      const res = activeSet(ctx, kk, w, active);
      solve = res.solve;
      active = res.active;
      const maxF = Math.max(...solve.lambda.map(Math.abs), 1e-300);
      if (solve.driven || Math.max(...solve.lambda.map((v, i) => Math.abs(v - prev[i]))) < 1e-12 * maxF) break;
    }
    secant = layout.contacts.map((_, i) => {
      const h = active[i] ? hertzAt(ctx, i, solve.lambda[i]) : null;
      return h ? stiffToFile(ctx, h.secant) : 0;
    });
    tangent = secant.map((v) => 1.5 * v);
  }
  const liftOff = layout.contacts.filter((_, i) => !active[i]).map((c) => c.id);
  if (solve.driven) {
    return {
      id,
      gravity,
      driven: true,
      seating: { forces: null, liftOff, stiffness: source, margin: null },
      unloaded: [],
      hertz: {},
      force: null,
      active,
      displacement: null,
      tangent: source === "file" ? fileK : null,
    };
  }
  const forces: Record<string, number> = {};
  const maxF = Math.max(...solve.lambda.map(Math.abs), 0);
  const f = solve.lambda.map((v, i) => (active[i] && Math.abs(v) > 1e-13 * maxF ? v : 0));
  layout.contacts.forEach((c, i) => (forces[c.id] = f[i]));
  const seats = layout.contacts.map((c, i) => (c.sense === "unilateral" ? i : -1)).filter((i) => i >= 0);
  const seatForces = seats.map((i) => f[i]);
  const mean = seatForces.length ? seatForces.reduce((a, b) => a + b, 0) / seatForces.length : 0;
  const margin = seatForces.length && mean > 0 ? Math.min(...seatForces) / mean : null;
  const unloaded = seats.filter((i) => active[i] && Math.abs(f[i]) <= LIFT * maxF).map((i) => layout.contacts[i].id);
  const hertz: Record<string, HertzEntry> = {};
  layout.contacts.forEach((c, i) => {
    const h = hertzAt(ctx, i, f[i]);
    if (!h || !c.hertz) return;
    const allow = c.hertz.materials.map((mId) => ctx.materials.get(mId)?.allowable).filter((x): x is number => x !== undefined);
    hertz[c.id] = {
      semiMajor: h.a / ctx.toMetre,
      semiMinor: h.b / ctx.toMetre,
      maxPressureMPa: h.p0 / 1e6,
      approachUm: h.delta * 1e6,
      stiffness: stiffToFile(ctx, h.tangent),
      allowableMPa: allow.length ? Math.min(...allow) : null,
      ellipticity: h.ellipticity,
    };
  });
  let displacement: number[] | null = null;
  if (secant && secant.some((v) => v > 0)) {
    const ks = secant.map((v) => (v > 0 ? v : Math.max(...secant!) * 1e-6));
    displacement = solveStiff(ctx, ks, active, w).u;
  }
  const stiffnessLabel: StiffnessSource = ctx.c.counts.redundancies === 0 ? "none" : source;
  return {
    id,
    gravity,
    driven: false,
    seating: { forces, liftOff, stiffness: stiffnessLabel, margin },
    unloaded,
    hertz,
    force: f,
    active,
    displacement,
    tangent,
  };
}

/** Displacement of a body point (file length units) under a scaled displacement u. */
function pointDisplacement(ctx: Ctx, body: string, p: Vec3, u: number[]): Vec3 {
  const b = ctx.bodyIndex.get(body)!;
  const w: Vec3 = [u[6 * b] / ctx.c.length, u[6 * b + 1] / ctx.c.length, u[6 * b + 2] / ctx.c.length];
  const vc: Vec3 = [u[6 * b + 3], u[6 * b + 4], u[6 * b + 5]];
  return add(vc, cross(w, sub(p, ctx.c.centroid)));
}

/** Runs seating for every load case, foundation coupling and functional points. */
export function analyseStatics(layout: Layout, c: ConstraintAnalysis): StaticsResult {
  const ctx: Ctx = {
    layout,
    c,
    m: layout.contacts.length,
    n: 6 * layout.bodies.length,
    toMetre: metresPer(layout.units.length),
    toNewton: newtonsPer(layout.units.force),
    bodyIndex: new Map(layout.bodies.map((b, i) => [b.id, i])),
    materials: materialTable(layout),
  };
  const hasLoad = layout.bodies.some((b) => b.mass !== undefined) || layout.loads.length > 0;
  const m = ctx.m;
  const source: StiffnessSource =
    m > 0 && layout.contacts.every((k) => k.stiffness !== undefined)
      ? "file"
      : m > 0 && layout.contacts.every((k) => hertzUsable(layout, k))
        ? "hertz"
        : "equal";
  const caseDefs = layout.loadCases ?? [{ id: "default", gravity: layout.gravity, loads: undefined }];
  const cases: CaseResult[] = caseDefs.map((lc) =>
    hasLoad && m > 0
      ? solveCase(ctx, lc.id, lc.gravity, lc.loads, source)
      : {
          id: lc.id,
          gravity: lc.gravity,
          driven: false,
          seating: null,
          unloaded: [],
          hertz: {},
          force: null,
          active: new Array(m).fill(true),
          displacement: null,
          tangent: source === "file" ? layout.contacts.map((k) => k.stiffness!) : null,
        },
  );

  // Foundation coupling with the first case's active contacts and tangent stiffness.
  const first = cases[0];
  const ground = layout.contacts.map((k, i) => (k.on === GROUND ? i : -1)).filter((i) => i >= 0);
  const perUm = 1e-6 / ctx.toMetre;
  let foundation: FoundationResult | null = null;
  let kFound: number[] | null = null;
  if (c.counts.redundancies === 0) {
    kFound = layout.contacts.map((k) => k.stiffness ?? 1);
  } else if (source === "file") {
    kFound = layout.contacts.map((k, i) => (first.active[i] ? k.stiffness! : 0));
  } else if (source === "hertz" && first.tangent && first.tangent.some((v) => v > 0)) {
    kFound = first.tangent.map((v, i) => (first.active[i] ? v : 0));
  }
  const active = first.active.map((a, i) => a && (kFound ? kFound[i] > 0 : true));
  let foundFactor: Factor | null = null;
  const columnOf = (d: number[]): number[] => {
    // Δλ = K d − K A (AᵀKA)⁺ Aᵀ K d, over the active contacts
    const k = kFound!;
    foundFactor ??= factorStiff(
      ctx,
      k.map((v) => (v > 0 ? v : 1)),
      active,
    );
    const Kd = d.map((v, i) => (active[i] ? k[i] * v : 0));
    const w = new Array<number>(ctx.n).fill(0);
    for (let i = 0; i < m; i++) if (Kd[i] !== 0) for (let q = 0; q < ctx.n; q++) w[q] += c.A.get(i, q) * Kd[i];
    // (AᵀKA) u = AᵀK d, then Δλ = K (d − A u)
    const { u } = solveWith(ctx, foundFactor, w);
    return d.map((v, i) => (active[i] ? k[i] * (v - separation(ctx, i, u)) : 0));
  };
  if (kFound) {
    const sensitivity: Record<string, Record<string, number>> = {};
    let max = 0;
    for (const j of ground) {
      const d = new Array<number>(m).fill(0);
      d[j] = perUm;
      const col = c.counts.redundancies === 0 ? new Array<number>(m).fill(0) : columnOf(d);
      const entry: Record<string, number> = {};
      layout.contacts.forEach((k, i) => {
        const v = Math.abs(col[i]) < 1e-12 * (Math.max(...kFound!) * perUm) ? 0 : col[i];
        entry[k.id] = v;
        max = Math.max(max, Math.abs(v));
      });
      sensitivity[layout.contacts[j].id] = entry;
    }
    const warp =
      c.counts.redundancies === 0
        ? []
        : c.selfStress.map((state) => {
            const d = layout.contacts.map((k) => (k.on === GROUND ? (state.forces[k.id] ?? 0) : 0));
            const big = Math.max(...d.map(Math.abs));
            const resp = big > 0 ? columnOf(d.map((v) => (v / big) * perUm)) : new Array<number>(m).fill(0);
            return { pivot: state.pivot, forces: Object.fromEntries(layout.contacts.map((k, i) => [k.id, resp[i]])) };
          });
    foundation = { sensitivity, maxPerMicrometre: max, warp, stiffness: c.counts.redundancies === 0 ? "none" : source };
  }

  // Functional points: motion per µm rise of each ground support, and under the seated load.
  const points: Record<string, PointMotion> = {};
  if (layout.points.length) {
    const kPts = kFound ?? layout.contacts.map(() => 1);
    const activePts = first.active;
    for (const pt of layout.points) points[pt.id] = { perMicrometre: {}, seatedUm: null, body: pt.body };
    const ptFactor = ground.length
      ? factorStiff(
          ctx,
          kPts.map((v) => (v > 0 ? v : 1)),
          activePts,
        )
      : null;
    for (const j of ground) {
      if (!activePts[j]) continue;
      const d = new Array<number>(m).fill(0);
      d[j] = perUm;
      const w = new Array<number>(ctx.n).fill(0);
      for (let q = 0; q < ctx.n; q++) w[q] = c.A.get(j, q) * kPts[j] * perUm;
      const { u } = solveWith(ctx, ptFactor!, w);
      for (const pt of layout.points) points[pt.id].perMicrometre[layout.contacts[j].id] = scale(pointDisplacement(ctx, pt.body, pt.point, u), 1 / perUm);
    }
    if (first.displacement) {
      for (const pt of layout.points) points[pt.id].seatedUm = scale(pointDisplacement(ctx, pt.body, pt.point, first.displacement), 1 / perUm);
    }
  }
  const fileStiffness = source === "file" ? layout.contacts.map((k) => k.stiffness!) : null;
  return { hasLoad, stiffnessSource: source, fileStiffness, cases, foundation, points };
}
