/** Migrations go up and down cleanly; seeds are safe to re-run. */
import { afterAll, describe, expect, it } from "vitest";
import { resetDatabase, testKnex } from "./setup-db";
import { demoUsers } from "../../db/seeds/01_users";
import { demoProjects } from "../../db/seeds/02_projects";

const knex = testKnex();
afterAll(() => knex.destroy());

describe("migrations", () => {
  it("rolls every migration down and leaves no table of ours behind", async () => {
    await knex.migrate.latest();
    await knex.migrate.rollback(undefined, true);
    for (const table of ["users", "projects"]) expect(await knex.schema.hasTable(table)).toBe(false);
  });

  it("migrates up to the latest and creates the tables", async () => {
    await knex.migrate.latest();
    for (const table of ["users", "projects"]) expect(await knex.schema.hasTable(table)).toBe(true);
    const [, pending] = await knex.migrate.list();
    expect(pending).toHaveLength(0);
  });

  it("seeds are idempotent: running them twice gives the same rows", async () => {
    await resetDatabase(knex);
    await knex.seed.run();
    const users = await knex("users").select("email", "role");
    expect(users).toHaveLength(demoUsers.length);
    expect(new Set(users.map((u) => u.role))).toEqual(new Set(["designer", "checker", "manager", "admin"]));
    expect(await knex("projects").count({ n: "*" }).first()).toEqual({ n: demoProjects.length });
  });

  it("stores bcrypt hashes, never plain passwords", async () => {
    const rows = await knex("users").select("password_hash");
    for (const r of rows) expect(r.password_hash).toMatch(/^\$2[aby]\$10\$/);
  });
});
