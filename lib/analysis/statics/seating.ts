/** Seating of one load case (analysis.md §3): active set, Hertz stiffness fixed point, forces, margin, lift-off; Hertz stress at the seated forces (§5). */
import type { Vec3 } from "@/lib/layout/model";
import { hertzContact, type HertzResult } from "../hertz";
import { STATICS } from "../tolerances";
import { caseWrench, stiffToFile } from "./context";
import { activeSet, solveStiff } from "./solver";
import type { CaseResult, Ctx, HertzEntry, StiffnessSource } from "./types";

const LIFT = STATICS.liftOffRelative;

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

export function solveCase(ctx: Ctx, id: string, gravity: Vec3, loadIds: string[] | undefined, source: StiffnessSource): CaseResult {
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
    for (let iter = 0; iter < STATICS.hertzIterations; iter++) {
      const next = layout.contacts.map((_, i) => {
        const h = active[i] ? hertzAt(ctx, i, solve.lambda[i]) : null;
        return h ? stiffToFile(ctx, h.secant) : 0;
      });
      const maxK = Math.max(...next, 0);
      if (!(maxK > 0)) break;
      const kk = next.map((v) => (v > 0 ? v : maxK * STATICS.releasedStiffnessFraction));
      const prev = solve.lambda;
      const res = activeSet(ctx, kk, w, active);
      solve = res.solve;
      active = res.active;
      const maxF = Math.max(...solve.lambda.map(Math.abs), 1e-300);
      if (solve.driven || Math.max(...solve.lambda.map((v, i) => Math.abs(v - prev[i]))) < STATICS.hertzConvergence * maxF) break;
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
  const f = solve.lambda.map((v, i) => (active[i] && Math.abs(v) > STATICS.forceRoundOff * maxF ? v : 0));
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
    const ks = secant.map((v) => (v > 0 ? v : Math.max(...secant!) * STATICS.releasedStiffnessFraction));
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
