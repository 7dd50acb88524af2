/**
 * npm run bench: rank-analysis time for generated layouts of 1–500 bodies (6–7 contacts a body, chains
 * and trees), the structured engine (analysis.md §12) beside the dense SVD, median of several runs, and
 * the process's peak resident memory, printed as a table. Speed targets live here, never in timed tests.
 * The dense path is skipped above --dense-max bodies (its cost grows with the cube).
 * Usage: npm run bench [-- --max-bodies 100] [-- --runs 5] [-- --dense-max 200]
 */
import { analyseConstraint } from "../../lib/analysis/constraint";
import type { Layout, Vec3 } from "../../lib/layout/model";
import { rng } from "../support/layouts";

function generate(bodies: number, tree: boolean, seed: number): Layout {
  const r = rng(seed);
  const contacts: Layout["contacts"] = [];
  for (let b = 0; b < bodies; b++) {
    const parent = b === 0 ? "ground" : tree ? `b${Math.floor(r() * b)}` : `b${b - 1}`;
    const origin: Vec3 = [b * 120, (r() - 0.5) * 200, (r() - 0.5) * 100];
    const count = 6 + (r() < 0.5 ? 1 : 0);
    for (let k = 0; k < count; k++) {
      const n: Vec3 = [r() - 0.5, r() - 0.5, r() - 0.5];
      contacts.push({
        id: `c${contacts.length}`,
        body: `b${b}`,
        on: k === 6 && b > 1 ? "ground" : parent,
        point: [origin[0] + (r() - 0.5) * 80, origin[1] + (r() - 0.5) * 80, origin[2] + (r() - 0.5) * 80],
        normal: n,
        sense: "unilateral",
      });
    }
  }
  return {
    format: "mount-layout/1",
    name: `bench ${bodies}`,
    units: { length: "mm", force: "N" },
    gravity: [0, 0, -9.80665],
    tolerance: 1e-6,
    intendedFreedoms: 0,
    bodies: Array.from({ length: bodies }, (_, i) => ({ id: `b${i}` })),
    materials: [],
    contacts,
    loads: [],
    points: [],
  };
}

const args = process.argv.slice(2);
const arg = (name: string, def: number) => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : def;
};
const maxBodies = arg("--max-bodies", 500);
const denseMax = arg("--dense-max", 100);
const runs = arg("--runs", 3);
const median = (xs: number[]) => xs.slice().sort((a, b) => a - b)[Math.floor(xs.length / 2)];

const time = (layout: Layout, method: "dense" | "structured", n: number) => {
  const times: number[] = [];
  let rank = 0;
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    rank = analyseConstraint(layout, method).counts.rank;
    times.push(performance.now() - t0);
  }
  return { ms: median(times), rank };
};

console.log("| bodies | layout | contacts | matrix | rank | structured ms | dense ms | LAPACK reference ms | peak RSS MB |");
console.log("|---:|---|---:|---|---:|---:|---:|---:|---:|");
const lapack: Record<number, string> = { 1: "—", 10: "1.4", 50: "23", 100: "130", 200: "750", 500: "—" };
for (const bodies of [1, 10, 50, 100, 200, 500].filter((b) => b <= maxBodies)) {
  for (const tree of [false, true]) {
    if (bodies === 1 && tree) continue;
    const layout = generate(bodies, tree, bodies * 7 + (tree ? 1 : 0));
    const n = bodies >= 100 ? Math.max(1, Math.min(runs, 2)) : runs;
    const s = time(layout, "structured", n);
    const d = bodies <= denseMax ? time(layout, "dense", n) : null;
    if (d && d.rank !== s.rank) throw new Error(`rank differs at ${bodies} bodies: dense ${d.rank}, structured ${s.rank}`);
    const m = layout.contacts.length;
    const rss = (process.resourceUsage().maxRSS / 1024).toFixed(0);
    console.log(
      `| ${bodies} | ${tree ? "tree" : "chain"} | ${m} | ${m}×${6 * bodies} | ${s.rank} | ${s.ms.toFixed(1)} | ${d ? d.ms.toFixed(1) : "—"} | ${lapack[bodies]} | ${rss} |`,
    );
  }
}
