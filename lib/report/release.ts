/** The release report of a revision: loaded from the database, rendered by the pure renderer; the stored one once released. */
import "server-only";
import type { SessionUser } from "@/lib/auth/session";
import { loadReleaseReportData, storedReleaseReport } from "@/lib/db/report-data";
import { renderReleaseReport } from "./markdown";
import { appLink } from "@/lib/mail/outbox";

/**
 * Renders the report of one revision now. `approval` is given only by the approval itself, for the record
 * it stores in the same transaction; otherwise the approval line comes from the stored release record.
 */
export async function releaseReportMarkdown(user: SessionUser, revisionId: number, approval?: { by: string; at: Date }): Promise<string> {
  return renderReleaseReport(await loadReleaseReportData(user, revisionId), approval, appLink);
}

/** The report as filed: the stored markdown of an approved release, else rendered now (a draft). */
export async function currentReportMarkdown(user: SessionUser, revisionId: number): Promise<string> {
  return (await storedReleaseReport(revisionId)) ?? (await releaseReportMarkdown(user, revisionId));
}
