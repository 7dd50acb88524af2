/** Release of a revision: a designer requests it, a checker approves when no error finding is open. */
import "server-only";
import type { Knex } from "knex";
import { db, lockLayout, transaction } from "./knex";
import { recordEvent } from "./events";
import { AppError, conflict, forbidden, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import type { SessionUser } from "@/lib/auth/session";
import { requireProjectChecker } from "./threads";

/** Error-severity threads that are open or reopened and appear in the revision (they block release). */
export async function blockingFindings(revisionId: number, q: Knex | Knex.Transaction = db()): Promise<{ threadId: number; title: string }[]> {
  const rows = await q("findings as f")
    .join("threads as t", "t.id", "f.thread_id")
    .where("f.revision_id", revisionId)
    .where("f.severity", "error")
    .whereIn("t.status", ["open", "reopened"])
    .select("t.id", "t.title");
  return rows.map((r: { id: number; title: string }) => ({ threadId: r.id, title: r.title }));
}

/** The newest event of a layout: every review change (upload, comment, edit, waiver, request) records one; refused uploads change nothing. */
async function reviewStamp(layoutId: number, q: Knex | Knex.Transaction = db()): Promise<number> {
  const row = await q("events").where({ layout_id: layoutId }).whereNot({ kind: "upload-refused" }).max({ id: "id" }).first();
  return Number(row?.id ?? 0);
}

async function latestOf(layoutId: number, q: Knex | Knex.Transaction = db()) {
  return q("revisions").where({ layout_id: layoutId }).orderBy("number", "desc").first();
}

/** Who hears of a release step of a revision: the layout's name and owner, the project's checker (or every active checker), the requester. */
export async function releaseAudience(
  revisionId: number,
): Promise<{ layoutId: number; layoutName: string; number: number; owner: number; checkers: number[]; requester: number | null }> {
  const rev = await db()("revisions").where({ id: revisionId }).first();
  const l = await db()("layouts as l")
    .join("projects as p", "p.id", "l.project_id")
    .where("l.id", rev.layout_id)
    .select("l.name", "l.created_by", "p.checker_id")
    .first();
  const checkers = l.checker_id
    ? [l.checker_id as number]
    : (await db()("users").where({ role: "checker", active: true }).select("id")).map((u: { id: number }) => u.id);
  const req = await db()("releases").where({ revision_id: revisionId }).first();
  return { layoutId: rev.layout_id, layoutName: l.name, number: rev.number, owner: l.created_by, checkers, requester: req?.requested_by ?? null };
}

/** A designer asks for release of the newest revision. Notifications: lib/review. */
export async function requestRelease(user: SessionUser, revisionId: number): Promise<void> {
  if (!allowed(user.role, "requestRelease")) throw forbidden("Only designers request a release.");
  const rev = await db()("revisions").where({ id: revisionId }).first();
  if (!rev) throw notFound("That revision");
  const latest = await latestOf(rev.layout_id);
  if (latest.id !== rev.id) throw conflict(`Only the newest revision (${latest.number}) can be released.`);
  if (await db()("releases").where({ revision_id: revisionId }).first()) throw conflict("Release of this revision is already requested.");
  await transaction(async (trx) => {
    // checked again under the layout's lock: an upload or another request may have landed meanwhile
    await lockLayout(trx, rev.layout_id, "update");
    if ((await latestOf(rev.layout_id, trx)).id !== rev.id) throw conflict("A newer revision was uploaded a moment ago; request release of that one.");
    if (await trx("releases").where({ revision_id: revisionId }).first()) throw conflict("Release of this revision is already requested.");
    await trx("releases").insert({ revision_id: revisionId, requested_by: user.id });
    await recordEvent(trx, { layoutId: rev.layout_id, kind: "release-request", actorId: user.id, revisionId, detail: { number: rev.number } });
  });
}

/** A designer withdraws a release request until it is approved; recorded in the layout's history. */
export async function withdrawRelease(user: SessionUser, revisionId: number): Promise<void> {
  if (!allowed(user.role, "withdrawRelease")) throw forbidden("Only designers withdraw a release request.");
  const rev = await db()("revisions").where({ id: revisionId }).first();
  if (!rev) throw notFound("That revision");
  await transaction(async (trx) => {
    await lockLayout(trx, rev.layout_id, "update");
    const req = await trx("releases").where({ revision_id: revisionId }).first();
    if (!req) throw conflict("No release has been requested for this revision.");
    if (req.approved_at) throw conflict("This revision is already released; a release cannot be withdrawn.");
    await trx("releases").where({ revision_id: revisionId }).whereNull("approved_at").delete();
    await recordEvent(trx, { layoutId: rev.layout_id, kind: "release-withdraw", actorId: user.id, revisionId, detail: { number: rev.number } });
  });
}

/** A checker approves a requested release when no error finding is open. */
export async function approveRelease(
  user: SessionUser,
  revisionId: number,
  reportMarkdown?: (revisionId: number, approval: { by: string; at: Date }) => Promise<string>,
): Promise<void> {
  if (!allowed(user.role, "approveRelease")) throw forbidden("Only checkers approve a release.");
  const rev = await db()("revisions").where({ id: revisionId }).first();
  if (!rev) throw notFound("That revision");
  await requireProjectChecker(db(), rev.layout_id, user);
  const req = await db()("releases").where({ revision_id: revisionId }).first();
  if (!req) throw conflict("No release has been requested for this revision.");
  if (req.approved_at) throw conflict("This revision is already released.");
  const latest = await latestOf(rev.layout_id);
  if (latest.id !== rev.id) throw conflict(`A newer revision (${latest.number}) exists; release that one instead.`);
  const blocking = await blockingFindings(revisionId);
  if (blocking.length)
    throw new AppError(
      409,
      `${blocking.length} error finding${blocking.length === 1 ? " is" : "s are"} still open: ${blocking.map((b) => b.title).join("; ")}`,
      { blocking },
    );
  // the report is written from the review as it stands now; the transaction refuses if the review moves on meanwhile
  const stamp = await reviewStamp(rev.layout_id);
  // the approval the report records is exactly the one stored below (same person, same instant)
  const approvedAt = new Date();
  const md = reportMarkdown ? await reportMarkdown(revisionId, { by: user.name, at: approvedAt }) : null;
  await transaction(async (trx) => {
    await lockLayout(trx, rev.layout_id, "update");
    if ((await reviewStamp(rev.layout_id, trx)) !== stamp)
      throw conflict("The review changed while the release was being approved (a comment, waiver or upload). Reload and approve again.");
    if ((await blockingFindings(revisionId, trx)).length) throw conflict("An error finding was reopened a moment ago; the release stays blocked.");
    const n = await trx("releases")
      .where({ revision_id: revisionId })
      .whereNull("approved_at")
      .update({ approved_by: user.id, approved_at: approvedAt, report_md: md });
    if (n !== 1) throw conflict("This revision was released by someone else a moment ago.");
    await recordEvent(trx, { layoutId: rev.layout_id, kind: "release", actorId: user.id, revisionId, detail: { number: rev.number } });
  });
}
