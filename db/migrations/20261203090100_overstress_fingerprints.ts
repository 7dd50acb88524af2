/**
 * contact-overstress now gives one finding per contact (every load case in its table) instead of one per
 * contact and load case: its fingerprint lost the "|case:…" part. Existing threads are re-keyed so that
 * the next revision finds them; where several cases of one contact had threads, the one most recently
 * seen keeps the thread and the others stay as they are (they resolve at the next upload).
 */
import { createHash } from "node:crypto";
import type { Knex } from "knex";

const sha = (s: string) => createHash("sha256").update(s).digest("hex");

export async function up(knex: Knex): Promise<void> {
  const rows: { id: number; layout_id: number; fingerprint: string }[] = await knex("threads")
    .where({ rule: "contact-overstress" })
    .andWhere("fingerprint", "like", "%|case:%")
    .orderBy("last_revision_id", "desc")
    .orderBy("id", "desc")
    .select("id", "layout_id", "fingerprint");
  for (const r of rows) {
    const next = r.fingerprint.replace(/\|case:.*$/, "");
    const taken = await knex("threads")
      .where({ layout_id: r.layout_id, fingerprint_hash: sha(next) })
      .first();
    if (!taken)
      await knex("threads")
        .where({ id: r.id })
        .update({ fingerprint: next, fingerprint_hash: sha(next) });
  }
}

export async function down(): Promise<void> {
  // the per-case fingerprints cannot be restored from one per-contact thread; nothing to undo
}
