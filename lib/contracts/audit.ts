/** Contracts of audit: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */

export type AuditSubject = "project" | "user";

export type AuditKind = "checker-assigned" | "user-added" | "role-changed" | "user-deactivated" | "user-reactivated";

export interface AuditDto {
  id: number;
  subject: AuditSubject;
  subjectId: number;
  kind: AuditKind;
  detail: Record<string, unknown>;
  actor: string | null;
  createdAt: string;
}
