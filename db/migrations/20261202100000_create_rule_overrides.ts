/** Project rule overrides (severity and options), append-only: each change is a row with who made it and why. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("rule_overrides", (t) => {
    t.increments("id").primary();
    t.integer("project_id").unsigned().notNullable().references("projects.id").onDelete("CASCADE");
    t.string("rule", 64).notNullable();
    t.enu("severity", ["error", "warning", "info"]).nullable();
    t.text("options").nullable();
    t.boolean("cleared").notNullable().defaultTo(false);
    t.text("reason").notNullable();
    t.integer("set_by").unsigned().notNullable().references("users.id");
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(["project_id", "rule"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("rule_overrides");
}
