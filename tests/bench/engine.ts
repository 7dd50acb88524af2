/**
 * npm run bench: engine time for generated layouts of 10–500 bodies in four shapes — a chain, a tree, a star
 * (a bench carrying mounts) and a mesh with loops — the structured engine (analysis.md §12) beside the dense
 * path and beside LAPACK's dense SVD of the same matrix (numpy, timed in the same run when python3 with numpy
 * is installed; `apt-get install python3-numpy`), with the process's peak resident memory. Then the full
 * analysis (rank, bases, seating, foundation, temperature, repeatability) of a 500-body, 5,000-contact
 * instrument and the engine time of a one-body layout. Speed targets live here, never in timed tests.
 * Usage: npm run bench [-- --max-bodies 200] [-- --runs 3] [-- --dense-max 100] [-- --lapack-max 200]
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { analyseConstraint } from "../../lib/analysis/constraint";
import { analyseLayout } from "../../lib/analysis";
import { parseLayoutBytes } from "../../lib/layout";
import type { Layout } from "../../lib/layout/model";
import { generate, instrument, type Shape } from "../support/instruments";

const args = process.argv.slice(2);
const arg = (name: string, def: number) => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : def;
};
const maxBodies = arg("--max-bodies", 500);
const denseMax = arg("--dense-max", 100);
const lapackMax = arg("--lapack-max", 200);
const runs = arg("--runs", 3);
const median = (xs: number[]) => xs.slice().sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const rss = () => (process.resourceUsage().maxRSS / 1024).toFixed(0);

function time<T>(f: () => T, n: number): { ms: number; value: T } {
  const times: number[] = [];
  let value!: T;
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    value = f();
    times.push(performance.now() - t0);
  }
  return { ms: median(times), value };
}

const numpy = spawnSync("python3", ["-c", "import numpy"], { encoding: "utf8" }).status === 0;
const work = mkdtempSync(path.join(os.tmpdir(), "sixfold-bench-"));
/** numpy.linalg.svd of the same scaled matrix (singular values and both bases), median of `n` runs, in ms. */
function lapackMs(layout: Layout, n: number): number | null {
  if (!numpy) return null;
  const { rows } = analyseConstraint(layout, "structured");
  const dense = new Float64Array(rows.m * rows.n);
  for (let i = 0; i < rows.m; i++)
    for (const [b, sign] of [
      [rows.b1[i], 1],
      [rows.b2[i], -1],
    ])
      if (b >= 0) for (let j = 0; j < 6; j++) dense[i * rows.n + 6 * b + j] += sign * rows.v[6 * i + j];
  const file = path.join(work, "a.f64");
  writeFileSync(file, dense);
  const script = `import numpy as np, time, statistics
A = np.fromfile(${JSON.stringify(file)}, dtype='<f8').reshape(${rows.m}, ${rows.n})
t = []
for _ in range(${n}):
    t0 = time.perf_counter(); np.linalg.svd(A); t.append(time.perf_counter() - t0)
print(statistics.median(t) * 1000)`;
  const out = spawnSync("python3", ["-c", script], { encoding: "utf8" });
  return out.status === 0 ? Number(out.stdout.trim()) : null;
}

console.log(
  `Machine: ${os.cpus()[0]?.model ?? "unknown CPU"}, ${os.availableParallelism()} cores, Node ${process.version}${numpy ? "" : " (no numpy: LAPACK column empty)"}`,
);
console.log("");
console.log("| bodies | layout | contacts | matrix | rank | structured ms | dense ms | LAPACK (numpy) ms | LAPACK ÷ structured | peak RSS MB |");
console.log("|---:|---|---:|---|---:|---:|---:|---:|---:|---:|");
const fmt = (x: number | null) => (x === null ? "—" : x < 10 ? x.toFixed(1) : x.toFixed(0));
for (const bodies of [10, 50, 100, 200, 500].filter((b) => b <= maxBodies)) {
  for (const shape of ["chain", "tree", "star", "mesh"] as Shape[]) {
    const layout = generate(bodies, shape, bodies * 7 + shape.length);
    // the median of an odd count (of two it would be the slower run); 500 bodies take two runs less
    const n = bodies >= 500 ? Math.max(1, runs - 2) : Math.max(runs, 5);
    // three warm-up runs so the JIT has compiled the loops (the analysis worker is a long-lived thread)
    for (let w = 0; w < 3; w++) analyseConstraint(layout, "structured");
    const s = time(() => analyseConstraint(layout, "structured"), n);
    const d = bodies <= denseMax ? time(() => analyseConstraint(layout, "dense"), Math.min(n, 2)) : null;
    if (d && d.value.counts.rank !== s.value.counts.rank)
      throw new Error(`rank differs at ${bodies} bodies (${shape}): dense ${d.value.counts.rank}, structured ${s.value.counts.rank}`);
    const lap = bodies <= lapackMax ? lapackMs(layout, bodies >= 200 ? 2 : 3) : null;
    const m = layout.contacts.length;
    console.log(
      `| ${bodies} | ${shape} | ${m} | ${m}×${6 * bodies} | ${s.value.counts.rank} | ${fmt(s.ms)} | ${fmt(d?.ms ?? null)} | ${fmt(lap)} | ${lap === null ? "—" : `${(lap / s.ms).toFixed(1)}×`} | ${rss()} |`,
    );
  }
}

if (maxBodies >= 500) {
  console.log("");
  console.log("Whole instrument, full analysis (rank, bases, seating, foundation, temperature, repeatability):");
  console.log("");
  console.log("| layout | bodies | contacts | points | rank | redundancies | full analysis ms | peak RSS MB |");
  console.log("|---|---:|---:|---:|---:|---:|---:|---:|");
  for (const shape of ["star", "mesh"] as Shape[]) {
    const layout = instrument(generate(500, shape, 9100 + shape.length, 10));
    const t = time(() => analyseLayout(layout), 1);
    const c = t.value.constraint.counts;
    console.log(`| ${shape} | ${c.bodies} | ${c.contacts} | ${layout.points.length} | ${c.rank} | ${c.redundancies} | ${fmt(t.ms)} | ${rss()} |`);
  }
}

// one body: the engine's own time on an example file (the command-line checker's start-up is measured apart)
const one = parseLayoutBytes(new Uint8Array(readFileSync(path.join("examples", "mirror-cell-three-vee.json"))), { fileName: "mirror-cell-three-vee.json" });
if (one.ok) {
  analyseLayout(one.layout);
  console.log("");
  console.log(
    `One-body layout (examples/mirror-cell-three-vee.json), full analysis: ${time(() => analyseLayout(one.layout), 20).ms.toFixed(2)} ms (median of 20)`,
  );
}
const cli = time(() => spawnSync(process.execPath, ["scripts/check.mjs", "examples/mirror-cell-three-vee.json"], { encoding: "utf8" }), 5);
console.log(`Command-line checker on it, wall time: ${cli.ms.toFixed(0)} ms (median of 5, node scripts/check.mjs; npm run adds its own start-up)`);
rmSync(work, { recursive: true, force: true });
