/** A project's materials library: supplier or standard values that layouts of the project resolve before the built-in table. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("project_materials", (t) => {
    t.increments("id").primary();
    t.integer("project_id").unsigned().notNullable().references("projects.id").onDelete("CASCADE");
    t.string("material_id", 100).notNullable();
    t.double("youngs_modulus_gpa").nullable();
    t.double("poisson_ratio").nullable();
    t.double("allowable_mpa").nullable();
    t.double("expansion_per_k").nullable();
    t.string("source", 500).notNullable();
    t.integer("set_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("updated_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(["project_id", "material_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("project_materials");
}
