/** Events: every upload, comment, status change, waiver, release request and release — who, when, what. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("events", (t) => {
    t.increments("id").primary();
    t.integer("layout_id").unsigned().notNullable().references("layouts.id").onDelete("CASCADE");
    t.integer("thread_id").unsigned().nullable().references("threads.id").onDelete("CASCADE");
    t.integer("revision_id").unsigned().nullable().references("revisions.id").onDelete("CASCADE");
    t.integer("actor_id").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.string("kind", 40).notNullable();
    t.text("detail").notNullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(["layout_id", "created_at"]);
    t.index(["thread_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("events");
}
