/**
 * The review workflow's actions with their notifications: each calls the entity function in lib/db (which
 * checks role, state and locks) and then queues the mails through the outbox. Route handlers call these;
 * the entity files send no mail.
 */
import "server-only";
import type { SessionUser } from "@/lib/auth/session";
import { addComment as storeComment, changeStatus as storeStatus, threadFollowers } from "@/lib/db/threads";
import { approveRelease as storeApproval, releaseAudience, requestRelease as storeRequest } from "@/lib/db/releases";
import { enqueueMail } from "@/lib/mail/outbox";
import { releaseReportMarkdown } from "@/lib/report/release";
import type { CommentDto, ThreadDto } from "@/lib/contracts/threads";
import type { z } from "zod";
import type { statusSchema } from "@/lib/contracts/threads";

/** Characters of a comment quoted in a notification. */
const EXCERPT = 400;

/** Comments on a thread; mentioned people, then the owner and checker, are told. */
export async function commentOnThread(user: SessionUser, threadId: number, body: string): Promise<CommentDto> {
  const { mentionedIds, ...comment } = await storeComment(user, threadId, body);
  const f = await threadFollowers(threadId);
  const excerpt = body.length > EXCERPT ? `${body.slice(0, EXCERPT)}…` : body;
  await enqueueMail(
    mentionedIds,
    "mention",
    `${user.name} mentioned you: ${f.title}`,
    `${user.name} mentioned you on "${f.title}" (${f.layoutName}):\n\n${excerpt}`,
    `/findings/${threadId}`,
    user.id,
  );
  const mentioned = new Set(mentionedIds);
  await enqueueMail(
    [f.owner, ...(f.checker ? [f.checker] : [])].filter((id) => !mentioned.has(id)),
    "comment",
    `New comment: ${f.title}`,
    `${user.name} commented on "${f.title}" (${f.layoutName}):\n\n${excerpt}`,
    `/findings/${threadId}`,
    user.id,
  );
  return comment;
}

/** Waives or reopens a finding; everyone following the thread is told. */
export async function decideFinding(user: SessionUser, threadId: number, input: z.infer<typeof statusSchema>): Promise<ThreadDto> {
  const thread = await storeStatus(user, threadId, input);
  const f = await threadFollowers(threadId);
  await enqueueMail(
    [f.owner, ...(f.checker ? [f.checker] : []), ...f.commenters],
    "status",
    `${input.action === "waive" ? "Waived" : "Reopened"}: ${f.title}`,
    `${user.name} ${input.action === "waive" ? "waived" : "reopened"} the finding "${f.title}" on ${f.layoutName}.${input.reason ? `\n\nReason: ${input.reason}` : ""}`,
    `/findings/${threadId}`,
    user.id,
  );
  return thread;
}

/** A designer requests release; the project's checker (or every checker) is told. */
export async function askForRelease(user: SessionUser, revisionId: number): Promise<void> {
  await storeRequest(user, revisionId);
  const a = await releaseAudience(revisionId);
  await enqueueMail(
    a.checkers,
    "release-request",
    `Release requested: ${a.layoutName} r${a.number}`,
    `${user.name} asks for release of revision ${a.number} of ${a.layoutName}.`,
    `/layouts/${a.layoutId}?revision=${revisionId}`,
    user.id,
  );
}

/** A checker approves; the report is filed with the approval, and the requester and owner are told. */
export async function approveAndRelease(user: SessionUser, revisionId: number): Promise<void> {
  await storeApproval(user, revisionId, (rid, approval) => releaseReportMarkdown(user, rid, approval));
  const a = await releaseAudience(revisionId);
  await enqueueMail(
    [...(a.requester ? [a.requester] : []), a.owner],
    "release",
    `Released: ${a.layoutName} r${a.number}`,
    `${user.name} approved the release of revision ${a.number} of ${a.layoutName}.`,
    `/layouts/${a.layoutId}?revision=${revisionId}`,
    user.id,
  );
}
