/** The role helper (401 signed out, 403 wrong role) and the projects data functions, against MariaDB. */
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { resetDatabase, testKnex } from "./setup-db";

const session = vi.hoisted(() => ({ current: null as null | { user: { id: number } } }));
vi.mock("next-auth", () => ({ getServerSession: vi.fn(async () => session.current) }));
vi.mock("next/navigation", () => ({
  redirect: vi.fn((to: string) => {
    throw new Error(`REDIRECT ${to}`);
  }),
}));

const { requireRole, requireUser, requirePageUser } = await import("@/lib/auth/session");
const { createProject, listProjects } = await import("@/lib/db/projects");
const { verifyCredentials } = await import("@/lib/db/users");
const { db } = await import("@/lib/db/knex");

const knex = testKnex();
const ids: Record<string, number> = {};

beforeAll(async () => {
  await resetDatabase(knex);
  for (const u of await knex("users").select("id", "role")) ids[u.role] = u.id;
});
afterAll(async () => {
  await knex.destroy();
  await db().destroy();
});
beforeEach(() => {
  session.current = null;
});

describe("requireUser / requireRole", () => {
  it("answers 401 when nobody is signed in", async () => {
    await expect(requireUser()).rejects.toMatchObject({ status: 401 });
    await expect(requireRole(["manager"])).rejects.toMatchObject({ status: 401 });
  });

  it("answers 403 for a signed-in user of another role", async () => {
    session.current = { user: { id: ids.designer } };
    await expect(requireRole(["manager", "admin"])).rejects.toMatchObject({ status: 403 });
  });

  it("returns the user for an allowed role, with the role read from the database", async () => {
    session.current = { user: { id: ids.manager } };
    const user = await requireRole(["manager"]);
    expect(user).toMatchObject({ id: ids.manager, role: "manager" });
    expect(user).not.toHaveProperty("password_hash");
  });

  it("treats a session of a deactivated user as signed out", async () => {
    const [id] = await knex("users").insert({ email: "gone@larkspur.example", name: "Gone", role: "checker", password_hash: "x" });
    await knex("users").where({ id }).update({ active: false });
    session.current = { user: { id } };
    await expect(requireUser()).rejects.toMatchObject({ status: 401 });
  });

  it("redirects a signed-out page visit to sign-in with the way back", async () => {
    await expect(requirePageUser("/projects")).rejects.toThrow("REDIRECT /signin?callbackUrl=%2Fprojects");
  });
});

describe("credentials", () => {
  it("accepts the right password and refuses a wrong one or an unknown e-mail", async () => {
    expect(await verifyCredentials("mira@larkspur.example", "manager-demo")).toMatchObject({ role: "manager" });
    expect(await verifyCredentials("MIRA@larkspur.example ", "manager-demo")).toMatchObject({ role: "manager" });
    expect(await verifyCredentials("mira@larkspur.example", "wrong")).toBeNull();
    expect(await verifyCredentials("nobody@larkspur.example", "manager-demo")).toBeNull();
  });
});

describe("projects", () => {
  it("lets a manager create a project and everyone list it", async () => {
    const manager = { id: ids.manager, name: "Mira Lund", email: "mira@larkspur.example", role: "manager" as const };
    const created = await createProject(manager, { name: "Cold plate", description: "Bipods", checkerId: ids.checker });
    expect(created).toMatchObject({ name: "Cold plate", checker: { id: ids.checker } });
    const designer = { id: ids.designer, name: "Dana", email: "dana@larkspur.example", role: "designer" as const };
    const list = await listProjects(designer);
    expect(list.map((p) => p.name)).toContain("Cold plate");
  });

  it("refuses a designer (403) and a duplicate name (409), changing nothing", async () => {
    const before = await knex("projects").count({ n: "*" }).first();
    const designer = { id: ids.designer, name: "Dana", email: "d", role: "designer" as const };
    await expect(createProject(designer, { name: "Designer project", description: "" })).rejects.toMatchObject({ status: 403 });
    const manager = { id: ids.manager, name: "Mira", email: "m", role: "manager" as const };
    await expect(createProject(manager, { name: "Cold plate", description: "" })).rejects.toMatchObject({ status: 409 });
    await expect(createProject(manager, { name: "Bad checker", description: "", checkerId: ids.designer })).rejects.toMatchObject({ status: 422 });
    expect(await knex("projects").count({ n: "*" }).first()).toEqual(before);
  });
});
