/** Comments on threads (markdown source) and the history of their edits. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("comments", (t) => {
    t.increments("id").primary();
    t.integer("thread_id").unsigned().notNullable().references("threads.id").onDelete("CASCADE");
    t.integer("author_id").unsigned().notNullable().references("users.id").onDelete("RESTRICT");
    t.text("body").notNullable();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("edited_at", { precision: 3 }).nullable();
    t.index(["thread_id"]);
  });
  await knex.schema.createTable("comment_edits", (t) => {
    t.increments("id").primary();
    t.integer("comment_id").unsigned().notNullable().references("comments.id").onDelete("CASCADE");
    t.text("body").notNullable();
    t.timestamp("replaced_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("comment_edits");
  await knex.schema.dropTable("comments");
}
