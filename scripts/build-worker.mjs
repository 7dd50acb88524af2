// Bundles the analysis worker (lib/worker/analyse-worker.ts and the engine it imports) into dist/.
import { build } from "esbuild";

await build({
  entryPoints: ["lib/worker/analyse-worker.ts"],
  outfile: "dist/analyse-worker.cjs",
  bundle: true,
  platform: "node",
  format: "cjs",
  target: "node20",
  tsconfig: "tsconfig.json",
  logLevel: "warning",
});
console.error("[build] dist/analyse-worker.cjs");
