/** The one shared Knex instance; the only module that reads connection settings. */
import "server-only";
import knexLib, { type Knex } from "knex";
import { connectionConfig } from "@/db/connection";

const globalForKnex = globalThis as unknown as { sixfoldKnex?: Knex };

/** Returns the process-wide Knex instance (created on first use). */
export function db(): Knex {
  if (!globalForKnex.sixfoldKnex) globalForKnex.sixfoldKnex = knexLib(connectionConfig());
  return globalForKnex.sixfoldKnex;
}
