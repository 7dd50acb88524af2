/** lib/db review functions against MariaDB, with roles: carry-over, waivers, concurrency, comments, release. */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetDatabase, testKnex } from "./setup-db";
import { parseLayoutText } from "@/lib/layout";
import { runEngine } from "@/lib/engine";
import type { SessionUser } from "@/lib/auth/session";

const { createLayout, listLayouts } = await import("@/lib/db/layouts");
const { storeRevision, getRevision, recordRefusedUpload, diffRevisions } = await import("@/lib/db/revisions");
const { addComment, changeStatus, editComment, getThread, listThreads } = await import("@/lib/db/threads");
const { approveRelease, requestRelease } = await import("@/lib/db/releases");
const { releaseReportMarkdown } = await import("@/lib/report/release");
const { db } = await import("@/lib/db/knex");

const knex = testKnex();
const users: Record<string, SessionUser> = {};
let projectId = 0;

function analysed(file: string) {
  const raw = readFileSync(`examples/${file}`, "utf8");
  const p = parseLayoutText(raw, { fileName: file });
  if (!p.ok) throw new Error(file);
  return { fileName: file, encoding: "json" as const, raw, layout: p.layout, report: runEngine(p.layout).report };
}

beforeAll(async () => {
  await resetDatabase(knex);
  for (const u of await knex("users").select("id", "name", "email", "role")) users[u.role] = u;
  projectId = (await knex("projects").where({ name: "Two-blade flexure stage" }).first()).id;
});
afterAll(async () => {
  await knex.destroy();
  await db().destroy();
});

describe("layouts", () => {
  it("designers create layouts; other roles get 403; names are unique per project (409)", async () => {
    const l = await createLayout(users.designer, projectId, { name: "Test bench A", description: "" });
    expect(l).toMatchObject({ name: "Test bench A", revisions: 0 });
    await expect(createLayout(users.checker, projectId, { name: "Nope", description: "" })).rejects.toMatchObject({ status: 403 });
    await expect(createLayout(users.manager, projectId, { name: "Nope", description: "" })).rejects.toMatchObject({ status: 403 });
    await expect(createLayout(users.designer, projectId, { name: "Test bench A", description: "" })).rejects.toMatchObject({ status: 409 });
    await expect(createLayout(users.designer, 999999, { name: "Lost", description: "" })).rejects.toMatchObject({ status: 404 });
  });
});

describe("revisions and thread carry-over", () => {
  let layoutId = 0;
  let r1 = 0;
  let r2 = 0;
  it("stores a revision with its findings, one thread per fingerprint; only designers upload", async () => {
    layoutId = (await createLayout(users.designer, projectId, { name: "Carry-over bench", description: "" })).id;
    await expect(storeRevision(users.checker, layoutId, analysed("breadboard-four-feet.json"))).rejects.toMatchObject({ status: 403 });
    r1 = (await storeRevision(users.designer, layoutId, analysed("breadboard-four-feet.json"))).id;
    const rev = await getRevision(users.manager, r1);
    expect(rev.number).toBe(1);
    expect(rev.findings.map((f) => f.rule)).toContain("redundant-constraint");
    expect(rev.findings.every((f) => f.status === "open")).toBe(true);
    const threads = await listThreads(users.manager, layoutId);
    expect(threads).toHaveLength(rev.findings.length);
  });

  it("waiving needs a checker, a reason and the current version; a stale version is refused (409)", async () => {
    const t = (await listThreads(users.manager, layoutId)).find((x) => x.rule === "count-mismatch")!;
    await expect(changeStatus(users.designer, t.id, { action: "waive", reason: "Looks fine to me, honestly.", version: t.version })).rejects.toMatchObject({
      status: 403,
    });
    const waived = await changeStatus(users.checker, t.id, { action: "waive", reason: "Counted by hand: the loop is the four feet.", version: t.version });
    expect(waived).toMatchObject({ status: "waived", waiverReason: "Counted by hand: the loop is the four feet.", waivedBy: users.checker.name });
    await expect(changeStatus(users.checker, t.id, { action: "reopen", reason: "", version: t.version })).rejects.toMatchObject({ status: 409 });
    const reopened = await changeStatus(users.checker, t.id, { action: "reopen", reason: "", version: waived.version });
    expect(reopened.status).toBe("reopened");
    const again = await changeStatus(users.checker, t.id, {
      action: "waive",
      reason: "Counted by hand: the loop is the four feet.",
      version: reopened.version,
    });
    expect(again.history.map((e) => e.kind)).toEqual(["open", "waive", "reopen", "waive"]);
  });

  it("a second revision resolves vanished findings and keeps the thread of a repeated one", async () => {
    const before = await listThreads(users.manager, layoutId);
    r2 = (await storeRevision(users.designer, layoutId, analysed("breadboard-three-seats.json"))).id;
    const after = await listThreads(users.manager, layoutId);
    const red = after.find((t) => t.rule === "redundant-constraint")!;
    expect(red.status).toBe("resolved");
    const point = after.filter((t) => t.rule === "functional-point-sensitivity");
    expect(point).toHaveLength(1);
    expect(point[0].id).toBe(before.find((t) => t.rule === "functional-point-sensitivity")!.id);
    expect(point[0].lastRevision).toBe(2);
  });

  it("a reappearing fingerprint reopens its thread", async () => {
    await storeRevision(users.designer, layoutId, analysed("breadboard-four-feet.json"));
    const red = (await listThreads(users.manager, layoutId)).find((t) => t.rule === "redundant-constraint")!;
    expect(red.status).toBe("reopened");
    // the waived count-mismatch resolved when it vanished in r2; back in r3 it is reopened for a fresh look
    expect((await listThreads(users.manager, layoutId)).find((t) => t.rule === "count-mismatch")!.status).toBe("reopened");
  });

  it("the diff names removed and added contacts and new / resolved findings", async () => {
    const d = await diffRevisions(users.manager, r1, r2);
    expect(d.contacts.removed).toEqual(["F1", "F2", "F3", "F4"]);
    expect(d.contacts.added).toHaveLength(6);
    expect(d.findings.resolved.map((f) => f.title).join(" ")).toMatch(/Over-constrained loop/);
    // the functional point and the thermal drift of the aluminium board keep their threads, but their numbers
    // changed: they are reported as changed, before → after, not as unchanged
    expect(d.findings.unchanged).toEqual([]);
    const point = d.findings.changed.find((f) => /beam-splitter/.test(f.title))!;
    expect(point.before.title).toMatch(/up to 0\.3151 µm/);
    expect(point.title).toMatch(/up to 0\.6474 µm/);
    expect(d.findings.changed.map((f) => f.title).join(" ")).toMatch(/Thermal drift up to/);
  });

  it("a refused upload stores only the attempt", async () => {
    const revisionsBefore = await knex("revisions").where({ layout_id: layoutId }).count({ n: "*" }).first();
    await recordRefusedUpload(users.designer, layoutId, "bad.csv", 12, [{ location: "line 2, column 3 (y)", message: "'x' is not a number" }]);
    expect(await knex("revisions").where({ layout_id: layoutId }).count({ n: "*" }).first()).toEqual(revisionsBefore);
    const attempt = await knex("upload_attempts").where({ layout_id: layoutId, accepted: false }).first();
    expect(JSON.parse(attempt.errors)[0].location).toBe("line 2, column 3 (y)");
  });
});

describe("assigned checker", () => {
  it("when a project has an assigned checker, another checker may comment but not waive or approve (403)", async () => {
    const [otherId] = await knex("users").insert({ email: "sam@larkspur.example", name: "Sam Ito", role: "checker", password_hash: "x" });
    const other: SessionUser = { id: otherId, name: "Sam Ito", email: "sam@larkspur.example", role: "checker" };
    const layoutId = (await createLayout(users.designer, projectId, { name: "Assigned bench", description: "" })).id;
    const rev = await storeRevision(users.designer, layoutId, analysed("breadboard-three-seats.json"));
    const t = (await listThreads(users.manager, layoutId))[0];
    await expect(changeStatus(other, t.id, { action: "waive", reason: "Not my project, but let me try.", version: t.version })).rejects.toMatchObject({
      status: 403,
      message: expect.stringMatching(/Chen Okafor is the checker/),
    });
    await requestRelease(users.designer, rev.id);
    await expect(approveRelease(other, rev.id)).rejects.toMatchObject({ status: 403 });
    expect((await addComment(other, t.id, "A second pair of eyes: looks fine.")).author.name).toBe("Sam Ito");
  });
});

describe("comments", () => {
  it("designers and checkers comment; managers and admins read only; mentions are found; authors edit their own with history", async () => {
    const layoutId = (await createLayout(users.designer, projectId, { name: "Comment bench", description: "" })).id;
    await storeRevision(users.designer, layoutId, analysed("breadboard-four-feet.json"));
    const t = (await listThreads(users.manager, layoutId))[0];
    const c = await addComment(users.checker, t.id, "| a | b |\n|---|---|\n| 1 | 2 |\n\n$k\\delta/4$ @dana please look");
    expect(c.author.name).toBe(users.checker.name);
    await expect(addComment(users.manager, t.id, "hello")).rejects.toMatchObject({ status: 403 });
    await expect(addComment(users.admin, t.id, "hello")).rejects.toMatchObject({ status: 403 });
    const ev = await knex("events").where({ thread_id: t.id, kind: "comment" }).first();
    expect(JSON.parse(ev.detail).mentions).toEqual([users.designer.id]);
    await expect(editComment(users.designer, c.id, "changed by someone else")).rejects.toMatchObject({ status: 403 });
    const edited = await editComment(users.checker, c.id, "Corrected text.");
    expect(edited.body).toBe("Corrected text.");
    expect(edited.history).toHaveLength(1);
    expect(edited.history[0].body).toMatch(/@dana/);
    expect(edited.editedAt).not.toBeNull();
  });
});

describe("release", () => {
  it("approval is refused while an error is open, allowed once it is waived; the released revision is read-only", async () => {
    const layoutId = (await createLayout(users.designer, projectId, { name: "Release bench", description: "" })).id;
    const rev = await storeRevision(users.designer, layoutId, analysed("flexure-stage-full-blades.json"));
    await expect(requestRelease(users.checker, rev.id)).rejects.toMatchObject({ status: 403 });
    await expect(approveRelease(users.checker, rev.id)).rejects.toMatchObject({ status: 409 }); // not requested
    await requestRelease(users.designer, rev.id);
    await expect(requestRelease(users.designer, rev.id)).rejects.toMatchObject({ status: 409 });
    await expect(approveRelease(users.designer, rev.id)).rejects.toMatchObject({ status: 403 });
    await expect(approveRelease(users.checker, rev.id)).rejects.toMatchObject({ status: 409, message: expect.stringMatching(/still open/) });
    const red = (await listThreads(users.manager, layoutId)).find((t) => t.rule === "redundant-constraint")!;
    await changeStatus(users.checker, red.id, { action: "waive", reason: "Blade twist absorbs the redundant rotation.", version: red.version });
    await approveRelease(users.checker, rev.id, async () => "# report");
    const stored = await knex("releases").where({ revision_id: rev.id }).first();
    expect(stored).toMatchObject({ approved_by: users.checker.id, report_md: "# report" });
    const thread = await getThread(users.manager, red.id);
    expect(thread.readOnly).toBe(true);
    await expect(addComment(users.designer, red.id, "late remark")).rejects.toMatchObject({ status: 409 });
    await expect(changeStatus(users.checker, red.id, { action: "reopen", reason: "", version: thread.version })).rejects.toMatchObject({ status: 409 });
    const [summary] = (await listLayouts(users.manager, projectId)).filter((l) => l.id === layoutId);
    expect(summary).toMatchObject({ released: true, openErrors: 0, waived: 1 });
  });
});

describe("the report never claims an approval that did not happen", () => {
  it("a requested but unapproved revision prints as a draft, whoever reads it; after approval the stored record names the checker", async () => {
    const layoutId = (await createLayout(users.designer, projectId, { name: "Draft bench", description: "" })).id;
    const rev = await storeRevision(users.designer, layoutId, analysed("flexure-stage-full-blades.json"));
    await requestRelease(users.designer, rev.id);
    for (const reader of [users.designer, users.checker, users.manager]) {
      const md = await releaseReportMarkdown(reader, rev.id);
      expect(md.split("\n")[0]).toMatch(/^# DRAFT, not approved/);
      expect(md).not.toMatch(/Approved by/);
      expect(md).toMatch(/Not approved\./);
    }
    const red = (await listThreads(users.manager, layoutId)).find((t) => t.rule === "redundant-constraint")!;
    await changeStatus(users.checker, red.id, { action: "waive", reason: "Blade twist absorbs the redundant rotation.", version: red.version });
    await approveRelease(users.checker, rev.id, (rid, approval) => releaseReportMarkdown(users.checker, rid, approval));
    const stored = await knex("releases").where({ revision_id: rev.id }).first();
    expect(stored.report_md).toMatch(/^# Release report/);
    const at = new Date(stored.approved_at).toISOString().slice(0, 16).replace("T", " ");
    expect(stored.report_md).toContain(`Approved by ${users.checker.name} on ${at} UTC.`);
    // read later, by anyone, the approval line comes from the stored record
    expect(await releaseReportMarkdown(users.designer, rev.id)).toContain(`Approved by ${users.checker.name} on ${at} UTC.`);
  });
});

describe("concurrent review writes on one layout", () => {
  const deadlocks = async () => Number((await knex.raw("show global status like 'Innodb_deadlocks'"))[0][0].Value);

  it("uploads, comments, edits and waivers at once all succeed, and MariaDB detects no deadlock (one lock order)", async () => {
    // Before the layout lock came first, an upload (layout, then threads) and a comment (thread by its foreign key,
    // then layout by the event's) could wait on each other; the retry hid most of it, this counter did not.
    const layoutId = (await createLayout(users.designer, projectId, { name: "Busy bench", description: "" })).id;
    await storeRevision(users.designer, layoutId, analysed("breadboard-four-feet.json"));
    const threads = await listThreads(users.manager, layoutId);
    const mine = await addComment(users.checker, threads[0].id, "first remark");
    const before = await deadlocks();
    const files = ["breadboard-three-seats.json", "breadboard-four-feet.json"];
    const work: Promise<unknown>[] = [];
    for (let round = 0; round < 6; round++) {
      work.push(storeRevision(users.designer, layoutId, analysed(files[round % 2])));
      for (const t of threads) work.push(addComment(round % 2 ? users.designer : users.checker, t.id, `round ${round} on ${t.id}`));
      work.push(editComment(users.checker, mine.id, `first remark, edited ${round}`));
      work.push(recordRefusedUpload(users.designer, layoutId, "bad.csv", 10, [{ location: "line 2", message: "x" }]));
    }
    const results = await Promise.allSettled(work);
    expect(results.filter((r) => r.status === "rejected").map((r) => String((r as PromiseRejectedResult).reason))).toEqual([]);
    expect(await deadlocks()).toBe(before);
    const stored = await knex("comments")
      .whereIn(
        "thread_id",
        threads.map((t) => t.id),
      )
      .where("body", "like", "round %")
      .count({ n: "*" })
      .first();
    expect(Number(stored!.n)).toBe(6 * threads.length);
    expect((await knex("revisions").where({ layout_id: layoutId }).max({ n: "number" }).first())!.n).toBe(7);
    // waivers under the same load: each one sees the current version and succeeds
    const now = await listThreads(users.manager, layoutId);
    const open = now.filter((t) => t.status !== "resolved");
    const waives = open.map((t) => changeStatus(users.checker, t.id, { action: "waive", reason: "Accepted for the concurrency check.", version: t.version }));
    const more = open.map((t) => addComment(users.designer, t.id, "while waiving"));
    const last = storeRevision(users.designer, layoutId, analysed("breadboard-four-feet.json"));
    const settled = await Promise.allSettled([...waives, ...more, last]);
    // a waiver may meet a revision stored a moment earlier (409 stale version); nothing else may fail
    const failures = settled.filter((r) => r.status === "rejected").map((r) => (r as PromiseRejectedResult).reason as { status?: number });
    expect(failures.every((e) => e.status === 409)).toBe(true);
    expect(await deadlocks()).toBe(before);
  });

  it("two release requests at once: one is stored, the other is told (409), never a server error", async () => {
    const layoutId = (await createLayout(users.designer, projectId, { name: "Twin request bench", description: "" })).id;
    const rev = await storeRevision(users.designer, layoutId, analysed("breadboard-three-seats.json"));
    const both = await Promise.allSettled([requestRelease(users.designer, rev.id), requestRelease(users.designer, rev.id)]);
    expect(both.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect((both.find((r) => r.status === "rejected") as PromiseRejectedResult).reason).toMatchObject({ status: 409 });
    expect(await knex("releases").where({ revision_id: rev.id }).count({ n: "*" }).first()).toEqual({ n: 1 });
  });

  it("an approval whose review moves on while the report is written is refused (409), not released on a stale report", async () => {
    const layoutId = (await createLayout(users.designer, projectId, { name: "Moving review bench", description: "" })).id;
    const rev = await storeRevision(users.designer, layoutId, analysed("breadboard-three-seats.json"));
    await requestRelease(users.designer, rev.id);
    const thread = (await listThreads(users.manager, layoutId))[0];
    const report = async () => {
      await addComment(users.designer, thread.id, "one more thought while the checker approves");
      return "# report";
    };
    await expect(approveRelease(users.checker, rev.id, report)).rejects.toMatchObject({ status: 409, message: expect.stringMatching(/changed while/) });
    expect((await knex("releases").where({ revision_id: rev.id }).first()).approved_at).toBeNull();
    await approveRelease(users.checker, rev.id, async () => "# report");
    expect((await knex("releases").where({ revision_id: rev.id }).first()).approved_at).not.toBeNull();
  });
});
