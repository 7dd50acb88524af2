/** Findings: what the rules reported for one revision, each tied to its thread. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("findings", (t) => {
    t.increments("id").primary();
    t.integer("revision_id").unsigned().notNullable().references("revisions.id").onDelete("CASCADE");
    t.integer("thread_id").unsigned().notNullable().references("threads.id").onDelete("CASCADE");
    t.string("rule", 60).notNullable();
    t.enu("severity", ["error", "warning", "info"]).notNullable();
    t.string("title", 400).notNullable();
    t.text("body").notNullable();
    t.text("contacts").notNullable();
    t.string("load_case", 100).nullable();
    t.index(["revision_id"]);
    t.index(["thread_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("findings");
}
