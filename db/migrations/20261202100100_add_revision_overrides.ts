/** The project rule overrides a revision was analysed with (JSON, null when none were in force). */
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("revisions", (t) => {
    t.text("overrides").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("revisions", (t) => {
    t.dropColumn("overrides");
  });
}
