/** Kinds of mail a user has muted. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("mail_mutes", (t) => {
    t.increments("id").primary();
    t.integer("user_id").unsigned().notNullable().references("users.id").onDelete("CASCADE");
    t.string("kind", 40).notNullable();
    t.unique(["user_id", "kind"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("mail_mutes");
}
