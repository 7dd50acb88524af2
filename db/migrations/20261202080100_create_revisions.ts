/** Revisions: immutable uploads of a layout with the raw file, parsed model and analysis report. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("revisions", (t) => {
    t.increments("id").primary();
    t.integer("layout_id").unsigned().notNullable().references("layouts.id").onDelete("CASCADE");
    t.integer("number").unsigned().notNullable();
    t.enu("encoding", ["json", "xml", "csv"]).notNullable();
    t.string("file_name", 255).notNullable();
    t.specificType("raw", "LONGTEXT").notNullable();
    t.specificType("parsed", "LONGTEXT").notNullable();
    t.specificType("report", "LONGTEXT").notNullable();
    t.integer("bodies").unsigned().notNullable();
    t.integer("contacts").unsigned().notNullable();
    t.integer("rank_").unsigned().notNullable();
    t.integer("freedoms").unsigned().notNullable();
    t.integer("redundancies").unsigned().notNullable();
    t.double("conditioning").notNullable();
    t.integer("uploaded_by").unsigned().notNullable().references("users.id").onDelete("RESTRICT");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(["layout_id", "number"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("revisions");
}
