/** Demo projects of the Larkspur Photonics scenario; safe to re-run. */
import type { Knex } from "knex";

export const demoProjects = [
  {
    name: "Interferometer breadboard",
    description: "600 × 450 mm breadboard carrying a Michelson interferometer: first on four feet, then on three seats.",
  },
  {
    name: "Detachable instrument plate",
    description: "Instrument plate that must come off and go back within a micrometre: ball–socket / ball–vee / ball–flat coupling.",
  },
  {
    name: "Two-blade flexure stage",
    description: "Linear stage on two parallel flexure blades: one intended freedom along x.",
  },
] as const;

export async function seed(knex: Knex): Promise<void> {
  const manager = await knex("users").where({ role: "manager" }).orderBy("id").first();
  const checker = await knex("users").where({ role: "checker" }).orderBy("id").first();
  if (!manager) throw new Error("seed 01_users must run first");
  for (const p of demoProjects) {
    const existing = await knex("projects").where({ name: p.name }).first();
    if (existing) continue;
    await knex("projects").insert({ ...p, created_by: manager.id, checker_id: checker?.id ?? null });
  }
}
