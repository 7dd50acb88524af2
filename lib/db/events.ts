/** Events: the append-only history of a layout (uploads, comments, status changes, releases). */
import "server-only";
import { iso } from "./rows";
import type { Knex } from "knex";
import { db } from "./knex";
import type { EventKind, EventDto } from "@/lib/contracts/events";
export type { EventKind, EventDto } from "@/lib/contracts/events";

/** An event row joined with its actor's name. */
interface EventRow {
  id: number;
  layout_id: number;
  thread_id: number | null;
  revision_id: number | null;
  actor_id: number | null;
  actor_name: string | null;
  kind: EventKind;
  detail: string;
  created_at: Date;
}

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
  const rows: EventRow[] = await q;
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    actor: r.actor_name ?? null,
    threadId: r.thread_id ?? null,
    revisionId: r.revision_id ?? null,
    detail: JSON.parse(r.detail) as Record<string, unknown>,
    createdAt: iso(r.created_at),
  }));
}
