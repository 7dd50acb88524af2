/** The upload path: analysis in a worker thread (the event loop keeps ticking), refused files store nothing. */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetDatabase, testKnex } from "./setup-db";
import type { SessionUser } from "@/lib/auth/session";
import { toJson } from "@/lib/layout/serialize";
import { seatedChain } from "../support/instruments";

const { uploadRevision } = await import("@/lib/upload");
const { analyseInWorker, analysisPoolStats, closeAnalysisPool } = await import("@/lib/worker/run-analysis");
const { createLayout } = await import("@/lib/db/layouts");
const { db } = await import("@/lib/db/knex");

const knex = testKnex();
let designer: SessionUser;
let layoutId = 0;

beforeAll(async () => {
  await resetDatabase(knex);
  designer = await knex("users").where({ role: "designer" }).first();
  const project = await knex("projects").first();
  layoutId = (await createLayout(designer, project.id, { name: "Worker bench", description: "" })).id;
});
afterAll(async () => {
  await closeAnalysisPool();
  await knex.destroy();
  await db().destroy();
});

const bigChain = (bodies: number) => seatedChain(bodies, 3);

describe("uploadRevision", () => {
  it("analyses in a worker thread: the main event loop keeps ticking during a large analysis", async () => {
    const bytes = new TextEncoder().encode(toJson(bigChain(60)));
    let ticks = 0;
    const timer = setInterval(() => ticks++, 10);
    const started = Date.now();
    const result = await uploadRevision(designer, layoutId, bytes, { fileName: "chain.json" });
    const elapsed = Date.now() - started;
    clearInterval(timer);
    expect(result.ok).toBe(true);
    // a blocked loop would tick about once; a free one about every 10 ms of the analysis
    expect(ticks).toBeGreaterThan(Math.min(5, elapsed / 40));
    if (result.ok) expect(result.report.counts.bodies).toBe(60);
  });

  it("stores a good file as the next revision with its findings", async () => {
    const result = await uploadRevision(designer, layoutId, new Uint8Array(readFileSync("examples/breadboard-four-feet.xml")), {
      fileName: "breadboard-four-feet.xml",
    });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.revision).toMatchObject({ number: 2, encoding: "xml" });
    expect(await knex("findings").where({ revision_id: result.revision.id }).count({ n: "*" }).first()).toEqual({ n: result.report.findings.length });
  });

  it("refuses a bad file with located errors and stores nothing but the attempt", async () => {
    const before = await knex("revisions").count({ n: "*" }).first();
    const result = await uploadRevision(designer, layoutId, new TextEncoder().encode("id,x,y,z,nx,ny,nz\na,0,0,0,0,0,0\n"), { fileName: "bad.csv" });
    expect(result).toEqual({ ok: false, errors: [{ location: "line 2, columns 5–7 (nx, ny, nz)", message: "normal has zero length" }] });
    expect(await knex("revisions").count({ n: "*" }).first()).toEqual(before);
    expect(await knex("upload_attempts").where({ accepted: false }).count({ n: "*" }).first()).toEqual({ n: 1 });
  });

  it("returns located warnings for unknown fields of an accepted file", async () => {
    const text = readFileSync("examples/breadboard-three-seats.json", "utf8").replace('"format"', '"colour": "red", "format"');
    const result = await uploadRevision(designer, layoutId, new TextEncoder().encode(text), { fileName: "coloured.json" });
    expect(result.ok && result.warnings).toEqual(['/colour: unknown field "colour" was ignored (check the spelling)']);
  });

  it("takes the CSV units given at upload", async () => {
    const result = await uploadRevision(designer, layoutId, new Uint8Array(readFileSync("examples/mirror-cell-three-vee.csv")), {
      fileName: "cell.csv",
      length: "in",
      force: "lbf",
    });
    expect(result.ok && result.report.units).toEqual({ length: "in", force: "lbf" });
  });

  it("hostile files through the upload path: each refused with located errors, no revision stored", async () => {
    const enc = (t: string) => new TextEncoder().encode(t);
    const hostile: [string, Uint8Array][] = [
      ["lolz.xml", enc('<?xml version="1.0"?><!DOCTYPE lolz [<!ENTITY lol "lol">]><mount-layout format="mount-layout/1">&lol;</mount-layout>')],
      ["xxe.xml", enc('<!DOCTYPE x [<!ENTITY xxe SYSTEM "file:///etc/passwd">]><mount-layout/>')],
      ["deep.json", enc("[".repeat(300000) + "]".repeat(300000))],
      ["deep.xml", enc("<a>".repeat(20000) + "</a>".repeat(20000))],
      ["binary.json", Uint8Array.from({ length: 2048 }, (_, i) => (i * 131) % 256)],
      ["huge.json", new Uint8Array(5 * 1024 * 1024 + 10).fill(0x20)],
      ["nan.csv", enc("id,x,y,z,nx,ny,nz\na,NaN,0,0,0,0,1\n")],
      ["quotes.csv", enc('id,x,y,z,nx,ny,nz\n"a,"b",0,0,0,0,1\n')],
      ["types.json", enc('{"format":"mount-layout/1","bodies":"x","contacts":7}')],
    ];
    const before = await knex("revisions").count({ n: "*" }).first();
    for (const [name, bytes] of hostile) {
      const r = await uploadRevision(designer, layoutId, bytes, { fileName: name });
      expect(r.ok, name).toBe(false);
      if (!r.ok) for (const e of r.errors) expect(e.location, name).toBeTruthy();
    }
    expect(await knex("revisions").count({ n: "*" }).first()).toEqual(before);
  });

  it("refuses other roles (403) and an empty file (located error, like any refused file)", async () => {
    const checker = await knex("users").where({ role: "checker" }).first();
    await expect(uploadRevision(checker, layoutId, new Uint8Array([1]), { fileName: "x.json" })).rejects.toMatchObject({ status: 403 });
    expect(await uploadRevision(designer, layoutId, new Uint8Array(0), { fileName: "x.json" })).toEqual({
      ok: false,
      errors: [{ location: "file", message: "the file is empty" }],
    });
  });

  it("reuses its analysis threads: six uploads in a row run on the same thread, not six new ones", async () => {
    await closeAnalysisPool();
    const file = new Uint8Array(readFileSync("examples/breadboard-three-seats.json"));
    const ids = new Set<number>();
    for (let i = 0; i < 6; i++) {
      expect((await uploadRevision(designer, layoutId, file, { fileName: `seq-${i}.json` })).ok).toBe(true);
      for (const id of analysisPoolStats().threadIds) ids.add(id);
    }
    expect(ids.size).toBe(1);
    expect(analysisPoolStats().completed).toBe(6);
  });

  it("a full analysis queue refuses further uploads with 503 and stores nothing for them", async () => {
    await closeAnalysisPool();
    process.env.SIXFOLD_ANALYSIS_THREADS = "1";
    process.env.SIXFOLD_ANALYSIS_QUEUE = "1";
    try {
      const before = Number((await knex("revisions").where({ layout_id: layoutId }).count({ n: "*" }).first())!.n);
      const file = new Uint8Array(readFileSync("examples/breadboard-three-seats.json"));
      // one long analysis runs and one waits: the single queue place is taken
      const slow = new TextEncoder().encode(toJson(bigChain(60)));
      const busy = [analyseInWorker(slow, { fileName: "busy-1.json" }), analyseInWorker(slow, { fileName: "busy-2.json" })];
      await expect(uploadRevision(designer, layoutId, file, { fileName: "turned-away.json" })).rejects.toMatchObject({
        status: 503,
        message: expect.stringMatching(/1 layouts are already waiting for analysis.*Nothing was stored/),
      });
      expect((await Promise.all(busy)).every((o) => o.ok)).toBe(true);
      expect(Number((await knex("revisions").where({ layout_id: layoutId }).count({ n: "*" }).first())!.n)).toBe(before);
      // once the queue drains the same upload goes through
      expect((await uploadRevision(designer, layoutId, file, { fileName: "turned-away.json" })).ok).toBe(true);
    } finally {
      delete process.env.SIXFOLD_ANALYSIS_THREADS;
      delete process.env.SIXFOLD_ANALYSIS_QUEUE;
      await closeAnalysisPool();
    }
  });
});
