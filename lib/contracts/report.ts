/** What the release report is rendered from (loaded by lib/db/report-data.ts, rendered by lib/report/markdown.ts). */
import type { RevisionDto } from "./revisions";

export interface ReleaseReportData {
  revision: RevisionDto;
  layoutName: string;
  projectName: string;
  threads: { id: number; status: string; waiverReason: string | null; waivedBy: string | null }[];
  /** newest first: the first row per rule is the reason in force for the revision */
  overrideReasons: { rule: string; reason: string; who: string }[];
}
