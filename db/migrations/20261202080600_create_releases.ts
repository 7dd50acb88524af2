/** Releases: a designer's request and a checker's approval of one revision. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("releases", (t) => {
    t.increments("id").primary();
    t.integer("revision_id").unsigned().notNullable().unique().references("revisions.id").onDelete("CASCADE");
    t.integer("requested_by").unsigned().notNullable().references("users.id").onDelete("RESTRICT");
    t.timestamp("requested_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.integer("approved_by").unsigned().nullable().references("users.id").onDelete("RESTRICT");
    t.timestamp("approved_at", { precision: 3 }).nullable();
    t.specificType("report_md", "LONGTEXT").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("releases");
}
