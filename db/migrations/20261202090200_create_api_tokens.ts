/** Personal API tokens for CAD export scripts: stored as SHA-256 hashes, shown once. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("api_tokens", (t) => {
    t.increments("id").primary();
    t.integer("user_id").unsigned().notNullable().references("users.id").onDelete("CASCADE");
    t.string("name", 100).notNullable();
    t.string("prefix", 16).notNullable();
    t.specificType("token_hash", "CHAR(64)").notNullable().unique();
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("last_used_at", { precision: 3 }).nullable();
    t.timestamp("revoked_at", { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("api_tokens");
}
