/**
 * Mail notifications through an outbox: actions enqueue, a sender drains with retries and backoff.
 * Sending never blocks or undoes the action that caused the mail. nodemailer talks SMTP to the host in
 * SMTP_HOST/SMTP_PORT (the local fake in development and tests).
 */
import "server-only";
import nodemailer from "nodemailer";
import {
  dueMails,
  insertMails,
  listOutbox,
  mailRecipients,
  markFailed,
  markSent,
  mutedKinds as mutedKindsOf,
  setMutedKinds as storeMutedKinds,
} from "@/lib/db/outbox";

export { listOutbox };

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
    const users = await mailRecipients(ids, kind);
    const link = appLink(linkPath);
    const rows = users.map((u) => ({
      user_id: u.id,
      to_address: u.email,
      kind,
      subject: `[Sixfold] ${subject}`.slice(0, 300),
      text_body: `Hello ${u.name},\n\n${text}\n\nOpen it: ${link}\n\nYou can mute this kind of mail in your Sixfold settings.`,
      html_body: `<p>Hello ${escapeHtml(u.name)},</p><p>${escapeHtml(text).replace(/\n/g, "<br>")}</p><p><a href="${escapeHtml(link)}">Open it in Sixfold</a></p><p style="color:#777">You can mute this kind of mail in your Sixfold settings.</p>`,
    }));
    await insertMails(rows);
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
    const due = await dueMails(limit);
    for (const m of due) {
      try {
        await transport().sendMail({
          from: process.env.MAIL_FROM ?? "Sixfold <sixfold@larkspur.example>",
          to: m.to_address,
          subject: m.subject,
          text: m.text_body,
          html: m.html_body,
        });
        await markSent(m.id, m.attempts + 1);
        sent++;
      } catch (err) {
        const attempts = m.attempts + 1;
        await markFailed(m.id, attempts, String((err as Error).message), attempts >= MAX_ATTEMPTS, new Date(Date.now() + backoffSeconds(attempts) * 1000));
      }
    }
  } finally {
    flushing = false;
  }
  return sent;
}

/** Kinds a user has muted. */
export async function mutedKinds(userId: number): Promise<MailKind[]> {
  return mutedKindsOf<MailKind>(userId);
}

/** Sets the muted kinds of a user. */
export async function setMutedKinds(userId: number, kinds: MailKind[]): Promise<void> {
  await storeMutedKinds(userId, kinds);
}
