// Bundles the analysis worker (lib/worker/analyse-worker.ts) and the command-line checker (lib/cli/check.ts),
// each with the engine it imports, into dist/: the worker threads and the CLI start without compiling TypeScript.
import { build } from "esbuild";

export const bundles = [
  { entry: "lib/worker/analyse-worker.ts", out: "dist/analyse-worker.cjs" },
  { entry: "lib/cli/check.ts", out: "dist/check.cjs" },
];

/** Builds the given bundles (all by default). */
export async function buildBundles(which = bundles) {
  for (const b of which) {
    await build({
      entryPoints: [b.entry],
      outfile: b.out,
      bundle: true,
      platform: "node",
      format: "cjs",
      target: "node20",
      tsconfig: "tsconfig.json",
      logLevel: "warning",
    });
    console.error(`[build] ${b.out}`);
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await buildBundles();
