/** MariaDB connection settings from DB_* environment variables (defaults: the demo instance on :3407). */
import type { Knex } from "knex";

/** The Knex client and connection part of the configuration, shared by knexfile.ts and lib/db/knex.ts. */
export function connectionConfig(env: NodeJS.ProcessEnv = process.env): Knex.Config {
  return {
    client: "mysql2",
    connection: {
      host: env.DB_HOST ?? "127.0.0.1",
      port: Number(env.DB_PORT ?? 3407),
      user: env.DB_USER ?? "sixfold",
      password: env.DB_PASSWORD ?? "sixfold-local",
      database: env.DB_NAME ?? "sixfold",
      charset: "utf8mb4",
      timezone: "Z",
    },
    pool: { min: 0, max: Number(env.DB_POOL_MAX ?? 20) },
  };
}
