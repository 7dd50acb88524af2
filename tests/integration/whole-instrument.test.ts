/**
 * A whole instrument through the upload path (the route handler's one library call, in the analysis worker
 * thread): a 500-body, 5,000-contact bench carrying mounts, with masses, seat stiffness, materials, scatter
 * and functional points, is analysed, stored with its findings and read back. Its time is reported by
 * `npm run bench`, not asserted here.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetDatabase, testKnex } from "./setup-db";
import type { SessionUser } from "@/lib/auth/session";
import { toJson } from "@/lib/layout/serialize";
import { generate, instrument } from "../support/instruments";

const { uploadRevision } = await import("@/lib/upload");
const { closeAnalysisPool } = await import("@/lib/worker/run-analysis");
const { getRevision } = await import("@/lib/db/revisions");
const { createLayout } = await import("@/lib/db/layouts");
const { db } = await import("@/lib/db/knex");

const knex = testKnex();
let designer: SessionUser;
let layoutId = 0;

beforeAll(async () => {
  await resetDatabase(knex);
  designer = await knex("users").where({ role: "designer" }).first();
  const project = await knex("projects").first();
  layoutId = (await createLayout(designer, project.id, { name: "Larkspur optical bench, whole", description: "" })).id;
});
afterAll(async () => {
  await closeAnalysisPool();
  await knex.destroy();
  await db().destroy();
});

describe("a 500-body, 5,000-contact instrument", () => {
  it("goes through the upload path: analysed, stored with its findings, read back", async () => {
    const layout = instrument(generate(500, "star", 4242, 10));
    expect(layout.contacts).toHaveLength(5000);
    const bytes = new TextEncoder().encode(toJson(layout));
    const result = await uploadRevision(designer, layoutId, bytes, { fileName: "bench-500.json" });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    // 500 bodies with ten generic seats each: every freedom held, 2,000 redundancies (Maxwell count 6N − m)
    expect(result.report.counts).toMatchObject({ bodies: 500, contacts: 5000, rank: 3000, freedoms: 0, redundancies: 2000, grubler: -2000 });
    expect(result.report.foundation).not.toBeNull();
    expect(result.report.thermal).not.toBeNull();
    expect(Object.keys(result.report.repeatability?.points ?? {})).toHaveLength(layout.points.length);
    const stored = await knex("findings").where({ revision_id: result.revision.id }).count({ n: "*" }).first();
    expect(Number(stored!.n)).toBe(result.report.findings.length);
    // read back as the layout page reads it
    const rev = await getRevision(designer, result.revision.id);
    expect(rev.report.counts.contacts).toBe(5000);
    expect(rev.layout.bodies).toHaveLength(500);
    // a loop through the bench lists its largest coefficients in the finding, all of them in the report
    const loop = result.report.findings.find((f) => f.rule === "redundant-constraint");
    expect(loop).toBeDefined();
    expect(loop!.body.split("\n").filter((l) => l.startsWith("| ") && !l.startsWith("| contact")).length).toBeLessThanOrEqual(40);
  }, 300_000);
});
