/** Resets the browser-test database: all migrations down, up again, seeds. */
import { execFileSync } from "node:child_process";

export default function globalSetup(): void {
  for (const action of ["rollback-all", "latest", "seed"]) {
    execFileSync("node_modules/.bin/tsx", ["--conditions=react-server", "scripts/migrate.ts", action], { stdio: "inherit", env: process.env });
  }
}
