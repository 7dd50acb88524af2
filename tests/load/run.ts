/**
 * npm run load: a bounded load run against a running Sixfold on loopback (start it with `npm start`).
 * Signs in, creates API tokens, then for LOAD_SECONDS (default 120) drives 50 concurrent clients:
 * 40 reading findings and threads, 8 posting comments, 2 uploading layouts. Prints throughput and
 * p50/p95/p99 latency per mix, then checks in the database that every accepted comment and upload is there.
 * Env: SIXFOLD_URL (default http://127.0.0.1:3000, loopback only), LOAD_SECONDS, DB_* (default: demo DB).
 */
import { readFileSync } from "node:fs";
import autocannon from "autocannon";
import knexLib from "knex";
import { connectionConfig } from "../../db/connection";
import { demoUsers } from "../../db/seeds/01_users";

const base = (process.env.SIXFOLD_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const host = new URL(base).hostname;
if (!["127.0.0.1", "localhost", "::1", "[::1]"].includes(host)) throw new Error("the load run only targets a server on loopback");
const seconds = Math.min(Math.max(Number(process.env.LOAD_SECONDS ?? 120), 5), 600);
const runId = `load-${Date.now()}`;

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
  const res = await fetch(`${base}/api/tokens`, { method: "POST", headers: { cookie, origin: base, "content-type": "application/json" }, body: JSON.stringify({ name: `${runId} ${role}` }) });
  if (res.status !== 201) throw new Error(`could not create a ${role} token: ${res.status}`);
  return ((await res.json()) as { token: string }).token;
}

/** Runs one autocannon instance and keeps every response time (autocannon's own summary has no p95). */
function run(opts: autocannon.Options): Promise<{ result: autocannon.Result; times: number[] }> {
  const times: number[] = [];
  return new Promise((resolve, reject) => {
    const instance = autocannon(opts, (err, result) => (err ? reject(err) : resolve({ result, times })));
    instance.on("response", (_client: unknown, _status: number, _bytes: number, responseTime: number) => times.push(responseTime));
  });
}

const pct = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : NaN);

function summary(name: string, { result: r, times }: { result: autocannon.Result; times: number[] }) {
  const t = times.slice().sort((a, b) => a - b);
  return {
    mix: name,
    requests: r.requests.total,
    "req/s": Math.round(r.requests.average),
    "p50 ms": Number(pct(t, 50).toFixed(1)),
    "p95 ms": Number(pct(t, 95).toFixed(1)),
    "p99 ms": Number(pct(t, 99).toFixed(1)),
    "2xx": r["2xx"],
    non2xx: r.non2xx,
    errors: r.errors + r.timeouts,
  };
}

/** Revokes the tokens this run created (bearer callers may manage their own tokens). */
async function revokeRunTokens(tokens: string[]): Promise<void> {
  for (const t of tokens) {
    const headers = { authorization: `Bearer ${t}` };
    const list = (await (await fetch(`${base}/api/tokens`, { headers })).json()) as { tokens: { id: number; name: string; revokedAt: string | null }[] };
    for (const x of list.tokens.filter((x) => x.name.startsWith(runId) && !x.revokedAt)) await fetch(`${base}/api/tokens/${x.id}`, { method: "DELETE", headers });
  }
}

async function main() {
  const designer = await token("designer");
  const checker = await token("checker");
  const manager = await token("manager");
  try {
    await drive(designer, checker, manager);
  } finally {
    await revokeRunTokens([designer, checker, manager]);
  }
}

async function drive(designer: string, checker: string, manager: string) {
  const auth = (t: string) => ({ authorization: `Bearer ${t}` });
  // a layout whose newest revision is not released (a released one is read-only)
  const projects = (await (await fetch(`${base}/api/projects`, { headers: auth(manager) })).json()) as { projects: { id: number; name: string }[] };
  const project = projects.projects.find((p) => p.name === "Interferometer breadboard") ?? projects.projects[0];
  const detail = (await (await fetch(`${base}/api/projects/${project.id}`, { headers: auth(manager) })).json()) as { layouts: { id: number }[] };
  const layoutId = detail.layouts[0].id;
  const threads = ((await (await fetch(`${base}/api/layouts/${layoutId}`, { headers: auth(manager) })).json()) as { threads: { id: number }[] }).threads;
  const threadId = threads[0].id;
  const file = readFileSync("examples/breadboard-three-seats.json", "utf8");
  let commentN = 0;
  let uploadN = 0;
  console.error(`[load] ${base}, ${seconds} s, layout ${layoutId}, thread ${threadId}, run ${runId}`);

  if (process.env.LOAD_MIX === "findings") {
    // the findings API alone, 50 clients: the figure the target names
    const only = await run({ url: base, connections: 50, duration: seconds, requests: [{ method: "GET", path: `/api/v1/layouts/${layoutId}/findings?status=open`, headers: auth(manager) }] });
    console.table([summary("findings API only", only)]);
    process.exitCode = only.result.errors + only.result.non2xx === 0 ? 0 : 1;
    return;
  }
  const reads = run({
    url: base,
    connections: 40,
    duration: seconds,
    requests: [
      { method: "GET", path: `/api/v1/layouts/${layoutId}/findings?status=open`, headers: auth(manager) },
      { method: "GET", path: `/api/threads/${threadId}`, headers: auth(manager) },
    ],
  });
  const comments = run({
    url: base,
    connections: 8,
    duration: seconds,
    requests: [{ method: "POST", path: `/api/threads/${threadId}/comments`, headers: { ...auth(checker), "content-type": "application/json" }, setupRequest: (req: autocannon.Request) => ({ ...req, body: JSON.stringify({ body: `${runId} comment ${++commentN}` }) }) }],
  });
  const uploads = run({
    url: base,
    connections: 2,
    duration: seconds,
    requests: [{ method: "POST", path: `/api/v1/layouts/${layoutId}/revisions`, setupRequest: (req: autocannon.Request) => ({ ...req, headers: { ...auth(designer), "content-type": "application/json", "x-file-name": `${runId}-${++uploadN}.json` }, body: file }) }],
  });
  const [rr, cc, uu] = await Promise.all([reads, comments, uploads]);
  console.table([summary("reads (findings API, threads)", rr), summary("comments", cc), summary("uploads", uu)]);
  const [r, c, u] = [rr.result, cc.result, uu.result];

  const knex = knexLib(connectionConfig());
  try {
    const storedComments = Number((await knex("comments").where("body", "like", `${runId} comment %`).count({ n: "*" }).first())!.n);
    const storedUploads = Number((await knex("revisions").where("file_name", "like", `${runId}-%`).count({ n: "*" }).first())!.n);
    // every accepted write must be stored; a few more may be stored that were still in flight when the run stopped
    const inFlight = (n: number, stored: number, conns: number) => stored >= n && stored <= n + conns;
    const ok = inFlight(c["2xx"], storedComments, 8) && inFlight(u["2xx"], storedUploads, 2) && r.errors + c.errors + u.errors === 0 && r.non2xx + c.non2xx + u.non2xx === 0;
    console.log(`comments: ${c["2xx"]} accepted, ${storedComments} in the database; uploads: ${u["2xx"]} accepted, ${storedUploads} in the database (requests still in flight at the stop may add up to one per client)`);
    console.log(ok ? "load: 0 errors, nothing lost" : "load: ERRORS OR LOSS — see above");
    process.exitCode = ok ? 0 : 1;
  } finally {
    await knex.destroy();
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
