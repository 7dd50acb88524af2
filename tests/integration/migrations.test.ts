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

  it("re-keys contact-overstress threads from one per case to one per contact, keeping the newest", async () => {
    await resetDatabase(knex);
    const { createHash } = await import("node:crypto");
    const sha = (t: string) => createHash("sha256").update(t).digest("hex");
    const layout = (await knex("layouts").first()).id;
    const insert = (fp: string) =>
      knex("threads").insert({
        layout_id: layout,
        fingerprint: fp,
        fingerprint_hash: sha(fp),
        rule: "contact-overstress",
        severity: "error",
        title: fp,
        status: "open",
      });
    const [older] = await insert("contact-overstress|B1|case:operating");
    const [newer] = await insert("contact-overstress|B1|case:shipping");
    const [other] = await insert("contact-overstress|B2|case:operating");
    const { up } = await import("../../db/migrations/20261203090100_overstress_fingerprints");
    await up(knex);
    const byId = async (id: number) => (await knex("threads").where({ id }).first()).fingerprint;
    expect(await byId(newer)).toBe("contact-overstress|B1");
    expect(await byId(older)).toBe("contact-overstress|B1|case:operating");
    expect(await byId(other)).toBe("contact-overstress|B2");
    expect((await knex("threads").where({ id: newer }).first()).fingerprint_hash).toBe(sha("contact-overstress|B1"));
  });
});
