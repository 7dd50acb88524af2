/** A project's materials library: list, set (add or replace) and remove entries; each names its source. */
import "server-only";
import { z } from "zod";
import { db } from "./knex";
import { iso } from "./rows";
import { forbidden, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import type { Material } from "@/lib/layout/model";
import type { SessionUser } from "@/lib/auth/session";
import type { ProjectMaterialDto } from "@/lib/contracts/materials";
import { projectMaterialSchema } from "@/lib/contracts/materials";
export type { ProjectMaterialDto } from "@/lib/contracts/materials";
export { projectMaterialSchema } from "@/lib/contracts/materials";

interface MaterialRow {
  id: number;
  project_id: number;
  material_id: string;
  youngs_modulus_gpa: number | null;
  poisson_ratio: number | null;
  allowable_mpa: number | null;
  expansion_per_k: number | null;
  source: string;
  set_by_name: string | null;
  updated_at: Date;
}

const toDto = (r: MaterialRow): ProjectMaterialDto => ({
  id: r.material_id,
  youngsModulusGPa: r.youngs_modulus_gpa,
  poissonRatio: r.poisson_ratio,
  allowableContactPressureMPa: r.allowable_mpa,
  expansionPerK: r.expansion_per_k,
  source: r.source,
  setBy: r.set_by_name,
  updatedAt: iso(r.updated_at),
});

/** The library of one project (every role may read it). */
export async function listProjectMaterials(_user: SessionUser | null, projectId: number): Promise<ProjectMaterialDto[]> {
  const rows = await db()<MaterialRow>("project_materials as m")
    .leftJoin("users as u", "u.id", "m.set_by")
    .where("m.project_id", projectId)
    .orderBy("m.material_id")
    .select("m.*", "u.name as set_by_name");
  return rows.map((r) => toDto(r as MaterialRow));
}

/** The library as layout materials, for the parser and engine of an upload to one of the project's layouts. */
export async function materialsForLayout(layoutId: number): Promise<Material[]> {
  const l = await db()("layouts").where({ id: layoutId }).first();
  if (!l) return [];
  return (await listProjectMaterials(null, l.project_id)).map((m) => ({
    id: m.id,
    ...(m.youngsModulusGPa !== null ? { youngsModulusGPa: m.youngsModulusGPa } : {}),
    ...(m.poissonRatio !== null ? { poissonRatio: m.poissonRatio } : {}),
    ...(m.allowableContactPressureMPa !== null ? { allowableContactPressureMPa: m.allowableContactPressureMPa } : {}),
    ...(m.expansionPerK !== null ? { expansionPerK: m.expansionPerK } : {}),
    source: `project library: ${m.source}`,
  }));
}

/** Adds or replaces one entry (admins and managers). */
export async function setProjectMaterial(user: SessionUser, projectId: number, input: z.infer<typeof projectMaterialSchema>): Promise<ProjectMaterialDto[]> {
  if (!allowed(user.role, "manageMaterials")) throw forbidden("Only administrators and managers keep a project's materials library.");
  if (!(await db()("projects").where({ id: projectId }).first())) throw notFound("That project");
  const row = {
    project_id: projectId,
    material_id: input.id,
    youngs_modulus_gpa: input.youngsModulusGPa ?? null,
    poisson_ratio: input.poissonRatio ?? null,
    allowable_mpa: input.allowableContactPressureMPa ?? null,
    expansion_per_k: input.expansionPerK ?? null,
    source: input.source,
    set_by: user.id,
    updated_at: new Date(),
  };
  await db()("project_materials").insert(row).onConflict(["project_id", "material_id"]).merge();
  return listProjectMaterials(user, projectId);
}

/** Removes one entry (admins and managers); stored revisions keep the copy they were analysed with. */
export async function removeProjectMaterial(user: SessionUser, projectId: number, materialId: string): Promise<void> {
  if (!allowed(user.role, "manageMaterials")) throw forbidden("Only administrators and managers keep a project's materials library.");
  const n = await db()("project_materials").where({ project_id: projectId, material_id: materialId }).delete();
  if (n !== 1) throw notFound("That material");
}
