/**
 * Faults: the database stops during an upload (no partial revision, a clear 503, recovery when it is back),
 * and an analysis that fails or runs out of time leaves no revision without its report.
 * Uses its own MariaDB instance on port 3409 so stopping it touches nothing else.
 */
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import knexLib, { type Knex } from "knex";
import { knexConfig } from "../../knexfile";
import { toJson } from "@/lib/layout/serialize";
import { seatedChain } from "../support/instruments";

const env = { ...process.env, DB_PORT: "3409", DB_NAME: "sixfold_fault", DB_USER: "sixfold", DB_PASSWORD: "sixfold-fault" };
Object.assign(process.env, { DB_PORT: env.DB_PORT, DB_NAME: env.DB_NAME, DB_PASSWORD: env.DB_PASSWORD, DB_POOL_MAX: "4" });
const dbScript = (action: "up" | "down") => execFileSync("bash", ["scripts/db.sh", action, "fault", "3409"], { env, stdio: "pipe" });

const { uploadRevision } = await import("@/lib/upload");
const { errorResponse } = await import("@/lib/api/handler");
const { db } = await import("@/lib/db/knex");

let knex: Knex;
let layoutId = 0;
let designer = { id: 0, name: "", email: "", role: "designer" as const };

function bigChain(bodies: number): Uint8Array {
  return new TextEncoder().encode(toJson(seatedChain(bodies, 11)));
}

beforeAll(async () => {
  dbScript("up");
  knex = knexLib(knexConfig(env));
  await knex.migrate.rollback(undefined, true);
  await knex.migrate.latest();
  await knex.seed.run();
  designer = await knex("users").where({ role: "designer" }).first();
  layoutId = (await knex("layouts").first()).id;
}, 120_000);

afterAll(async () => {
  await knex?.destroy();
  await db().destroy();
  dbScript("down");
}, 60_000);

const counts = async () => ({
  revisions: Number((await knex("revisions").count({ n: "*" }).first())!.n),
  findings: Number((await knex("findings").count({ n: "*" }).first())!.n),
});

describe("faults", () => {
  it("MariaDB stopping during an upload: a clear 503, no partial revision; after restart uploads work again", async () => {
    const before = await counts();
    const upload = uploadRevision(designer, layoutId, bigChain(70), { fileName: "chain.json" });
    // the analysis runs in a worker for about a second: stop the database meanwhile
    await new Promise((r) => setTimeout(r, 200));
    dbScript("down");
    const outcome = await upload.then(
      () => null,
      (e) => e,
    );
    expect(outcome).not.toBeNull();
    const res = errorResponse(outcome);
    expect(res.status).toBe(503);
    expect((await res.json()).error).toMatch(/database is not reachable.*Nothing was stored/);

    dbScript("up");
    await knex.destroy();
    knex = knexLib(knexConfig(env));
    expect(await counts()).toEqual(before);
    // recovery: the app's pool may hold one connection that died with the server; that request answers 503 and the pool drops it
    const file = new Uint8Array(readFileSync("examples/breadboard-three-seats.json"));
    let again = await uploadRevision(designer, layoutId, file, { fileName: "three.json" }).catch((e) => e);
    if (!("ok" in again)) {
      expect(errorResponse(again).status).toBe(503);
      again = await uploadRevision(designer, layoutId, file, { fileName: "three.json" });
    }
    expect(again.ok).toBe(true);
    const after = await counts();
    expect(after.revisions).toBe(before.revisions + 1);
  }, 120_000);

  it("an analysis that runs out of time stores nothing and says so", async () => {
    const before = await counts();
    process.env.SIXFOLD_ANALYSIS_TIMEOUT_MS = "5";
    try {
      await expect(uploadRevision(designer, layoutId, bigChain(40), { fileName: "slow.json" })).rejects.toMatchObject({
        status: 503,
        message: expect.stringMatching(/Nothing was stored/),
      });
    } finally {
      delete process.env.SIXFOLD_ANALYSIS_TIMEOUT_MS;
    }
    expect(await counts()).toEqual(before);
    // every stored revision has its report and its findings rows
    const revs = await knex("revisions").select("id", "report");
    for (const r of revs) expect(JSON.parse(r.report).counts).toBeTruthy();
  });
});
