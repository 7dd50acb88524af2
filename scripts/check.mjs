// `npm run check`: runs the command-line checker from its bundle (dist/check.cjs), rebuilding it first when
// a source under lib/ or rules/ is newer (a fresh clone builds it once, in about a second).
import { existsSync, readdirSync, statSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..");
const bundle = path.join(root, "dist", "check.cjs");

function newestSource(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(p));
    else if (/\.tsx?$/.test(entry.name)) newest = Math.max(newest, statSync(p).mtimeMs);
  }
  return newest;
}

const stale = !existsSync(bundle) || statSync(bundle).mtimeMs < Math.max(newestSource(path.join(root, "lib")), newestSource(path.join(root, "rules")));
if (stale) {
  const cwd = process.cwd();
  process.chdir(root);
  const { buildBundles, bundles } = await import("./build-worker.mjs");
  await buildBundles(bundles.filter((b) => b.out.endsWith("check.cjs")));
  process.chdir(cwd);
}
createRequire(import.meta.url)(bundle);
