/** Demo users of the invented Larkspur Photonics team, one per role; safe to re-run. */
import type { Knex } from "knex";
import bcrypt from "bcryptjs";

export const demoUsers = [
  { email: "dana@larkspur.example", name: "Dana Reyes", role: "designer", password: "designer-demo" },
  { email: "chen@larkspur.example", name: "Chen Okafor", role: "checker", password: "checker-demo" },
  { email: "mira@larkspur.example", name: "Mira Lund", role: "manager", password: "manager-demo" },
  { email: "ari@larkspur.example", name: "Ari Banks", role: "admin", password: "admin-demo" },
] as const;

export async function seed(knex: Knex): Promise<void> {
  for (const u of demoUsers) {
    const existing = await knex("users").where({ email: u.email }).first();
    if (existing) continue;
    await knex("users").insert({
      email: u.email,
      name: u.name,
      role: u.role,
      password_hash: await bcrypt.hash(u.password, 10),
    });
  }
}
