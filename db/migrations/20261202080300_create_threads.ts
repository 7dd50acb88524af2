/** Threads: one review thread per finding fingerprint of a layout, followed across revisions. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("threads", (t) => {
    t.increments("id").primary();
    t.integer("layout_id").unsigned().notNullable().references("layouts.id").onDelete("CASCADE");
    t.text("fingerprint").notNullable();
    t.specificType("fingerprint_hash", "CHAR(64)").notNullable();
    t.string("rule", 60).notNullable();
    t.enu("severity", ["error", "warning", "info"]).notNullable();
    t.string("title", 400).notNullable();
    t.enu("status", ["open", "waived", "resolved", "reopened"]).notNullable().defaultTo("open");
    t.text("waiver_reason").nullable();
    t.integer("waived_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.integer("version").unsigned().notNullable().defaultTo(1);
    t.integer("last_revision_id").unsigned().nullable().references("revisions.id").onDelete("SET NULL");
    t.timestamp("opened_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(["layout_id", "status"]);
    t.unique(["layout_id", "fingerprint_hash"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("threads");
}
