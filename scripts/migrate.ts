/** Runs Knex migrations and (optionally) seeds from the command line: migrate.ts latest|rollback-all|seed. */
import knexLib from "knex";
import { knexConfig } from "../knexfile";

async function main(): Promise<void> {
  const action = process.argv[2] ?? "latest";
  const knex = knexLib(knexConfig());
  try {
    if (action === "latest") {
      const [batch, files] = await knex.migrate.latest();
      console.error(`[migrate] batch ${batch}: ${files.length} migration(s) applied`);
    } else if (action === "rollback-all") {
      await knex.migrate.rollback(undefined, true);
      console.error("[migrate] all migrations rolled back");
    } else if (action === "seed") {
      const [files] = await knex.seed.run();
      console.error(`[migrate] ${files.length} seed file(s) run`);
    } else {
      throw new Error(`unknown action ${action}`);
    }
  } finally {
    await knex.destroy();
    // seeds go through lib/db, which opens the app's shared pool: close it too
    const shared = (globalThis as unknown as { sixfoldKnex?: { destroy(): Promise<void> } }).sixfoldKnex;
    if (shared) await shared.destroy();
  }
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
