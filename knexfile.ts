/** Knex configuration: MariaDB through mysql2, migrations and seeds under db/. */
import type { Knex } from "knex";
import { connectionConfig } from "./db/connection";
import { migrationSource, seedSource } from "./db/sources";

/** The full Knex config (connection from DB_* variables, our TypeScript migration and seed sources). */
export function knexConfig(env: NodeJS.ProcessEnv = process.env): Knex.Config {
  return {
    ...connectionConfig(env),
    migrations: { migrationSource, tableName: "knex_migrations" },
    seeds: { seedSource } as Knex.SeederConfig,
  };
}

export default knexConfig();
