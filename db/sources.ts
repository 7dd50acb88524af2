/**
 * Knex migration and seed sources that load our TypeScript files with `import()`, so the same
 * files run under tsx (scripts) and under vitest (integration tests), where knex's own
 * `require` of a .ts file would fail.
 */
import { readdirSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";

const root = path.dirname(new URL(import.meta.url).pathname);
const tsFiles = (dir: string) =>
  readdirSync(path.join(root, dir))
    .filter((f) => /^\d.*\.ts$/.test(f))
    .sort();
const load = (dir: string, file: string) => import(pathToFileURL(path.join(root, dir, file)).href);

export const migrationSource = {
  getMigrations: async () => tsFiles("migrations"),
  getMigrationName: (file: string) => file,
  getMigration: (file: string) => load("migrations", file),
};

export const seedSource = {
  getSeeds: async () => tsFiles("seeds"),
  getSeed: (file: string) => load("seeds", file),
  _getConfigDirectories: () => [path.join(root, "seeds")],
};
