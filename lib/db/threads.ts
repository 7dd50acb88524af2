/** Review threads: read one with its findings, comments and history; waive, reopen; comment and edit. */
import "server-only";
import { iso, isoOrNull } from "./rows";
import { z } from "zod";
import type { Knex } from "knex";
import { db, lockLayout, transaction } from "./knex";
import { listEvents, recordEvent } from "./events";
import { AppError, conflict, forbidden, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import type { SessionUser } from "@/lib/auth/session";
import type { ThreadStatus, CommentDto, ThreadDto } from "@/lib/contracts/threads";
import { statusSchema } from "@/lib/contracts/threads";
export type { ThreadStatus, CommentDto, ThreadDto } from "@/lib/contracts/threads";
export { commentSchema, statusSchema } from "@/lib/contracts/threads";

/** Who follows a thread: the layout's owner, the project's checker and everyone who commented on it. */
export async function threadFollowers(
  threadId: number,
): Promise<{ owner: number; checker: number | null; commenters: number[]; layoutName: string; title: string }> {
  const t = await db()("threads as t")
    .join("layouts as l", "l.id", "t.layout_id")
    .join("projects as p", "p.id", "l.project_id")
    .where("t.id", threadId)
    .select("l.created_by", "p.checker_id", "l.name", "t.title")
    .first();
  const commenters = (await db()("comments").where({ thread_id: threadId }).distinct("author_id")).map((r: { author_id: number }) => r.author_id);
  return { owner: t.created_by, checker: t.checker_id ?? null, commenters, layoutName: t.name, title: t.title };
}

/** A comment joined with its author. */
interface CommentRow {
  id: number;
  thread_id: number;
  author_id: number;
  body: string;
  created_at: Date;
  edited_at: Date | null;
  name: string;
  role: string;
}

/** An earlier text of an edited comment. */
interface CommentEditRow {
  comment_id: number;
  body: string;
  replaced_at: Date;
}

/** A thread joined with its layout, project and the checker who waived it. */
interface ThreadRow {
  id: number;
  layout_id: number;
  fingerprint: string;
  rule: string;
  severity: ThreadDto["severity"];
  title: string;
  status: ThreadStatus;
  waiver_reason: string | null;
  version: number;
  layout_name: string;
  project_id: number;
  project_name: string;
  waiver_name: string | null;
}

/** One appearance of a thread's finding in a revision. */
interface AppearanceRow {
  id: number;
  revision_id: number;
  number: number;
  body: string;
  contacts: string;
  load_case: string | null;
}

/** A thread with its last revision number and comment count (findings table). */
interface ThreadListRow {
  id: number;
  rule: string;
  severity: string;
  title: string;
  status: ThreadStatus;
  comment_count: number | string;
  last_number: number | null;
  version: number;
}

/** When a project has an assigned checker, only that checker decides (waive, reopen, approve). */
export async function requireProjectChecker(trx: Knex | Knex.Transaction, layoutId: number, user: SessionUser): Promise<void> {
  const p = await trx("layouts as l")
    .join("projects as p", "p.id", "l.project_id")
    .leftJoin("users as c", "c.id", "p.checker_id")
    .where("l.id", layoutId)
    .select("p.checker_id", "c.name")
    .first();
  if (p?.checker_id && p.checker_id !== user.id)
    throw forbidden(`${p.name} is the checker of this project; only the assigned checker decides on its findings and releases.`);
}

/** True when the layout's newest revision has been released (then it is read-only). */
async function latestReleased(trx: Knex | Knex.Transaction, layoutId: number): Promise<boolean> {
  const latest = await trx("revisions").where({ layout_id: layoutId }).orderBy("number", "desc").first();
  if (!latest) return false;
  const rel = await trx("releases").where({ revision_id: latest.id }).whereNotNull("approved_at").first();
  return !!rel;
}

/** The layout a thread belongs to (it never changes), or 404. */
async function layoutOfThread(threadId: number): Promise<number> {
  const t = await db()("threads").where({ id: threadId }).select("layout_id").first();
  if (!t) throw notFound("That finding");
  return t.layout_id as number;
}

/** Comments matching `where` (a thread's, or one by id), oldest first, each with its edit history. */
async function readComments(user: SessionUser, where: Record<string, number>): Promise<CommentDto[]> {
  const rows: CommentRow[] = await db()("comments as c")
    .join("users as u", "u.id", "c.author_id")
    .where(where)
    .select("c.*", "u.name", "u.role")
    .orderBy("c.id", "asc");
  const edits: CommentEditRow[] = rows.length
    ? await db()("comment_edits")
        .whereIn(
          "comment_id",
          rows.map((c) => c.id),
        )
        .orderBy("id", "asc")
    : [];
  const history = new Map<number, { body: string; replacedAt: string }[]>();
  for (const e of edits) {
    const list = history.get(e.comment_id) ?? [];
    list.push({ body: e.body, replacedAt: iso(e.replaced_at) });
    history.set(e.comment_id, list);
  }
  return rows.map((c) => ({
    id: c.id,
    author: { id: c.author_id, name: c.name, role: c.role },
    body: c.body,
    createdAt: iso(c.created_at),
    editedAt: isoOrNull(c.edited_at),
    history: history.get(c.id) ?? [],
    mine: c.author_id === user.id,
  }));
}

/** One thread with everything its page shows. */
export async function getThread(user: SessionUser, threadId: number): Promise<ThreadDto> {
  const t: ThreadRow | undefined = await db()("threads as t")
    .join("layouts as l", "l.id", "t.layout_id")
    .join("projects as p", "p.id", "l.project_id")
    .leftJoin("users as w", "w.id", "t.waived_by")
    .where("t.id", threadId)
    .select("t.*", "l.name as layout_name", "l.project_id", "p.name as project_name", "w.name as waiver_name")
    .first();
  if (!t) throw notFound("That finding");
  const appearances: AppearanceRow[] = await db()("findings as f")
    .join("revisions as v", "v.id", "f.revision_id")
    .where("f.thread_id", threadId)
    .select("f.*", "v.number")
    .orderBy("v.number", "asc");
  const comments = await readComments(user, { "c.thread_id": threadId });
  return {
    id: t.id,
    layoutId: t.layout_id,
    layoutName: t.layout_name,
    projectId: t.project_id,
    projectName: t.project_name,
    fingerprint: t.fingerprint,
    rule: t.rule,
    severity: t.severity,
    title: t.title,
    status: t.status,
    waiverReason: t.waiver_reason ?? null,
    waivedBy: t.waiver_name ?? null,
    version: t.version,
    readOnly: await latestReleased(db(), t.layout_id),
    appearances: appearances.map((f) => ({
      revisionId: f.revision_id,
      revisionNumber: f.number,
      findingId: f.id,
      body: f.body,
      contacts: JSON.parse(f.contacts) as string[],
      loadCase: f.load_case ?? null,
    })),
    comments,
    history: await listEvents({ threadId }),
  };
}

/** Waives (checker, with a justification) or reopens a thread; refuses a stale version with 409. */
export async function changeStatus(user: SessionUser, threadId: number, input: z.infer<typeof statusSchema>): Promise<ThreadDto> {
  if (!allowed(user.role, input.action)) throw forbidden(input.action === "waive" ? "Only checkers waive findings." : "Only checkers reopen findings.");
  const layoutId = await layoutOfThread(threadId);
  await transaction(async (trx) => {
    await lockLayout(trx, layoutId, "share");
    const t = await trx("threads").where({ id: threadId }).forUpdate().first();
    if (!t) throw notFound("That finding");
    await requireProjectChecker(trx, t.layout_id, user);
    if (t.version !== input.version)
      throw conflict("Someone changed this finding while you were looking at it. Reload to see their change; nothing was overwritten.");
    if (await latestReleased(trx, t.layout_id)) throw conflict("The newest revision is released and read-only. Upload a new revision to change the review.");
    if (input.action === "waive") {
      if (t.status === "resolved") throw new AppError(409, "A resolved finding needs no waiver.");
      if (t.status === "waived") throw new AppError(409, "This finding is already waived.");
      await trx("threads")
        .where({ id: threadId })
        .update({ status: "waived", waiver_reason: input.reason, waived_by: user.id, version: t.version + 1, updated_at: trx.fn.now(3) });
    } else {
      if (t.status !== "waived" && t.status !== "resolved") throw new AppError(409, "Only a waived or resolved finding can be reopened.");
      await trx("threads")
        .where({ id: threadId })
        .update({ status: "reopened", waiver_reason: null, waived_by: null, version: t.version + 1, updated_at: trx.fn.now(3) });
    }
    await recordEvent(trx, { layoutId: t.layout_id, kind: input.action, actorId: user.id, threadId, detail: { reason: input.reason, from: t.status } });
  });
  return getThread(user, threadId);
}

/** Finds @mentions (the part of an e-mail address before the @, e.g. @chen) of known users. */
export async function mentionedUsers(body: string): Promise<{ id: number; name: string; email: string }[]> {
  const handles = [...new Set([...body.matchAll(/(^|[^\w@])@([a-z0-9._-]{2,40})/gi)].map((m) => m[2].toLowerCase()))];
  if (!handles.length) return [];
  const users: { id: number; name: string; email: string }[] = await db()("users").where({ active: true }).select("id", "name", "email");
  return users.filter((u) => handles.includes(u.email.split("@")[0].toLowerCase()));
}

/** Adds a comment (designers and checkers); records mentions in the history. Notifications: lib/review. */
export async function addComment(user: SessionUser, threadId: number, body: string): Promise<CommentDto & { mentionedIds: number[] }> {
  if (!allowed(user.role, "comment")) throw forbidden("Your role reads threads but does not comment.");
  const mentions = await mentionedUsers(body);
  const layoutId = await layoutOfThread(threadId);
  const id = await transaction(async (trx) => {
    await lockLayout(trx, layoutId, "share");
    const t = await trx("threads").where({ id: threadId }).first();
    if (!t) throw notFound("That finding");
    if (await latestReleased(trx, t.layout_id)) throw conflict("The newest revision is released and read-only. Upload a new revision to continue the review.");
    const [commentId] = await trx("comments").insert({ thread_id: threadId, author_id: user.id, body });
    await recordEvent(trx, { layoutId: t.layout_id, kind: "comment", actorId: user.id, threadId, detail: { commentId, mentions: mentions.map((m) => m.id) } });
    return commentId as number;
  });
  return { ...(await readComments(user, { "c.id": id }))[0], mentionedIds: mentions.map((m) => m.id) };
}

/** Edits one's own comment, keeping the earlier text in its history. */
export async function editComment(user: SessionUser, commentId: number, body: string): Promise<CommentDto> {
  const owner = await db()("comments as c").join("threads as t", "t.id", "c.thread_id").where("c.id", commentId).select("t.layout_id").first();
  if (!owner) throw notFound("That comment");
  await transaction(async (trx) => {
    await lockLayout(trx, owner.layout_id as number, "share");
    const c = await trx("comments").where({ id: commentId }).forUpdate().first();
    if (!c) throw notFound("That comment");
    if (c.author_id !== user.id) throw forbidden("You can edit only your own comments.");
    const t = await trx("threads").where({ id: c.thread_id }).first();
    if (await latestReleased(trx, t.layout_id)) throw conflict("The newest revision is released and read-only.");
    if (c.body === body) return c.thread_id as number;
    await trx("comment_edits").insert({ comment_id: commentId, body: c.body });
    await trx("comments")
      .where({ id: commentId })
      .update({ body, edited_at: trx.fn.now(3) });
    await recordEvent(trx, { layoutId: t.layout_id, kind: "comment-edit", actorId: user.id, threadId: c.thread_id, detail: { commentId } });
    return c.thread_id as number;
  });
  return (await readComments(user, { "c.id": commentId }))[0];
}

/** Threads of a layout with their current state (for the findings table). */
export async function listThreads(
  _user: SessionUser,
  layoutId: number,
): Promise<
  { id: number; rule: string; severity: string; title: string; status: ThreadStatus; comments: number; lastRevision: number | null; version: number }[]
> {
  const rows: ThreadListRow[] = await db()("threads as t")
    .leftJoin("revisions as v", "v.id", "t.last_revision_id")
    .where("t.layout_id", layoutId)
    .select("t.*", "v.number as last_number", db().raw("(select count(*) from comments c where c.thread_id = t.id) as comment_count"))
    .orderBy("t.id", "asc");
  return rows.map((r) => ({
    id: r.id,
    rule: r.rule,
    severity: r.severity,
    title: r.title,
    status: r.status,
    comments: Number(r.comment_count),
    lastRevision: r.last_number ?? null,
    version: r.version,
  }));
}
