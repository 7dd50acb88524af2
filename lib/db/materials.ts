/** A project's materials library: list, set (add or replace) and remove entries; each names its source. */
import "server-only";
import { z } from "zod";
import { db } from "./knex";
import { iso } from "./rows";
import { forbidden, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import type { Material } from "@/lib/layout/model";
import type { SessionUser } from "@/lib/auth/session";

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

export interface ProjectMaterialDto {
  id: string;
  youngsModulusGPa: number | null;
  poissonRatio: number | null;
  allowableContactPressureMPa: number | null;
  expansionPerK: number | null;
  source: string;
  setBy: string | null;
  updatedAt: string;
}

const optionalPositive = z.number().positive("Must be greater than zero.").nullable().optional();
export const projectMaterialSchema = z
  .object({
    id: z.string().trim().regex(/^[a-z0-9][a-z0-9-]{0,99}$/, "Use a kebab-case id: lower-case letters, digits and hyphens."),
    youngsModulusGPa: optionalPositive,
    poissonRatio: z.number().gt(-1).lt(0.5, "Poisson's ratio lies between −1 and 0.5.").nullable().optional(),
    allowableContactPressureMPa: optionalPositive,
    expansionPerK: z.number().min(0, "Must not be negative.").max(1e-3, "That is far beyond any solid (1/K).").nullable().optional(),
    source: z.string().trim().min(5, "Name the source: a supplier datasheet, a standard or a test report.").max(500),
  })
  .refine((m) => [m.youngsModulusGPa, m.poissonRatio, m.allowableContactPressureMPa, m.expansionPerK].some((v) => v !== null && v !== undefined), {
    message: "Give at least one value.",
  });

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
  const rows = await db()<MaterialRow>("project_materials as m").leftJoin("users as u", "u.id", "m.set_by").where("m.project_id", projectId).orderBy("m.material_id").select("m.*", "u.name as set_by_name");
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
