/**
 * npm run load: a bounded load run against a running Sixfold on loopback (start it with `npm start`).
 *
 * Signs in, creates API tokens and a layout of its own ("Load run …", removed afterwards unless LOAD_KEEP=1),
 * then for LOAD_SECONDS (default 120) runs 50 concurrent clients:
 *   40 readers    — each reads the findings API or one of the layout's threads, then waits (think time);
 *    8 commenters — each posts a comment on one of the threads, then waits;
 *    2 uploaders  — each uploads a revision (alternating three seats / four feet), then waits.
 * A client sends its next request only after the answer to the previous one and its think time, as a person
 * or a CAD script does. LOAD_MODE=paced (default) uses mean think times of 0.5 s (readers), 2 s (commenters)
 * and 5 s (uploaders), drawn uniformly from 0.5–1.5 × the mean so the clients do not march in step; those are
 * far above a person's pace (common practice for review tools: a page every few seconds to minutes).
 * LOAD_MODE=saturate drops the think time: every client fires again on each answer, which measures capacity.
 * LOAD_MIX=findings runs the 50 clients on the findings API alone.
 *
 * Afterwards it checks in the database that every comment and upload the server accepted is stored (all requests
 * in flight at the deadline are awaited, so the counts must match exactly) and prints throughput and
 * p50/p95/p99 latency per mix. Env: SIXFOLD_URL (default http://127.0.0.1:3000, loopback only), LOAD_SECONDS,
 * LOAD_MODE, LOAD_MIX, LOAD_KEEP, DB_* (default: the demo database).
 */
import { readFileSync } from "node:fs";
import http from "node:http";
import knexLib from "knex";
import { connectionConfig } from "../../db/connection";
import { demoUsers } from "../../db/seeds/01_users";

const base = (process.env.SIXFOLD_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const host = new URL(base).hostname;
if (!["127.0.0.1", "localhost", "::1", "[::1]"].includes(host)) throw new Error("the load run only targets a server on loopback");
const seconds = Math.min(Math.max(Number(process.env.LOAD_SECONDS ?? 120), 5), 600);
const mode = process.env.LOAD_MODE === "saturate" ? "saturate" : "paced";
const findingsOnly = process.env.LOAD_MIX === "findings";
const runId = `load-${Date.now()}`;
const FINDINGS_TARGET_P95_MS = 50;

async function session(role: string): Promise<string> {
  const u = demoUsers.find((d) => d.role === role)!;
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const cookies = csrf.headers.getSetCookie().map((c) => c.split(";")[0]);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookies.join("; "), origin: base },
    body: new URLSearchParams({ csrfToken, email: u.email, password: u.password, json: "true" }),
  });
  const all = [...cookies, ...res.headers.getSetCookie().map((c) => c.split(";")[0])];
  return all.join("; ");
}

async function token(role: string): Promise<string> {
  const cookie = await session(role);
  const res = await fetch(`${base}/api/tokens`, {
    method: "POST",
    headers: { cookie, origin: base, "content-type": "application/json" },
    body: JSON.stringify({ name: `${runId} ${role}` }),
  });
  if (res.status !== 201) throw new Error(`could not create a ${role} token: ${res.status}`);
  return ((await res.json()) as { token: string }).token;
}

interface Call {
  method: "GET" | "POST";
  path: string;
  headers: Record<string, string>;
  body?: string;
  kind: string;
}
interface Tally {
  times: number[];
  ok: number;
  non2xx: number;
  errors: number;
  statuses: Record<number, number>;
}
const tallies = new Map<string, Tally>();
const tally = (kind: string) => tallies.get(kind) ?? tallies.set(kind, { times: [], ok: 0, non2xx: 0, errors: 0, statuses: {} }).get(kind)!;

// node:http with one keep-alive connection per client: lighter on the shared CPU than fetch, so the load
// generator takes less from the server it measures
const agent = new http.Agent({ keepAlive: true, maxSockets: 64 });

function request(call: Call): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = http.request(`${base}${call.path}`, { method: call.method, headers: call.headers, agent }, (res) => {
      res.on("data", () => {});
      res.on("end", () => resolve(res.statusCode ?? 0));
      res.on("error", reject);
    });
    req.on("error", reject);
    req.end(call.body);
  });
}

async function send(call: Call): Promise<void> {
  const t = tally(call.kind);
  const started = performance.now();
  try {
    const status = await request(call);
    t.times.push(performance.now() - started);
    t.statuses[status] = (t.statuses[status] ?? 0) + 1;
    if (status >= 200 && status < 300) t.ok++;
    else t.non2xx++;
  } catch {
    t.errors++;
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** One client: request, wait for the answer, think, repeat until the deadline; the last request is always awaited. */
async function client(next: () => Call, thinkMs: number, deadline: number): Promise<void> {
  // start spread over one think time so the clients do not begin in step
  if (thinkMs > 0) await sleep(Math.random() * thinkMs);
  while (performance.now() < deadline) {
    await send(next());
    if (thinkMs > 0) await sleep(thinkMs * (0.5 + Math.random()));
  }
}

const pct = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : NaN);
const ms = (x: number) => Number(x.toFixed(1));

function row(kind: string, clients: number) {
  const t = tally(kind);
  const s = t.times.slice().sort((a, b) => a - b);
  return {
    mix: kind,
    clients,
    requests: s.length,
    "req/s": Math.round(s.length / seconds),
    "p50 ms": ms(pct(s, 50)),
    "p95 ms": ms(pct(s, 95)),
    "p99 ms": ms(pct(s, 99)),
    "max ms": ms(s[s.length - 1] ?? NaN),
    "2xx": t.ok,
    non2xx: t.non2xx,
    errors: t.errors,
  };
}

async function main() {
  const designer = await token("designer");
  const checker = await token("checker");
  const manager = await token("manager");
  let layoutId = 0;
  const knex = knexLib(connectionConfig());
  try {
    layoutId = await createRunLayout(designer, manager);
    await firstRevision(layoutId, designer);
    await drive(layoutId, designer, checker, manager, knex);
  } finally {
    agent.destroy();
    if (layoutId && process.env.LOAD_KEEP !== "1") await knex("layouts").where({ id: layoutId }).delete();
    await knex.destroy();
    await revokeRunTokens([designer, checker, manager]);
  }
}

const auth = (t: string) => ({ authorization: `Bearer ${t}` });
const files = ["examples/breadboard-three-seats.json", "examples/breadboard-four-feet.json"].map((f) => readFileSync(f, "utf8"));

/** The run's own layout (removed at the end, whatever happens after it exists). */
async function createRunLayout(designer: string, manager: string): Promise<number> {
  const projects = (await (await fetch(`${base}/api/projects`, { headers: auth(manager) })).json()) as { projects: { id: number; name: string }[] };
  const project = projects.projects.find((p) => p.name === "Interferometer breadboard") ?? projects.projects[0];
  const res = await fetch(`${base}/api/projects/${project.id}/layouts`, {
    method: "POST",
    headers: { ...auth(designer), "content-type": "application/json" },
    body: JSON.stringify({ name: `Load run ${runId}`, description: "Created by npm run load; removed at its end." }),
  });
  if (res.status !== 201) throw new Error(`could not create the load layout: ${res.status} ${await res.text()}`);
  return ((await res.json()) as { layout: { id: number } }).layout.id;
}

/** Four feet first: several findings, so several threads to read and comment on. */
async function firstRevision(layoutId: number, designer: string): Promise<void> {
  const up = await fetch(`${base}/api/v1/layouts/${layoutId}/revisions`, {
    method: "POST",
    headers: { ...auth(designer), "content-type": "application/json", "x-file-name": "four-feet.json" },
    body: files[1],
  });
  if (up.status !== 201) throw new Error(`could not upload the first revision: ${up.status}`);
}

async function drive(layoutId: number, designer: string, checker: string, manager: string, knex: knexLib.Knex) {
  const threads = ((await (await fetch(`${base}/api/layouts/${layoutId}`, { headers: auth(manager) })).json()) as { threads: { id: number }[] }).threads.map(
    (t) => t.id,
  );
  const pick = <T>(xs: T[]) => xs[Math.floor(Math.random() * xs.length)];
  const think = (pacedMs: number) => (mode === "paced" ? pacedMs : 0);
  const deadline = performance.now() + seconds * 1000;
  console.error(`[load] ${base}, ${mode}, ${seconds} s, layout ${layoutId} with ${threads.length} threads, run ${runId}`);

  const findings = (): Call => ({ kind: "findings API", method: "GET", path: `/api/v1/layouts/${layoutId}/findings?status=open`, headers: auth(manager) });
  const thread = (): Call => ({ kind: "thread reads", method: "GET", path: `/api/threads/${pick(threads)}`, headers: auth(manager) });
  let commentN = 0;
  const comment = (): Call => ({
    kind: "comments",
    method: "POST",
    path: `/api/threads/${pick(threads)}/comments`,
    headers: { ...auth(checker), "content-type": "application/json" },
    body: JSON.stringify({ body: `${runId} comment ${++commentN}` }),
  });
  let uploadN = 0;
  const upload = (): Call => {
    const n = ++uploadN;
    return {
      kind: "uploads",
      method: "POST",
      path: `/api/v1/layouts/${layoutId}/revisions`,
      headers: { ...auth(designer), "content-type": "application/json", "x-file-name": `${runId}-${n}.json` },
      body: files[n % 2],
    };
  };

  const clients: Promise<void>[] = [];
  const counts: Record<string, number> = {};
  const add = (n: number, next: () => Call, thinkMs: number, kinds: string[]) => {
    for (let i = 0; i < n; i++) clients.push(client(next, think(thinkMs), deadline));
    for (const k of kinds) counts[k] = (counts[k] ?? 0) + n;
  };
  if (findingsOnly) add(50, findings, 500, ["findings API"]);
  else {
    let flip = 0;
    add(40, () => (++flip % 2 ? findings() : thread()), 500, ["findings API", "thread reads"]);
    add(8, comment, 2000, ["comments"]);
    add(2, upload, 5000, ["uploads"]);
  }
  await Promise.all(clients);

  const kinds = findingsOnly ? ["findings API"] : ["findings API", "thread reads", "comments", "uploads"];
  console.table(kinds.map((k) => row(k, counts[k])));
  const f = row("findings API", counts["findings API"]);
  console.log(`findings API p95: ${f["p95 ms"]} ms (target < ${FINDINGS_TARGET_P95_MS} ms: ${f["p95 ms"] < FINDINGS_TARGET_P95_MS ? "met" : "NOT met"})`);

  const all = kinds.map((k) => tally(k));
  let ok = all.every((t) => t.errors === 0 && t.non2xx === 0);
  for (const [k, t] of kinds.map((k) => [k, tally(k)] as const)) if (t.non2xx) console.log(`${k}: answers other than 2xx: ${JSON.stringify(t.statuses)}`);
  if (!findingsOnly) {
    const storedComments = Number((await knex("comments").where("body", "like", `${runId} comment %`).count({ n: "*" }).first())!.n);
    const storedUploads = Number(
      (await knex("revisions").where({ layout_id: layoutId }).where("file_name", "like", `${runId}-%`).count({ n: "*" }).first())!.n,
    );
    const c = tally("comments").ok;
    const u = tally("uploads").ok;
    console.log(`comments: ${c} accepted, ${storedComments} in the database; uploads: ${u} accepted, ${storedUploads} in the database`);
    ok = ok && storedComments === c && storedUploads === u;
  }
  console.log(ok ? "load: 0 errors, nothing lost" : "load: ERRORS OR LOSS — see above");
  process.exitCode = ok ? 0 : 1;
}

/** Revokes the tokens this run created (bearer callers may manage their own tokens). */
async function revokeRunTokens(tokens: string[]): Promise<void> {
  for (const t of tokens) {
    const headers = auth(t);
    const list = (await (await fetch(`${base}/api/tokens`, { headers })).json()) as { tokens: { id: number; name: string; revokedAt: string | null }[] };
    for (const x of list.tokens.filter((x) => x.name.startsWith(runId) && !x.revokedAt))
      await fetch(`${base}/api/tokens/${x.id}`, { method: "DELETE", headers });
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
