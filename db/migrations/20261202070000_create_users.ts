/** Users with one role each; passwords stored as bcrypt hashes only. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("users", (t) => {
    t.increments("id").primary();
    t.string("email", 190).notNullable().unique();
    t.string("name", 120).notNullable();
    t.enu("role", ["designer", "checker", "manager", "admin"]).notNullable();
    t.string("password_hash", 100).notNullable();
    t.boolean("active").notNullable().defaultTo(true);
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("users");
}
