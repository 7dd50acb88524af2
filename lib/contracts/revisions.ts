/** Contracts of revisions: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */
import type { Encoding, Layout } from "@/lib/layout/model";
import type { Severity, ThreadStatusName } from "./enums";
import type { Report } from "@/lib/engine";
import type { RuleOverride } from "@/rules";

export interface RevisionSummaryDto {
  id: number;
  layoutId: number;
  number: number;
  encoding: Encoding;
  fileName: string;
  counts: { bodies: number; contacts: number; rank: number; freedoms: number; redundancies: number };
  conditioning: number;
  uploadedBy: string;
  createdAt: string;
  release: { requestedBy: string; requestedAt: string; approvedBy: string | null; approvedAt: string | null } | null;
  /** project rule overrides in force when this revision was analysed (empty: none) */
  overrides: Record<string, RuleOverride>;
}

export interface RevisionDto extends RevisionSummaryDto {
  report: Report;
  layout: Layout;
  findings: FindingRowDto[];
}

export interface FindingRowDto {
  id: number;
  threadId: number;
  rule: string;
  severity: Severity;
  title: string;
  body: string;
  contacts: string[];
  loadCase: string | null;
  status: ThreadStatusName;
  comments: number;
}

export interface RevisionDiff {
  from: number;
  to: number;
  contacts: {
    added: string[];
    removed: string[];
    moved: { id: string; from: [number, number, number]; to: [number, number, number]; normalChanged: boolean }[];
  };
  findings: {
    new: { threadId: number; title: string; severity: string }[];
    resolved: { threadId: number; title: string; severity: string }[];
    /** same thread, but its severity, title or numbers differ: before → after */
    changed: { threadId: number; title: string; severity: string; before: { title: string; severity: string }; bodyChanged: boolean }[];
    unchanged: { threadId: number; title: string; severity: string }[];
  };
}
