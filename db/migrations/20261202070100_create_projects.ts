/** Projects: a named group of layouts, created by a manager, with an optional assigned checker. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("projects", (t) => {
    t.increments("id").primary();
    t.string("name", 120).notNullable().unique();
    t.text("description").notNullable();
    t.integer("created_by").unsigned().notNullable().references("users.id").onDelete("RESTRICT");
    t.integer("checker_id").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("projects");
}
