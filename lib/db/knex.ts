/** The one shared Knex instance; the only module that reads connection settings. */
import "server-only";
import knexLib, { type Knex } from "knex";
import { connectionConfig } from "@/db/connection";

const globalForKnex = globalThis as unknown as { sixfoldKnex?: Knex };

/** Returns the process-wide Knex instance (created on first use). */
export function db(): Knex {
  if (!globalForKnex.sixfoldKnex) globalForKnex.sixfoldKnex = knexLib(connectionConfig());
  return globalForKnex.sixfoldKnex;
}

/**
 * Runs a transaction, retrying it (up to 4 times, with a short random pause) when MariaDB picks it as a
 * deadlock victim or a lock wait times out: InnoDB rolls the whole transaction back, so a retry is safe.
 */
export async function transaction<T>(fn: (trx: Knex.Transaction) => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await db().transaction(fn);
    } catch (err) {
      const code = (err as { errno?: number }).errno;
      // a connection that died while the pool kept it (database restarted) fails once: the pool drops it
      const stale = attempt === 1 && /^(EPIPE|ECONNRESET|PROTOCOL_CONNECTION_LOST)$/.test((err as { code?: string }).code ?? "");
      if (((code === 1213 || code === 1205) && attempt < 5) || stale) {
        await new Promise((r) => setTimeout(r, 20 * attempt + Math.random() * 50));
        continue;
      }
      throw err;
    }
  }
}

/**
 * Locks a layout's row as the first statement of a transaction. Every review write on a layout takes this
 * lock before touching its threads, comments or releases, so all of them lock in the same order and cannot
 * deadlock one another: storing a revision and approving a release take it exclusively (they change which
 * revision is newest or released), comments, waivers, edits and release requests share it. Taken first, it
 * also means the transaction's later reads see everything committed before it (InnoDB fixes a transaction's
 * snapshot at its first plain read). Returns false when the layout does not exist.
 */
export async function lockLayout(trx: Knex.Transaction, layoutId: number, mode: "share" | "update"): Promise<boolean> {
  const q = trx("layouts").where({ id: layoutId }).select("id");
  const row = await (mode === "update" ? q.forUpdate() : q.forShare()).first();
  return !!row;
}
