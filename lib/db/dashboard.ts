/** Manager dashboard numbers, computed in SQL: open findings by project × severity and age, the trend, release readiness. */
import "server-only";
import { db } from "./knex";
import type { SessionUser } from "@/lib/auth/session";
import type { DashboardFilter, DashboardRow, DashboardDto } from "@/lib/contracts/dashboard";
export type { DashboardFilter, DashboardRow, DashboardDto } from "@/lib/contracts/dashboard";
export { dashboardFilterSchema } from "@/lib/contracts/dashboard";

function openThreads(f: DashboardFilter) {
  const q = db()("threads as t")
    .join("layouts as l", "l.id", "t.layout_id")
    .join("projects as p", "p.id", "l.project_id")
    .whereIn("t.status", ["open", "reopened"]);
  if (f.project) q.where("p.id", f.project);
  if (f.checker) q.where("p.checker_id", f.checker);
  if (f.rule) q.where("t.rule", f.rule);
  return q;
}

/** All dashboard figures for the filter. Every role may read them. */
export async function dashboard(_user: SessionUser, f: DashboardFilter): Promise<DashboardDto> {
  const k = db();
  const rows = await openThreads(f)
    .leftJoin("users as c", "c.id", "p.checker_id")
    .groupBy("p.id", "p.name", "c.name")
    .orderBy("p.name")
    .select(
      "p.id as projectId",
      "p.name as project",
      "c.name as checker",
      k.raw("sum(t.severity = 'error') as error"),
      k.raw("sum(t.severity = 'warning') as warning"),
      k.raw("sum(t.severity = 'info') as info"),
      k.raw("sum(t.opened_at >= now(3) - interval 7 day) as underWeek"),
      k.raw("sum(t.opened_at < now(3) - interval 7 day and t.opened_at >= now(3) - interval 30 day) as underMonth"),
      k.raw("sum(t.opened_at < now(3) - interval 30 day) as older"),
    );
  /** One project's counts as MariaDB returns them (sums arrive as strings). */
  interface CountRow {
    projectId: number;
    project: string;
    checker: string | null;
    error: number | string;
    warning: number | string;
    info: number | string;
    underWeek: number | string;
    underMonth: number | string;
    older: number | string;
  }
  const num = (r: CountRow): DashboardRow => ({
    projectId: r.projectId,
    project: r.project,
    checker: r.checker ?? null,
    error: Number(r.error),
    warning: Number(r.warning),
    info: Number(r.info),
    underWeek: Number(r.underWeek),
    underMonth: Number(r.underMonth),
    older: Number(r.older),
  });
  const out = rows.map(num);
  const totals = out.reduce(
    (s, r) => ({
      error: s.error + r.error,
      warning: s.warning + r.warning,
      info: s.info + r.info,
      underWeek: s.underWeek + r.underWeek,
      underMonth: s.underMonth + r.underMonth,
      older: s.older + r.older,
    }),
    { error: 0, warning: 0, info: 0, underWeek: 0, underMonth: 0, older: 0 },
  );

  // trend: net change of open findings per day from the events (+ open/reopen, − resolve/waive), summed in SQL
  const changes = db()("events as e")
    .join("threads as t", "t.id", "e.thread_id")
    .join("layouts as l", "l.id", "t.layout_id")
    .join("projects as p", "p.id", "l.project_id")
    .whereIn("e.kind", ["open", "reopen", "resolve", "waive"])
    .groupByRaw("date(e.created_at)")
    .orderByRaw("date(e.created_at)")
    .select(k.raw("date_format(date(e.created_at), '%Y-%m-%d') as day"), k.raw("sum(case when e.kind in ('open', 'reopen') then 1 else -1 end) as delta"));
  if (f.project) changes.where("p.id", f.project);
  if (f.checker) changes.where("p.checker_id", f.checker);
  if (f.rule) changes.where("t.rule", f.rule);
  const deltas: { day: string; delta: number }[] = await changes;
  const start = new Date(Date.now() - (f.days - 1) * 86400000);
  const trend: { day: string; open: number }[] = [];
  let running = deltas.filter((d) => d.day < start.toISOString().slice(0, 10)).reduce((s, d) => s + Number(d.delta), 0);
  const byDay = new Map(deltas.map((d) => [d.day, Number(d.delta)]));
  for (let i = 0; i < f.days; i++) {
    const day = new Date(start.getTime() + i * 86400000).toISOString().slice(0, 10);
    running += byDay.get(day) ?? 0;
    trend.push({ day, open: running });
  }

  // release readiness of each layout's newest revision
  const latest = db()("revisions").select("layout_id").max({ number: "number" }).groupBy("layout_id").as("m");
  const lq = db()("layouts as l")
    .join("projects as p", "p.id", "l.project_id")
    .join(latest, "m.layout_id", "l.id")
    .join("revisions as v", function () {
      this.on("v.layout_id", "=", "l.id").andOn("v.number", "=", "m.number");
    })
    .leftJoin("releases as r", "r.revision_id", "v.id")
    .select("l.id", "l.name", "p.name as project", "v.id as revision_id", "v.number", "r.requested_at", "r.approved_at")
    .orderBy("p.name")
    .orderBy("l.name");
  if (f.project) lq.where("p.id", f.project);
  if (f.checker) lq.where("p.checker_id", f.checker);
  const layoutRows = await lq;
  const blockers = layoutRows.length
    ? await db()("findings as fi")
        .join("threads as t", "t.id", "fi.thread_id")
        .whereIn(
          "fi.revision_id",
          layoutRows.map((r: { revision_id: number }) => r.revision_id),
        )
        .where("fi.severity", "error")
        .whereIn("t.status", ["open", "reopened"])
        .select("fi.revision_id", "t.id", "t.title", "t.rule")
    : [];
  // the state comes from every open error; under a rule filter a blocked layout lists (and is listed for) that rule's blockers only
  const layouts = layoutRows
    .map((r: { id: number; name: string; project: string; number: number; revision_id: number; approved_at: Date | null; requested_at: Date | null }) => {
      const mine = (blockers as { revision_id: number; id: number; title: string; rule: string }[]).filter((b) => b.revision_id === r.revision_id);
      const state: DashboardDto["layouts"][number]["state"] = r.approved_at ? "released" : mine.length ? "blocked" : r.requested_at ? "requested" : "ready";
      const blocking = mine.filter((b) => !f.rule || b.rule === f.rule).map((b) => ({ threadId: b.id, title: b.title }));
      return { id: r.id, name: r.name, project: r.project, revision: r.number, state, blocking };
    })
    .filter((l) => !(f.rule && l.state === "blocked" && l.blocking.length === 0));
  const rules = (await db()("threads").distinct("rule").orderBy("rule")).map((r: { rule: string }) => r.rule);
  const projects = await db()("projects").select("id", "name").orderBy("name");
  const checkers = await db()("users").where({ role: "checker", active: true }).select("id", "name").orderBy("name");
  return { rows: out, totals, trend, layouts, rules, projects, checkers };
}

/** The project × severity table as CSV. */
export function dashboardCsv(d: DashboardDto): string {
  // a cell that a spreadsheet would read as a formula is prefixed with an apostrophe (CSV injection)
  const q = (raw: string) => {
    const s = /^[=+\-@\t\r]/.test(raw) ? `'${raw}` : raw;
    return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  const lines = ["project,checker,open errors,open warnings,open infos,opened under a week ago,opened a week to a month ago,opened over a month ago"];
  for (const r of d.rows) lines.push([q(r.project), q(r.checker ?? ""), r.error, r.warning, r.info, r.underWeek, r.underMonth, r.older].join(","));
  const t = d.totals;
  lines.push(["total", "", t.error, t.warning, t.info, t.underWeek, t.underMonth, t.older].join(","));
  return lines.join("\n") + "\n";
}
