/** The mail outbox and mail mutes: queries only; composing and sending live in lib/mail/outbox.ts. */
import "server-only";
import { db } from "./knex";
import { iso, isoOrNull } from "./rows";

interface OutboxRow {
  id: number;
  user_id: number;
  to_address: string;
  kind: string;
  subject: string;
  text_body: string;
  html_body: string;
  status: "pending" | "sent" | "failed";
  attempts: number;
  last_error: string | null;
  next_attempt_at: Date;
  created_at: Date;
  sent_at: Date | null;
}

export interface OutboxEntryDto {
  id: number;
  to: string;
  kind: string;
  subject: string;
  body: string;
  status: string;
  attempts: number;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
}

export interface QueuedMail {
  user_id: number;
  to_address: string;
  kind: string;
  subject: string;
  text_body: string;
  html_body: string;
}

const toDto = (r: OutboxRow): OutboxEntryDto => ({
  id: r.id,
  to: r.to_address,
  kind: r.kind,
  subject: r.subject,
  body: r.text_body,
  status: r.status,
  attempts: r.attempts,
  lastError: r.last_error ?? null,
  createdAt: iso(r.created_at),
  sentAt: isoOrNull(r.sent_at),
});

/** Active recipients among the ids who have not muted the kind. */
export async function mailRecipients(ids: number[], kind: string): Promise<{ id: number; email: string; name: string }[]> {
  const users: { id: number; email: string; name: string }[] = await db()("users").whereIn("id", ids).where({ active: true }).select("id", "email", "name");
  const muted = new Set((await db()("mail_mutes").whereIn("user_id", ids).where({ kind }).select("user_id")).map((m: { user_id: number }) => m.user_id));
  return users.filter((u) => !muted.has(u.id));
}

/** Queues mails. */
export async function insertMails(rows: QueuedMail[]): Promise<void> {
  if (rows.length) await db()("mail_outbox").insert(rows);
}

/** Pending mails whose next attempt is due, oldest first. */
export async function dueMails(limit: number): Promise<OutboxRow[]> {
  return db()<OutboxRow>("mail_outbox").where({ status: "pending" }).where("next_attempt_at", "<=", db().fn.now(3)).orderBy("id").limit(limit);
}

/** Marks one mail sent. */
export async function markSent(id: number, attempts: number): Promise<void> {
  await db()("mail_outbox")
    .where({ id })
    .update({ status: "sent", sent_at: db().fn.now(3), attempts, last_error: null });
}

/** Records a failed attempt with its next try (or gives up). */
export async function markFailed(id: number, attempts: number, error: string, giveUp: boolean, nextAttemptAt: Date): Promise<void> {
  await db()("mail_outbox")
    .where({ id })
    .update({ attempts, last_error: error.slice(0, 1000), status: giveUp ? "failed" : "pending", next_attempt_at: nextAttemptAt });
}

/** The outbox for the admin page, newest first. */
export async function listOutbox(limit = 200): Promise<OutboxEntryDto[]> {
  const rows = await db()<OutboxRow>("mail_outbox").orderBy("id", "desc").limit(limit);
  return rows.map(toDto);
}

/** Kinds a user has muted. */
export async function mutedKinds<K extends string>(userId: number): Promise<K[]> {
  return (await db()("mail_mutes").where({ user_id: userId }).select("kind")).map((r: { kind: K }) => r.kind);
}

/** Sets the muted kinds of a user. */
export async function setMutedKinds(userId: number, kinds: string[]): Promise<void> {
  await db().transaction(async (trx) => {
    await trx("mail_mutes").where({ user_id: userId }).delete();
    if (kinds.length) await trx("mail_mutes").insert(kinds.map((kind) => ({ user_id: userId, kind })));
  });
}
