"use client";
/** Dashboard: filters, open findings by project × severity and age, the trend chart, release readiness, CSV export. */
import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { useMemo, useState } from "react";
import { useRouter } from "next/navigation";
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { fetchJson } from "@/components/ui/fetch-json";
import type { DashboardDto } from "@/lib/contracts/dashboard";

type SortKey = "project" | "error" | "warning" | "info" | "underWeek" | "underMonth" | "older";

/** Blockers listed per layout before "n more". */
const BLOCKERS_SHOWN = 3;

export interface DashboardFilters {
  project: string;
  checker: string;
  rule: string;
  days: string;
}

export function DashboardView({ initial }: { initial?: Partial<DashboardFilters> }) {
  const router = useRouter();
  const [filters, setFilters] = useState<DashboardFilters>({ project: "", checker: "", rule: "", days: "60", ...initial });
  const { project, checker, rule, days } = filters;
  // every filter lives in the address, so a view can be bookmarked and shared
  const set = (key: keyof DashboardFilters, value: string) => {
    const next = { ...filters, [key]: value };
    setFilters(next);
    const params = new URLSearchParams(Object.entries(next).filter(([k, v]) => v && !(k === "days" && v === "60")));
    router.replace(`/dashboard${params.size ? `?${params}` : ""}`, { scroll: false });
  };
  const [sort, setSort] = useState<{ key: SortKey; desc: boolean }>({ key: "error", desc: true });
  const qs = new URLSearchParams({ project, checker, rule, days }).toString();
  const q = useQuery({ queryKey: ["dashboard", qs], queryFn: () => fetchJson<DashboardDto>(`/api/dashboard?${qs}`) });
  const rows = useMemo(() => {
    const r = (q.data?.rows ?? []).slice();
    r.sort((a, b) => {
      const va = a[sort.key];
      const vb = b[sort.key];
      const c = typeof va === "string" ? va.localeCompare(vb as string) : (va as number) - (vb as number);
      return sort.desc ? -c : c;
    });
    return r;
  }, [q.data, sort]);
  const th = (key: SortKey, label: string, right = true) => (
    <th className={right ? "text-right" : ""} aria-sort={sort.key === key ? (sort.desc ? "descending" : "ascending") : "none"}>
      <button type="button" className="uppercase tracking-wider" onClick={() => setSort({ key, desc: sort.key === key ? !sort.desc : true })}>
        {label}
        {sort.key === key ? (sort.desc ? " ↓" : " ↑") : " ↕"}
      </button>
    </th>
  );

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end gap-3">
        <div className="mr-auto">
          <h1>Open findings</h1>
          <p className="text-sm text-graphite-soft">Findings open or reopened on each layout; waived and resolved ones are not counted.</p>
        </div>
        <select className="field w-auto py-1 text-xs" aria-label="Project" value={project} onChange={(e) => set("project", e.target.value)}>
          <option value="">all projects</option>
          {q.data?.projects.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
        <select className="field w-auto py-1 text-xs" aria-label="Checker" value={checker} onChange={(e) => set("checker", e.target.value)}>
          <option value="">all checkers</option>
          {q.data?.checkers.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </select>
        <select className="field w-auto py-1 text-xs" aria-label="Rule" value={rule} onChange={(e) => set("rule", e.target.value)}>
          <option value="">all rules</option>
          {q.data?.rules.map((r) => (
            <option key={r} value={r}>
              {r}
            </option>
          ))}
        </select>
        <select className="field w-auto py-1 text-xs" aria-label="Trend period" value={days} onChange={(e) => set("days", e.target.value)}>
          {["30", "60", "180", "365"].map((d) => (
            <option key={d} value={d}>
              last {d} days
            </option>
          ))}
        </select>
        <a className="btn-quiet" href={`/api/dashboard?${qs}&format=csv`} download>
          Export CSV
        </a>
      </div>
      {q.isPending && (
        <p role="status" className="text-sm text-graphite-soft">
          Loading figures…
        </p>
      )}
      {q.isError && (
        <p role="alert" className="text-sm text-severity-error">
          {(q.error as Error).message}
        </p>
      )}
      {q.data && (
        <>
          <div className="sheet overflow-x-auto">
            <table className="tbl" data-testid="dashboard-table">
              <thead>
                <tr>
                  {th("project", "Project", false)}
                  <th>Checker</th>
                  {th("error", "■ Errors")}
                  {th("warning", "▲ Warnings")}
                  {th("info", "● Infos")}
                  {th("underWeek", "< 1 week")}
                  {th("underMonth", "1 week – 1 month")}
                  {th("older", "> 1 month")}
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.projectId}>
                    <td>
                      <Link href={`/projects/${r.projectId}`}>{r.project}</Link>
                    </td>
                    <td>{r.checker ?? "—"}</td>
                    {[r.error, r.warning, r.info, r.underWeek, r.underMonth, r.older].map((v, i) => (
                      <td key={i} className="num text-right">
                        {v}
                      </td>
                    ))}
                  </tr>
                ))}
                {rows.length === 0 && (
                  <tr>
                    <td colSpan={8} className="py-6 text-center text-graphite-soft">
                      No open findings for this filter.
                    </td>
                  </tr>
                )}
              </tbody>
              <tfoot>
                <tr className="font-semibold">
                  <td>Total</td>
                  <td />
                  {[q.data.totals.error, q.data.totals.warning, q.data.totals.info, q.data.totals.underWeek, q.data.totals.underMonth, q.data.totals.older].map(
                    (v, i) => (
                      <td key={i} className="num text-right" data-testid={`total-${i}`}>
                        {v}
                      </td>
                    ),
                  )}
                </tr>
              </tfoot>
            </table>
          </div>

          <section className="sheet p-4" aria-labelledby="trend-heading">
            <h2 id="trend-heading" className="text-base">
              Open findings over time
            </h2>
            <p className="text-xs text-graphite-soft">Number of open or reopened findings (count) at the end of each day (UTC).</p>
            <div
              className="h-64"
              data-testid="trend-chart"
              role="img"
              aria-label={`Open findings per day; ${q.data.trend[q.data.trend.length - 1]?.open ?? 0} today`}
            >
              <ResponsiveContainer width="100%" height="100%">
                <LineChart data={q.data.trend} margin={{ top: 10, right: 20, left: 0, bottom: 10 }}>
                  <CartesianGrid stroke="#d8ccb4" strokeDasharray="2 4" />
                  <XAxis dataKey="day" tick={{ fontSize: 10 }} label={{ value: "date (UTC)", position: "insideBottomRight", offset: -4, fontSize: 10 }} />
                  <YAxis
                    allowDecimals={false}
                    tick={{ fontSize: 10 }}
                    label={{ value: "open findings (count)", angle: -90, position: "insideLeft", fontSize: 10 }}
                  />
                  <Tooltip />
                  <Legend />
                  <Line type="stepAfter" dataKey="open" name="open findings" stroke="#0f5b5c" strokeWidth={2} dot={false} />
                </LineChart>
              </ResponsiveContainer>
            </div>
          </section>

          <section className="grid gap-4 md:grid-cols-2" aria-label="Release readiness">
            <ReadyList layouts={q.data.layouts.filter((l) => l.state === "ready" || l.state === "requested")} />
            <BlockedList layouts={q.data.layouts.filter((l) => l.state === "blocked")} rule={rule} />
          </section>
        </>
      )}
    </div>
  );
}

type LayoutState = DashboardDto["layouts"][number];

/** Layouts whose newest revision has no open error: ready, or waiting for a checker. */
function ReadyList({ layouts }: { layouts: LayoutState[] }) {
  return (
    <div className="sheet p-4">
      <h2 className="text-base">Ready for release</h2>
      {layouts.length === 0 ? (
        <p className="mt-2 text-sm text-graphite-soft" data-testid="layouts-ready">
          None: every layout in this view is released or still has open errors.
        </p>
      ) : (
        <ul className="mt-2 space-y-1 text-sm" data-testid="layouts-ready">
          {layouts.map((l) => (
            <li key={l.id}>
              <Link href={`/layouts/${l.id}`}>{l.name}</Link>{" "}
              <span className="text-xs text-graphite-soft">
                {l.project} · r{l.revision}
                {l.state === "requested" ? " · release requested" : " · release not yet requested"}
              </span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

/** Layouts held back by open errors, grouped by project, each with its first blockers and how many more. */
function BlockedList({ layouts, rule }: { layouts: LayoutState[]; rule: string }) {
  const byProject = new Map<string, LayoutState[]>();
  for (const l of layouts) byProject.set(l.project, [...(byProject.get(l.project) ?? []), l]);
  return (
    <div className="sheet p-4">
      <h2 className="text-base">Blocked{rule ? ` by ${rule}` : ""}</h2>
      {layouts.length === 0 ? (
        <p className="mt-2 text-sm text-graphite-soft" data-testid="layouts-blocked">
          None{rule ? ` blocked by ${rule}` : ""}.
        </p>
      ) : (
        <div className="mt-2 space-y-3 text-sm" data-testid="layouts-blocked">
          {[...byProject.entries()].map(([projectName, list]) => (
            <div key={projectName}>
              <h3 className="text-xs font-semibold text-graphite-soft">{projectName}</h3>
              <ul className="space-y-1">
                {list.map((l) => (
                  <li key={l.id}>
                    <Link href={`/layouts/${l.id}`}>{l.name}</Link>{" "}
                    <span className="text-xs text-graphite-soft">
                      r{l.revision} · {l.blocking.length} open error{l.blocking.length === 1 ? "" : "s"}
                    </span>
                    <ul className="ml-4 list-disc text-xs">
                      {l.blocking.slice(0, BLOCKERS_SHOWN).map((b) => (
                        <li key={b.threadId}>
                          <Link href={`/findings/${b.threadId}`}>{b.title}</Link>
                        </li>
                      ))}
                      {l.blocking.length > BLOCKERS_SHOWN && (
                        <li className="list-none text-graphite-soft" data-testid="blocked-more">
                          <Link href={`/layouts/${l.id}`}>{l.blocking.length - BLOCKERS_SHOWN} more</Link>
                        </li>
                      )}
                    </ul>
                  </li>
                ))}
              </ul>
            </div>
          ))}
        </div>
      )}
    </div>
  );
}
