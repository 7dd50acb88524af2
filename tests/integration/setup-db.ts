/** Integration helpers: a fresh schema in the test database (DB_NAME, set by the test command). */
import knexLib, { type Knex } from "knex";
import { knexConfig } from "../../knexfile";

/** Opens a Knex connection to the integration database. */
export function testKnex(): Knex {
  if (!process.env.DB_NAME || !/_it$|_test$/.test(process.env.DB_NAME)) {
    throw new Error("Integration tests need DB_NAME of a test database (run them through `npm test`).");
  }
  return knexLib(knexConfig());
}

/** Rolls everything back, migrates to latest and seeds. */
export async function resetDatabase(knex: Knex): Promise<void> {
  await knex.migrate.rollback(undefined, true);
  await knex.migrate.latest();
  await knex.seed.run();
}
