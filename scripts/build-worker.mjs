// Bundles the analysis worker (lib/worker/analyse-worker.ts), the drawing worker of the PDF report
// (lib/worker/drawing-worker.ts) and the command-line checker (lib/cli/check.ts), each with what it imports,
// into dist/: the worker threads and the CLI start without compiling TypeScript. The SVG rasteriser is a native
// module and stays in node_modules.
import { build } from "esbuild";

export const bundles = [
  { entry: "lib/worker/analyse-worker.ts", out: "dist/analyse-worker.cjs" },
  { entry: "lib/worker/drawing-worker.ts", out: "dist/drawing-worker.cjs" },
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
      external: ["@resvg/resvg-js"],
      // the drawing components are React (automatic JSX runtime) and read NODE_ENV
      jsx: "automatic",
      define: { "process.env.NODE_ENV": '"production"' },
    });
    console.error(`[build] ${b.out}`);
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await buildBundles();
