/** Project rule overrides against MariaDB: who may change them, validation, history, and uploads analysed with them. */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetDatabase, testKnex } from "./setup-db";
import type { SessionUser } from "@/lib/auth/session";

const { changeOverride, listOverrides, overrideInputSchema, overridesForLayout } = await import("@/lib/db/overrides");
const { createLayout } = await import("@/lib/db/layouts");
const { getRevision } = await import("@/lib/db/revisions");
const { blockingFindings } = await import("@/lib/db/releases");
const { uploadRevision } = await import("@/lib/upload");
const { closeAnalysisPool } = await import("@/lib/worker/run-analysis");
const { releaseReportMarkdown } = await import("@/lib/report/release");
const { db } = await import("@/lib/db/knex");

const knex = testKnex();
const users: Record<string, SessionUser> = {};
let projectId = 0;
let layoutId = 0;
const file = (name: string) => new Uint8Array(readFileSync(`examples/${name}`));
const why = "Granite base; checked by hand for this project.";

beforeAll(async () => {
  await resetDatabase(knex);
  for (const u of await knex("users").select("id", "name", "email", "role")) users[u.role] = u;
  projectId = (await knex("projects").where({ name: "Two-blade flexure stage" }).first()).id;
  layoutId = (await createLayout(users.designer, projectId, { name: "Override bench", description: "" })).id;
});
afterAll(async () => {
  await closeAnalysisPool();
  await knex.destroy();
  await db().destroy();
});

describe("rule overrides", () => {
  it("only administrators change them (403 for the other roles); every role reads them", async () => {
    for (const role of ["designer", "checker", "manager"]) {
      await expect(
        changeOverride(users[role], projectId, { action: "set", rule: "redundant-constraint", severity: "warning", options: null, reason: why }),
      ).rejects.toMatchObject({ status: 403 });
      expect((await listOverrides(users[role], projectId)).current).toEqual([]);
    }
    await expect(listOverrides(users.manager, 999999)).rejects.toMatchObject({ status: 404 });
  });

  it("refuses an unknown rule, unknown or ill-typed options, an override that changes nothing, and a missing reason (422)", async () => {
    const a = users.admin;
    await expect(changeOverride(a, projectId, { action: "set", rule: "no-such-rule", severity: "info", options: null, reason: why })).rejects.toMatchObject({
      status: 422,
      message: expect.stringMatching(/no rule "no-such-rule"/),
    });
    await expect(
      changeOverride(a, projectId, { action: "set", rule: "weak-constraint", severity: null, options: { treshold: 0.1 }, reason: why }),
    ).rejects.toMatchObject({
      status: 422,
      details: { fieldErrors: { options: ["Known options: threshold."] } },
    });
    await expect(
      changeOverride(a, projectId, { action: "set", rule: "weak-constraint", severity: null, options: { threshold: "high" }, reason: why }),
    ).rejects.toMatchObject({ status: 422, message: expect.stringMatching(/do not fit/) });
    await expect(
      changeOverride(a, projectId, { action: "set", rule: "weak-constraint", severity: null, options: { threshold: 2 }, reason: why }),
    ).rejects.toMatchObject({ status: 422 });
    await expect(
      changeOverride(a, projectId, { action: "set", rule: "redundant-constraint", severity: "error", options: null, reason: why }),
    ).rejects.toMatchObject({ status: 422, message: expect.stringMatching(/changes nothing/) });
    await expect(changeOverride(a, projectId, { action: "clear", rule: "redundant-constraint", reason: why })).rejects.toMatchObject({
      status: 422,
      message: expect.stringMatching(/No override/),
    });
    expect(overrideInputSchema.safeParse({ action: "set", rule: "weak-constraint", severity: "info", reason: "short" }).success).toBe(false);
    expect(overrideInputSchema.safeParse({ action: "set", rule: "weak-constraint", severity: "fatal", reason: why }).success).toBe(false);
    expect((await listOverrides(a, projectId)).history).toEqual([]);
  });

  it("an upload is analysed with the overrides in force and keeps them; earlier revisions keep their own analysis", async () => {
    const before = await uploadRevision(users.designer, layoutId, file("breadboard-four-feet.json"), { fileName: "four.json" });
    if (!before.ok) throw new Error("upload refused");
    expect(before.report.findings.filter((f) => f.rule === "redundant-constraint").every((f) => f.severity === "error")).toBe(true);
    expect((await blockingFindings(before.revision.id)).length).toBeGreaterThan(0);

    const set = await changeOverride(users.admin, projectId, { action: "set", rule: "redundant-constraint", severity: "warning", options: null, reason: why });
    expect(set).toMatchObject({
      rule: "redundant-constraint",
      defaultSeverity: "error",
      severity: "warning",
      cleared: false,
      reason: why,
      setBy: users.admin.name,
    });
    expect(await overridesForLayout(layoutId)).toEqual({ "redundant-constraint": { severity: "warning" } });

    const after = await uploadRevision(users.designer, layoutId, file("breadboard-four-feet.json"), { fileName: "four-again.json" });
    if (!after.ok) throw new Error("upload refused");
    const redundant = after.report.findings.filter((f) => f.rule === "redundant-constraint");
    expect(redundant.length).toBeGreaterThan(0);
    expect(redundant.every((f) => f.severity === "warning")).toBe(true);
    expect(after.revision.overrides).toEqual({ "redundant-constraint": { severity: "warning" } });
    // release gating follows the severity the revision was analysed with
    expect((await blockingFindings(after.revision.id)).filter((b) => /self-stress|redundan/i.test(b.title))).toEqual([]);
    // the report names the override with its reason and author; the earlier revision's report has none
    const md = await releaseReportMarkdown(users.manager, after.revision.id);
    expect(md).toContain("## Rule overrides of the project (in force for this revision)");
    expect(md).toContain(`| redundant-constraint | warning | — | ${why} | ${users.admin.name} |`);
    expect(await releaseReportMarkdown(users.manager, before.revision.id)).not.toContain("Rule overrides");
    // the earlier revision is untouched
    const old = await getRevision(users.manager, before.revision.id);
    expect(old.overrides).toEqual({});
    expect(old.findings.filter((f) => f.rule === "redundant-constraint").every((f) => f.severity === "error")).toBe(true);
  });

  it("options change what a rule finds: a stricter conditioning threshold flags the three-seat support", async () => {
    const plain = await uploadRevision(users.designer, layoutId, file("breadboard-three-seats.json"), { fileName: "three.json" });
    if (!plain.ok) throw new Error("upload refused");
    expect(plain.report.conditioning).toBeLessThan(0.9);
    expect(plain.report.findings.some((f) => f.rule === "weak-constraint")).toBe(false);
    await changeOverride(users.admin, projectId, {
      action: "set",
      rule: "weak-constraint",
      severity: null,
      options: { threshold: 0.9 },
      reason: "Metrology frame: hold every direction firmly.",
    });
    const strict = await uploadRevision(users.designer, layoutId, file("breadboard-three-seats.json"), { fileName: "three-strict.json" });
    if (!strict.ok) throw new Error("upload refused");
    const weak = strict.report.findings.find((f) => f.rule === "weak-constraint");
    expect(weak?.severity).toBe("warning");
    expect(weak?.title).toMatch(/below 0\.9/);
  });

  it("keeps the history with who and why; clearing ends an override and the next upload runs the rule as defined", async () => {
    await changeOverride(users.admin, projectId, { action: "clear", rule: "redundant-constraint", reason: "Base replaced; back to the rule's own severity." });
    const { current, history } = await listOverrides(users.checker, projectId);
    expect(current.map((o) => o.rule)).toEqual(["weak-constraint"]);
    expect(history.map((o) => [o.rule, o.cleared])).toEqual([
      ["redundant-constraint", true],
      ["weak-constraint", false],
      ["redundant-constraint", false],
    ]);
    expect(history.every((o) => o.setBy === users.admin.name && o.reason.length >= 10)).toBe(true);
    const next = await uploadRevision(users.designer, layoutId, file("breadboard-four-feet.json"), { fileName: "four-cleared.json" });
    if (!next.ok) throw new Error("upload refused");
    expect(next.report.findings.filter((f) => f.rule === "redundant-constraint").every((f) => f.severity === "error")).toBe(true);
    expect(next.revision.overrides).toEqual({ "weak-constraint": { options: { threshold: 0.9 } } });
  });
});
