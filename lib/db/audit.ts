/** The administration audit log: checker assignments on projects, user additions and changes. */
import "server-only";
import type { Knex } from "knex";
import { db } from "./knex";
import { iso } from "./rows";
import type { AuditSubject, AuditKind, AuditDto } from "@/lib/contracts/audit";
export type { AuditSubject, AuditKind, AuditDto } from "@/lib/contracts/audit";

interface AuditRow {
  id: number;
  subject: AuditSubject;
  subject_id: number;
  kind: AuditKind;
  detail: string;
  actor_id: number | null;
  actor_name: string | null;
  created_at: Date;
}

const toDto = (r: AuditRow): AuditDto => ({
  id: r.id,
  subject: r.subject,
  subjectId: r.subject_id,
  kind: r.kind,
  detail: JSON.parse(r.detail),
  actor: r.actor_name,
  createdAt: iso(r.created_at),
});

/** Appends one entry (inside the caller's transaction when given). */
export async function recordAudit(
  q: Knex | Knex.Transaction,
  e: { subject: AuditSubject; subjectId: number; kind: AuditKind; actorId: number; detail: Record<string, unknown> },
): Promise<void> {
  await q("audit_log").insert({ subject: e.subject, subject_id: e.subjectId, kind: e.kind, actor_id: e.actorId, detail: JSON.stringify(e.detail) });
}

/** The entries of one subject (or of every subject of a kind when `id` is omitted), newest first. */
export async function listAudit(subject: AuditSubject, id?: number, limit = 100): Promise<AuditDto[]> {
  const q = db()<AuditRow>("audit_log as a").leftJoin("users as u", "u.id", "a.actor_id").where("a.subject", subject);
  if (id !== undefined) q.where("a.subject_id", id);
  const rows = await q.orderBy("a.id", "desc").limit(limit).select("a.*", "u.name as actor_name");
  return rows.map((r) => toDto(r as AuditRow));
}
