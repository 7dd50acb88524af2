/** A project's materials library against MariaDB and the upload worker: who may keep it, and uploads resolve ids against it before the built-in table. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetDatabase, testKnex } from "./setup-db";
import type { SessionUser } from "@/lib/auth/session";

const { listProjectMaterials, removeProjectMaterial, setProjectMaterial } = await import("@/lib/db/materials");
const { uploadRevision } = await import("@/lib/upload");
const { closeAnalysisPool } = await import("@/lib/worker/run-analysis");
const { createLayout } = await import("@/lib/db/layouts");
const { db } = await import("@/lib/db/knex");

const knex = testKnex();
const users: Record<string, SessionUser> = {};
let projectId = 0;

beforeAll(async () => {
  await resetDatabase(knex);
  for (const u of await knex("users").select("id", "name", "email", "role")) users[u.role] = u;
  projectId = (await knex("projects").where({ name: "Detachable instrument plate" }).first()).id;
});
afterAll(async () => {
  await closeAnalysisPool();
  await knex.destroy();
  await db().destroy();
});

/** A bar on two stops between a body of material `mat` and a steel base (built-in). */
const barFile = (mat: string) =>
  new TextEncoder().encode(
    JSON.stringify({
      format: "mount-layout/1",
      bodies: [{ id: "bar", material: mat }],
      groundMaterial: "bearing-steel",
      contacts: [
        { id: "Z1", body: "bar", point: [0, 0, 0], normal: [0, 0, 1] },
        { id: "Z2", body: "bar", point: [100, 0, 0], normal: [0, 0, 1] },
        { id: "Z3", body: "bar", point: [0, 100, 0], normal: [0, 0, 1] },
        { id: "X1", body: "bar", point: [0, 0, 0], normal: [1, 0, 0] },
        { id: "Y1", body: "bar", point: [0, 0, 0], normal: [0, 1, 0] },
        { id: "Y2", body: "bar", point: [100, 0, 0], normal: [0, 1, 0] },
      ],
      points: [{ id: "tip", body: "bar", point: [200, 0, 0] }],
    }),
  );

describe("materials library", () => {
  it("managers and admins keep it, with a source; designers and checkers cannot", async () => {
    await setProjectMaterial(users.manager, projectId, {
      id: "supplier-invar",
      expansionPerK: 1.1e-6,
      youngsModulusGPa: 140,
      source: "Supplier datasheet DS-36, rev. C (demo)",
    });
    await expect(setProjectMaterial(users.designer, projectId, { id: "x-mat", expansionPerK: 1e-6, source: "nowhere at all" })).rejects.toMatchObject({
      status: 403,
    });
    await expect(setProjectMaterial(users.checker, projectId, { id: "x-mat", expansionPerK: 1e-6, source: "nowhere at all" })).rejects.toMatchObject({
      status: 403,
    });
    const list = await listProjectMaterials(users.designer, projectId);
    expect(list).toEqual([
      expect.objectContaining({ id: "supplier-invar", expansionPerK: 1.1e-6, source: "Supplier datasheet DS-36, rev. C (demo)", setBy: users.manager.name }),
    ]);
  });

  it("an upload resolves a material id against the library (before the built-in table) and keeps the copy it used", async () => {
    const layoutId = (await createLayout(users.designer, projectId, { name: "Library bar", description: "" })).id;
    const result = await uploadRevision(users.designer, layoutId, barFile("supplier-invar"), { fileName: "bar.json" });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    // the point 200 mm from the fixed corner drifts by (α_bar − α_base)·200 mm per K (derived; built-in base 11.9e-6/K)
    expect(result.report.thermal!.points.tip.driftUmPerK[0]).toBeCloseTo((1.1e-6 - 11.9e-6) * 200 * 1000, 9);
    const stored = await knex("revisions").where({ id: result.revision.id }).first();
    expect(JSON.parse(stored.parsed).materials).toEqual([expect.objectContaining({ id: "supplier-invar", expansionPerK: 1.1e-6 })]);

    // an entry with a built-in id replaces the built-in value for this project
    await setProjectMaterial(users.admin, projectId, { id: "bearing-steel", expansionPerK: 12.5e-6, source: "Company standard CS-104 (demo)" });
    const again = await uploadRevision(users.designer, layoutId, barFile("supplier-invar"), { fileName: "bar.json" });
    expect(again.ok && again.report.thermal!.points.tip.driftUmPerK[0]).toBeCloseTo((1.1e-6 - 12.5e-6) * 200 * 1000, 9);

    // without the entry the id is unknown: a located error, nothing stored
    await removeProjectMaterial(users.manager, projectId, "supplier-invar");
    const refused = await uploadRevision(users.designer, layoutId, barFile("supplier-invar"), { fileName: "bar.json" });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.errors[0]).toMatchObject({ location: "/bodies/0/material", message: expect.stringMatching(/supplier-invar/) });
  });
});
