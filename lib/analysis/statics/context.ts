/** The solve context: unit factors, the material table, usable Hertz data, a load case's scaled wrench and point motion. */
import { type Layout, type Vec3 } from "@/lib/layout/model";
import { builtinMaterials } from "@/lib/layout/materials";
import { add, cross, scale, sub } from "../vec";
import type { Ctx } from "./types";

export function materialTable(layout: Layout) {
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
export function caseWrench(ctx: Ctx, gravity: Vec3, loadIds: string[] | undefined): number[] {
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

/** N/m → file force per file length. */
/** N/m → file force per file length. */
export const stiffToFile = (ctx: Ctx, kSI: number) => (kSI * ctx.toMetre) / ctx.toNewton;

/** Displacement of a body point (file length units) under a scaled displacement u. */
export function pointDisplacement(ctx: Ctx, body: string, p: Vec3, u: number[]): Vec3 {
  const b = ctx.bodyIndex.get(body)!;
  const w: Vec3 = [u[6 * b] / ctx.c.length, u[6 * b + 1] / ctx.c.length, u[6 * b + 2] / ctx.c.length];
  const vc: Vec3 = [u[6 * b + 3], u[6 * b + 4], u[6 * b + 5]];
  return add(vc, cross(w, sub(p, ctx.c.centroid)));
}
