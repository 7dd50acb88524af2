/** Everything the release report needs from the database, loaded in one place; the report itself is rendered by lib/report (pure). */
import "server-only";
import { db } from "./knex";
import { getRevision } from "./revisions";
import type { SessionUser } from "@/lib/auth/session";
import type { ReleaseReportData } from "@/lib/contracts/report";

interface ThreadStateRow {
  id: number;
  status: string;
  waiver_reason: string | null;
  waiver: string | null;
}

interface OverrideReasonRow {
  rule: string;
  reason: string;
  who: string;
}

/** Loads a revision with its layout and project names, the review state of its threads and the reasons of the overrides it was analysed with. */
export async function loadReleaseReportData(user: SessionUser, revisionId: number): Promise<ReleaseReportData> {
  const rev = await getRevision(user, revisionId);
  const names: { name: string; project: string } = await db()("layouts as l")
    .join("projects as p", "p.id", "l.project_id")
    .where("l.id", rev.layoutId)
    .select("l.name", "p.name as project")
    .first();
  const threads: ThreadStateRow[] = await db()("threads as t")
    .leftJoin("users as u", "u.id", "t.waived_by")
    .whereIn(
      "t.id",
      rev.findings.map((f) => f.threadId),
    )
    .select("t.id", "t.status", "t.waiver_reason", "u.name as waiver");
  // the reason and author of each override as it stood when the revision was analysed
  const reasons: OverrideReasonRow[] = Object.keys(rev.overrides).length
    ? await db()("rule_overrides as o")
        .join("layouts as l", "l.project_id", "o.project_id")
        .join("users as u", "u.id", "o.set_by")
        .where("l.id", rev.layoutId)
        .where("o.created_at", "<=", new Date(rev.createdAt))
        .orderBy("o.id", "desc")
        .select("o.rule", "o.reason", "u.name as who")
    : [];
  return {
    revision: rev,
    layoutName: names.name,
    projectName: names.project,
    threads: threads.map((t) => ({ id: t.id, status: t.status, waiverReason: t.waiver_reason, waivedBy: t.waiver })),
    overrideReasons: reasons,
  };
}

/** The report stored with an approved release, or null. */
export async function storedReleaseReport(revisionId: number): Promise<string | null> {
  const row: { report_md: string | null } | undefined = await db()("releases").where({ revision_id: revisionId }).whereNotNull("report_md").first();
  return row?.report_md ?? null;
}
