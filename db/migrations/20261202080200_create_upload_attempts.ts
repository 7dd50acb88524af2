/** Upload attempts: every upload, accepted or refused, with the located errors of a refused one. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("upload_attempts", (t) => {
    t.increments("id").primary();
    t.integer("layout_id").unsigned().notNullable().references("layouts.id").onDelete("CASCADE");
    t.integer("user_id").unsigned().notNullable().references("users.id").onDelete("RESTRICT");
    t.string("file_name", 255).notNullable();
    t.integer("size_bytes").unsigned().notNullable();
    t.boolean("accepted").notNullable();
    t.text("errors").nullable();
    t.integer("revision_id").unsigned().nullable().references("revisions.id").onDelete("SET NULL");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("upload_attempts");
}
