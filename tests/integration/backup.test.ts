/** npm run backup / restore round-trips the seeded data (mariadb-dump based). */
import { execFileSync } from "node:child_process";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import knexLib from "knex";
import { resetDatabase, testKnex } from "./setup-db";
import { connectionConfig } from "../../db/connection";

const knex = testKnex();
const target = `${process.env.DB_NAME}_restore`;
const restored = knexLib(connectionConfig({ ...process.env, DB_NAME: target }));

beforeAll(() => resetDatabase(knex));
afterAll(async () => {
  await knex.destroy();
  await restored.destroy();
});

async function counts(k: typeof knex): Promise<Record<string, number>> {
  const tables = (await k.raw("SHOW TABLES"))[0].map((r: Record<string, string>) => Object.values(r)[0]).sort();
  const out: Record<string, number> = {};
  for (const t of tables) out[t] = Number((await k(t).count({ n: "*" }).first())!.n);
  return out;
}

describe("backup and restore", () => {
  it("dumps the database and restores it into another with the same rows", async () => {
    const file = path.join(mkdtempSync(path.join(tmpdir(), "sixfold-backup-")), "demo.sql.gz");
    execFileSync("bash", ["scripts/backup.sh", "backup", file], { env: process.env, stdio: "pipe" });
    execFileSync("bash", ["scripts/backup.sh", "restore", file], { env: { ...process.env, DB_NAME: target }, stdio: "pipe" });
    const before = await counts(knex);
    expect(before.revisions).toBeGreaterThan(0);
    expect(await counts(restored)).toEqual(before);
    const a = await knex("threads").orderBy("id").select("fingerprint", "status", "waiver_reason");
    const b = await restored("threads").orderBy("id").select("fingerprint", "status", "waiver_reason");
    expect(b).toEqual(a);
  });

  it("refuses a file that is not a dump", () => {
    expect(() => execFileSync("bash", ["scripts/backup.sh", "restore", "package.json"], { env: { ...process.env, DB_NAME: target }, stdio: "pipe" })).toThrow();
  });
});
