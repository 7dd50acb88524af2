/** Audit log of administration: project checker assignments and user changes (who, when, what). Append-only. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("audit_log", (t) => {
    t.increments("id").primary();
    t.string("subject", 20).notNullable();
    t.integer("subject_id").unsigned().notNullable();
    t.string("kind", 40).notNullable();
    t.text("detail").notNullable();
    t.integer("actor_id").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(["subject", "subject_id", "created_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("audit_log");
}
