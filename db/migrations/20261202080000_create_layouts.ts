/** Layouts: a mount under review inside a project, owned by the designer who created it. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("layouts", (t) => {
    t.increments("id").primary();
    t.integer("project_id").unsigned().notNullable().references("projects.id").onDelete("CASCADE");
    t.string("name", 160).notNullable();
    t.text("description").notNullable();
    t.integer("created_by").unsigned().notNullable().references("users.id").onDelete("RESTRICT");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(["project_id", "name"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("layouts");
}
