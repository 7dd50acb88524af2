/** Role administration against MariaDB: a manager assigns a project's checker; an admin adds users, changes roles, deactivates; withdrawal of a release request. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { resetDatabase, testKnex } from "./setup-db";
import { parseLayoutText } from "@/lib/layout";
import { runEngine } from "@/lib/engine";
import type { SessionUser } from "@/lib/auth/session";

const { assignChecker, createProject, getProject, projectHistory } = await import("@/lib/db/projects");
const { addUser, changeUser, listAllUsers, verifyCredentials } = await import("@/lib/db/users");
const { authenticateToken, createToken } = await import("@/lib/db/tokens");
const { createLayout } = await import("@/lib/db/layouts");
const { storeRevision } = await import("@/lib/db/revisions");
const { requestRelease, withdrawRelease } = await import("@/lib/db/releases");
const { listAudit } = await import("@/lib/db/audit");
const { db } = await import("@/lib/db/knex");

const knex = testKnex();
const users: Record<string, SessionUser> = {};

beforeAll(async () => {
  await resetDatabase(knex);
  for (const u of await knex("users").select("id", "name", "email", "role")) users[u.role] = u;
});
afterAll(async () => {
  await knex.destroy();
  await db().destroy();
});

describe("project checker", () => {
  it("a manager assigns, changes and clears the checker; each change is in the project's history; others get 403", async () => {
    const p = await createProject(users.manager, { name: "Checker bench", description: "" });
    expect(p.checker).toBeNull();
    expect((await assignChecker(users.manager, p.id, users.checker.id)).checker).toMatchObject({ id: users.checker.id });
    expect((await assignChecker(users.manager, p.id, null)).checker).toBeNull();
    const history = await projectHistory(users.manager, p.id);
    expect(history.map((h) => [h.detail.from, h.detail.to])).toEqual([
      [users.checker.name, null],
      [null, users.checker.name],
    ]);
    expect(history[0].actor).toBe(users.manager.name);
    for (const role of ["designer", "checker", "admin"])
      await expect(assignChecker(users[role], p.id, users.checker.id)).rejects.toMatchObject({ status: 403 });
    await expect(assignChecker(users.manager, p.id, users.designer.id)).rejects.toMatchObject({ status: 422 });
    expect((await getProject(users.manager, p.id)).checker).toBeNull();
  });
});

describe("users", () => {
  it("an admin adds a user who can sign in; only admins manage users", async () => {
    const u = await addUser(users.admin, { name: "Noor Haddad", email: "noor@larkspur.example", role: "checker", password: "checker-noor-1" });
    expect(u).toMatchObject({ role: "checker", active: true });
    expect(await verifyCredentials("noor@larkspur.example", "checker-noor-1")).toMatchObject({ id: u.id });
    await expect(
      addUser(users.admin, { name: "Noor again", email: "noor@larkspur.example", role: "designer", password: "xxxxxxxxxxxx" }),
    ).rejects.toMatchObject({ status: 409 });
    for (const role of ["designer", "checker", "manager"]) await expect(listAllUsers(users[role])).rejects.toMatchObject({ status: 403 });
  });

  it("a role change takes effect and a checker who stops being one leaves their projects; recorded", async () => {
    const noor = (await listAllUsers(users.admin)).find((u) => u.email === "noor@larkspur.example")!;
    const p = await createProject(users.manager, { name: "Noor's bench", description: "" });
    await assignChecker(users.manager, p.id, noor.id);
    expect((await changeUser(users.admin, noor.id, { role: "designer" })).role).toBe("designer");
    expect((await getProject(users.manager, p.id)).checker).toBeNull();
    const log = await listAudit("user", noor.id);
    expect(log.map((h) => h.kind)).toEqual(["role-changed", "user-added"]);
  });

  it("a deactivated user cannot sign in or use a token; their history stays; an admin cannot lock themselves out", async () => {
    const noor = (await listAllUsers(users.admin)).find((u) => u.email === "noor@larkspur.example")!;
    const me: SessionUser = { id: noor.id, name: noor.name, email: noor.email, role: noor.role };
    const { token } = await createToken(me, "CAD station");
    expect(await authenticateToken(token)).toMatchObject({ id: noor.id });
    await changeUser(users.admin, noor.id, { active: false });
    expect(await verifyCredentials("noor@larkspur.example", "checker-noor-1")).toBeNull();
    expect(await authenticateToken(token)).toBeNull();
    expect(await knex("users").where({ id: noor.id }).first()).toBeTruthy();
    expect((await listAudit("user", noor.id))[0].kind).toBe("user-deactivated");
    await changeUser(users.admin, noor.id, { active: true });
    expect(await verifyCredentials("noor@larkspur.example", "checker-noor-1")).toMatchObject({ id: noor.id });
    await expect(changeUser(users.admin, users.admin.id, { active: false })).rejects.toMatchObject({ status: 409 });
    await expect(changeUser(users.admin, users.admin.id, { role: "designer" })).rejects.toMatchObject({ status: 409 });
  });
});

describe("release request", () => {
  it("a designer withdraws a request until it is approved; the withdrawal is in the layout's history", async () => {
    const project = (await knex("projects").where({ name: "Two-blade flexure stage" }).first()).id;
    const layoutId = (await createLayout(users.designer, project, { name: "Withdraw bench", description: "" })).id;
    const text = readFileSync("examples/breadboard-three-seats.json", "utf8");
    const parsed = parseLayoutText(text);
    if (!parsed.ok) throw new Error("example");
    const { report } = runEngine(parsed.layout);
    const rev = await storeRevision(users.designer, layoutId, { fileName: "three.json", encoding: "json", raw: text, layout: parsed.layout, report });
    await expect(withdrawRelease(users.designer, rev.id)).rejects.toMatchObject({ status: 409 });
    await requestRelease(users.designer, rev.id);
    await expect(withdrawRelease(users.checker, rev.id)).rejects.toMatchObject({ status: 403 });
    await withdrawRelease(users.designer, rev.id);
    expect(await knex("releases").where({ revision_id: rev.id }).first()).toBeUndefined();
    expect((await knex("events").where({ layout_id: layoutId, kind: "release-withdraw" })).length).toBe(1);
    await requestRelease(users.designer, rev.id);
  });
});
