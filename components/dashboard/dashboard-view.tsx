"use client";
/** Dashboard: filters, open findings by project × severity and age, the trend chart, release readiness, CSV export. */
import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { useMemo, useState } from "react";
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { fetchJson } from "@/components/ui/fetch-json";
import type { DashboardDto } from "@/lib/contracts/dashboard";

type SortKey = "project" | "error" | "warning" | "info" | "underWeek" | "underMonth" | "older";

export function DashboardView() {
  const [project, setProject] = useState("");
  const [checker, setChecker] = useState("");
  const [rule, setRule] = useState("");
  const [days, setDays] = useState("60");
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
        <select className="field w-auto py-1 text-xs" aria-label="Project" value={project} onChange={(e) => setProject(e.target.value)}>
          <option value="">all projects</option>
          {q.data?.projects.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
        <select className="field w-auto py-1 text-xs" aria-label="Checker" value={checker} onChange={(e) => setChecker(e.target.value)}>
          <option value="">all checkers</option>
          {q.data?.checkers.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </select>
        <select className="field w-auto py-1 text-xs" aria-label="Rule" value={rule} onChange={(e) => setRule(e.target.value)}>
          <option value="">all rules</option>
          {q.data?.rules.map((r) => (
            <option key={r} value={r}>
              {r}
            </option>
          ))}
        </select>
        <select className="field w-auto py-1 text-xs" aria-label="Trend period" value={days} onChange={(e) => setDays(e.target.value)}>
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
            {(["ready", "blocked"] as const).map((state) => (
              <div key={state} className="sheet p-4">
                <h2 className="text-base">{state === "ready" ? "Ready for release" : "Blocked"}</h2>
                <ul className="mt-2 space-y-2 text-sm" data-testid={`layouts-${state}`}>
                  {q.data.layouts
                    .filter((l) => (state === "ready" ? l.state === "ready" || l.state === "requested" : l.state === "blocked"))
                    .map((l) => (
                      <li key={l.id}>
                        <Link href={`/layouts/${l.id}`}>{l.name}</Link>{" "}
                        <span className="text-xs text-graphite-soft">
                          {l.project} · r{l.revision}
                          {l.state === "requested" ? " · release requested" : ""}
                        </span>
                        {l.blocking.length > 0 && (
                          <ul className="ml-4 list-disc text-xs">
                            {l.blocking.map((b) => (
                              <li key={b.threadId}>
                                <Link href={`/findings/${b.threadId}`}>{b.title}</Link>
                              </li>
                            ))}
                          </ul>
                        )}
                      </li>
                    ))}
                </ul>
              </div>
            ))}
          </section>
        </>
      )}
    </div>
  );
}
