/** Mail outbox: every notification is queued here first and sent (with retries) apart from the action that caused it. */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("mail_outbox", (t) => {
    t.increments("id").primary();
    t.integer("user_id").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.string("to_address", 190).notNullable();
    t.string("kind", 40).notNullable();
    t.string("subject", 300).notNullable();
    t.text("text_body").notNullable();
    t.text("html_body").notNullable();
    t.enu("status", ["pending", "sent", "failed"]).notNullable().defaultTo("pending");
    t.integer("attempts").unsigned().notNullable().defaultTo(0);
    t.text("last_error").nullable();
    t.timestamp("next_attempt_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("created_at", { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp("sent_at", { precision: 3 }).nullable();
    t.index(["status", "next_attempt_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("mail_outbox");
}
