/**
 * Mail notifications through an outbox: actions enqueue, a sender drains with retries and backoff.
 * Sending never blocks or undoes the action that caused the mail. nodemailer talks SMTP to the host in
 * SMTP_HOST/SMTP_PORT (the local fake in development and tests).
 */
import "server-only";
import { iso, isoOrNull } from "@/lib/db/rows";
import nodemailer from "nodemailer";
import { db } from "@/lib/db/knex";

export const mailKinds = {
  mention: "You are mentioned in a comment",
  comment: "A comment on a layout you own or check",
  status: "A status change of a finding you follow",
  "release-request": "A release is requested (checkers)",
  release: "Your release is approved (designers)",
} as const;
export type MailKind = keyof typeof mailKinds;

const escapeHtml = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

/** Absolute link into the app. */
export function appLink(pathname: string): string {
  return `${(process.env.NEXTAUTH_URL ?? "http://localhost:3000").replace(/\/$/, "")}${pathname}`;
}

let timer: NodeJS.Timeout | null = null;

/** Starts the periodic retry of due mails once per server process (every 15 s, not keeping the process alive). */
export function ensureOutboxTimer(): void {
  if (timer || process.env.SIXFOLD_MAIL_TIMER === "off") return;
  timer = setInterval(() => void flushOutbox().catch((e) => console.error("[mail] flush failed", e)), 15_000);
  timer.unref();
}

/** Queues one mail per recipient (skipping muted kinds and the actor), then nudges the sender without waiting. */
export async function enqueueMail(recipients: number[], kind: MailKind, subject: string, text: string, linkPath: string, actorId?: number): Promise<void> {
  const ids = [...new Set(recipients)].filter((id) => id !== actorId);
  if (!ids.length) return;
  try {
    const users = await db()("users").whereIn("id", ids).where({ active: true }).select("id", "email", "name");
    const muted = new Set((await db()("mail_mutes").whereIn("user_id", ids).where({ kind }).select("user_id")).map((m: { user_id: number }) => m.user_id));
    const link = appLink(linkPath);
    const rows = users
      .filter((u: { id: number }) => !muted.has(u.id))
      .map((u: { id: number; email: string; name: string }) => ({
        user_id: u.id,
        to_address: u.email,
        kind,
        subject: `[Sixfold] ${subject}`.slice(0, 300),
        text_body: `Hello ${u.name},\n\n${text}\n\nOpen it: ${link}\n\nYou can mute this kind of mail in your Sixfold settings.`,
        html_body: `<p>Hello ${escapeHtml(u.name)},</p><p>${escapeHtml(text).replace(/\n/g, "<br>")}</p><p><a href="${escapeHtml(link)}">Open it in Sixfold</a></p><p style="color:#777">You can mute this kind of mail in your Sixfold settings.</p>`,
      }));
    if (rows.length) await db()("mail_outbox").insert(rows);
  } catch (err) {
    console.error("[mail] could not queue a notification; the action itself is kept", err);
    return;
  }
  ensureOutboxTimer();
  if (process.env.SIXFOLD_MAIL_TIMER !== "off") setImmediate(() => void flushOutbox().catch((e) => console.error("[mail] flush failed", e)));
}

let transporter: { key: string; t: nodemailer.Transporter } | null = null;
function transport(): nodemailer.Transporter {
  const host = process.env.SMTP_HOST ?? "127.0.0.1";
  const port = Number(process.env.SMTP_PORT ?? 2525);
  if (transporter?.key === `${host}:${port}`) return transporter.t;
  const t = nodemailer.createTransport({
    host,
    port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });
  transporter = { key: `${host}:${port}`, t };
  return t;
}

/** Retry delay after n failed attempts: 30 s, 2 min, 8 min, … capped at 1 h. */
export function backoffSeconds(attempts: number): number {
  return Math.min(3600, 30 * 4 ** Math.max(0, attempts - 1));
}

const MAX_ATTEMPTS = 8;
let flushing = false;

/** Sends due mails; failures are kept for a later retry. Returns how many were sent. */
export async function flushOutbox(limit = 50): Promise<number> {
  if (flushing) return 0;
  flushing = true;
  let sent = 0;
  try {
    const due = await db()("mail_outbox").where({ status: "pending" }).where("next_attempt_at", "<=", db().fn.now(3)).orderBy("id").limit(limit);
    for (const m of due) {
      try {
        await transport().sendMail({ from: process.env.MAIL_FROM ?? "Sixfold <sixfold@larkspur.example>", to: m.to_address, subject: m.subject, text: m.text_body, html: m.html_body });
        await db()("mail_outbox").where({ id: m.id }).update({ status: "sent", sent_at: db().fn.now(3), attempts: m.attempts + 1, last_error: null });
        sent++;
      } catch (err) {
        const attempts = m.attempts + 1;
        await db()("mail_outbox")
          .where({ id: m.id })
          .update({
            attempts,
            last_error: String((err as Error).message).slice(0, 1000),
            status: attempts >= MAX_ATTEMPTS ? "failed" : "pending",
            next_attempt_at: new Date(Date.now() + backoffSeconds(attempts) * 1000),
          });
      }
    }
  } finally {
    flushing = false;
  }
  return sent;
}

/** The outbox for the admin page, newest first. */
export async function listOutbox(limit = 200) {
  const rows = await db()("mail_outbox").orderBy("id", "desc").limit(limit);
  return rows.map((r: Record<string, unknown>) => ({
    id: r.id as number,
    to: r.to_address as string,
    kind: r.kind as string,
    subject: r.subject as string,
    body: r.text_body as string,
    status: r.status as string,
    attempts: r.attempts as number,
    lastError: (r.last_error as string | null) ?? null,
    createdAt: iso(r.created_at),
    sentAt: isoOrNull(r.sent_at),
  }));
}

/** Kinds a user has muted. */
export async function mutedKinds(userId: number): Promise<MailKind[]> {
  return (await db()("mail_mutes").where({ user_id: userId }).select("kind")).map((r: { kind: MailKind }) => r.kind);
}

/** Sets the muted kinds of a user. */
export async function setMutedKinds(userId: number, kinds: MailKind[]): Promise<void> {
  await db().transaction(async (trx) => {
    await trx("mail_mutes").where({ user_id: userId }).delete();
    if (kinds.length) await trx("mail_mutes").insert(kinds.map((kind) => ({ user_id: userId, kind })));
  });
}
