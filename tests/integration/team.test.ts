/** Dashboard figures on seeded data, the mail outbox with retry, API tokens (hashing, revocation, scope). */
import { createHash } from "node:crypto";
import { existsSync, readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetDatabase, testKnex } from "./setup-db";
import type { SessionUser } from "@/lib/auth/session";

const { dashboard, dashboardCsv } = await import("@/lib/db/dashboard");
const { enqueueMail, flushOutbox, backoffSeconds, setMutedKinds } = await import("@/lib/mail/outbox");
const { authenticateToken, createToken, listTokens, revokeToken } = await import("@/lib/db/tokens");
const { uploadRevision } = await import("@/lib/upload");
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

describe("dashboard (seeded Larkspur data)", () => {
  it("counts open findings by project and severity as the seeds leave them", async () => {
    const d = await dashboard(users.manager, { days: 30 });
    const row = (name: string) => d.rows.find((r) => r.project === name);
    // breadboard: the functional-point and thermal-drift infos stay open after revision 2
    expect(row("Interferometer breadboard")).toMatchObject({ error: 0, warning: 0, info: 2 });
    // instrument plate: 2 load-drives-freedom + 2 seat-lift-off errors; repeatability and thermal drift over
    // their allowances (warnings); two functional points (infos)
    expect(row("Detachable instrument plate")).toMatchObject({ error: 4, warning: 2, info: 2 });
    // flexure stage: redundancy waived; count-mismatch and foundation warnings, point and thermal-drift infos open
    expect(row("Two-blade flexure stage")).toMatchObject({ error: 0, warning: 2, info: 2 });
    // the demo history is spread over the past weeks: the breadboard's two infos date from its first revision (38 days ago)
    expect(d.totals).toMatchObject({ error: 4, warning: 4, info: 6, underWeek: 0, underMonth: 12, older: 2 });
    expect(d.trend).toHaveLength(30);
    expect(d.trend[d.trend.length - 1].open).toBe(14);
    // over 60 days the review converges: more findings were open at some point than are open today
    const long = await dashboard(users.manager, { days: 60 });
    expect(Math.max(...long.trend.map((t) => t.open))).toBeGreaterThan(long.trend[long.trend.length - 1].open);
    expect(long.trend[0].open).toBe(0);
  });

  it("filters by project, rule and checker, and lists ready and blocked layouts with their blockers", async () => {
    const plate = await knex("projects").where({ name: "Detachable instrument plate" }).first();
    expect((await dashboard(users.manager, { days: 30, project: plate.id })).rows).toHaveLength(1);
    const byRule = await dashboard(users.manager, { days: 30, rule: "seat-lift-off" });
    expect(byRule.totals).toMatchObject({ error: 2, warning: 0, info: 0 });
    const d = await dashboard(users.manager, { days: 30 });
    const blocked = d.layouts.find((l) => l.name === "Plate coupling")!;
    expect(blocked.state).toBe("blocked");
    expect(blocked.blocking).toHaveLength(4);
    expect(d.layouts.find((l) => l.name === "Breadboard support")!.state).toBe("requested");
    expect(d.layouts.find((l) => l.name === "Stage guidance")!.state).toBe("released");
    const csv = dashboardCsv(d);
    const injected = dashboardCsv({ ...d, rows: [{ ...d.rows[0], project: '=HYPERLINK("http://x.invalid")' }] });
    expect(injected.split("\n")[1]).toMatch(/^"'=HYPERLINK\(""http:\/\/x\.invalid""\)"/);
    expect(csv.split("\n")[0]).toMatch(/^project,checker,open errors/);
    expect(csv).toMatch(/\ntotal,,4,4,6,0,12,2\n/);
    // under a rule filter the blocked list names that rule's blockers only
    const liftOnly = await dashboard(users.manager, { days: 30, rule: "seat-lift-off" });
    expect(
      liftOnly.layouts
        .find((l) => l.name === "Plate coupling")!
        .blocking.map((b) => b.title)
        .join(" "),
    ).not.toMatch(/drives a free motion/);
    expect(liftOnly.layouts.find((l) => l.name === "Plate coupling")!.blocking).toHaveLength(2);
  });
});

describe("mail outbox", () => {
  it("queues one mail per recipient, skips the actor and muted kinds, retries failures with backoff, then sends", async () => {
    await knex("mail_outbox").delete();
    await setMutedKinds(users.manager.id, ["comment"]);
    await enqueueMail([users.designer.id, users.checker.id, users.manager.id], "comment", "Test subject", "Body text", "/findings/1", users.checker.id);
    const queued = await knex("mail_outbox").select("to_address", "status", "text_body", "html_body");
    expect(queued.map((q) => q.to_address)).toEqual([users.designer.email]);
    expect(queued[0].text_body).toMatch(/\/findings\/1/);
    expect(queued[0].html_body).toMatch(/<a href=".*\/findings\/1">/);

    // no SMTP server at this port: the attempt fails and is kept for later
    const port = process.env.SMTP_PORT;
    process.env.SMTP_PORT = "1";
    expect(await flushOutbox()).toBe(0);
    const failed = await knex("mail_outbox").first();
    expect(failed).toMatchObject({ status: "pending", attempts: 1 });
    expect(failed.last_error).toBeTruthy();
    expect(new Date(failed.next_attempt_at).getTime()).toBeGreaterThan(Date.now() + 20_000);
    expect(backoffSeconds(1)).toBe(30);
    expect(backoffSeconds(3)).toBe(480);
    expect(backoffSeconds(20)).toBe(3600);

    // the fake SMTP server of the test command is up: the retry goes out
    process.env.SMTP_PORT = port;
    await knex("mail_outbox").update({ next_attempt_at: new Date(Date.now() - 1000) });
    expect(await flushOutbox()).toBe(1);
    expect(await knex("mail_outbox").first()).toMatchObject({ status: "sent", attempts: 2 });
    // the test command's fake SMTP server writes every message it accepts to this file
    const file = process.env.MAIL_CAPTURE_FILE ?? "";
    await expect.poll(() => (existsSync(file) ? readFileSync(file, "utf8") : ""), { timeout: 5000 }).toMatch(/\[Sixfold\] Test subject/);
  });
});

describe("API tokens", () => {
  it("stores only a SHA-256 hash, authenticates, records last use, and stops working when revoked", async () => {
    const { token, info } = await createToken(users.designer, "CAD station");
    expect(token).toMatch(/^sfx_/);
    const row = await knex("api_tokens").where({ id: info.id }).first();
    expect(row.token_hash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(row)).not.toContain(token);
    expect(await authenticateToken(token)).toMatchObject({ id: users.designer.id, role: "designer" });
    expect((await listTokens(users.designer))[0].lastUsedAt).not.toBeNull();
    expect(await authenticateToken(token.slice(0, -2) + "xx")).toBeNull();
    expect(await authenticateToken("not-a-token")).toBeNull();
    await expect(revokeToken(users.checker, info.id)).rejects.toMatchObject({ status: 404 });
    await revokeToken(users.designer, info.id);
    expect(await authenticateToken(token)).toBeNull();
  });

  it("a token carries its owner's role: a checker's token cannot upload", async () => {
    const { token } = await createToken(users.checker, "checker script");
    const who = await authenticateToken(token);
    const layout = await knex("layouts").first();
    await expect(uploadRevision(who!, layout.id, new Uint8Array([123]), { fileName: "x.json" })).rejects.toMatchObject({ status: 403 });
  });
});
