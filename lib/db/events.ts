/** Events: the append-only history of a layout (uploads, comments, status changes, releases). */
import "server-only";
import { iso } from "./rows";
import type { Knex } from "knex";
import { db } from "./knex";
import type { EventKind, EventDto } from "@/lib/contracts/events";
export type { EventKind, EventDto } from "@/lib/contracts/events";

/** Appends one event (inside the caller's transaction when given). */
export async function recordEvent(
  trx: Knex | Knex.Transaction,
  e: { layoutId: number; kind: EventKind; actorId: number | null; threadId?: number | null; revisionId?: number | null; detail?: Record<string, unknown> },
): Promise<void> {
  await trx("events").insert({
    layout_id: e.layoutId,
    thread_id: e.threadId ?? null,
    revision_id: e.revisionId ?? null,
    actor_id: e.actorId,
    kind: e.kind,
    detail: JSON.stringify(e.detail ?? {}),
  });
}

/** Events of a layout or of one thread, oldest first. */
export async function listEvents(filter: { layoutId?: number; threadId?: number }, limit = 500): Promise<EventDto[]> {
  const q = db()("events as e").leftJoin("users as u", "u.id", "e.actor_id").select("e.*", "u.name as actor_name").orderBy("e.id", "asc").limit(limit);
  if (filter.layoutId) q.where("e.layout_id", filter.layoutId);
  if (filter.threadId) q.where("e.thread_id", filter.threadId);
  const rows = await q;
  return rows.map((r: Record<string, unknown>) => ({
    id: r.id as number,
    kind: r.kind as EventKind,
    actor: (r.actor_name as string | null) ?? null,
    threadId: (r.thread_id as number | null) ?? null,
    revisionId: (r.revision_id as number | null) ?? null,
    detail: JSON.parse(r.detail as string),
    createdAt: iso(r.created_at),
  }));
}
