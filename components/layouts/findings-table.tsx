"use client";
/**
 * The findings table of a revision: sortable columns, filters by severity, status and rule, and search;
 * paginated (50 a page) so a whole instrument's hundreds of findings do not stall the page.
 */
import Link from "next/link";
import { useMemo, useState } from "react";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { SeverityBadge, StatusBadge } from "@/components/review/badges";
import type { Severity } from "@/lib/contracts/enums";

export interface FindingRow {
  id: number;
  threadId: number;
  rule: string;
  severity: Severity;
  title: string;
  status: string;
  loadCase: string | null;
  contacts: string[];
  comments: number;
}

const sevRank = { error: 0, warning: 1, info: 2 } as const;
/** Findings a page of the table shows. */
const PAGE = 50;
const col = createColumnHelper<FindingRow>();

export function FindingsTable({ findings }: { findings: FindingRow[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "severity", desc: false }]);
  const [severity, setSeverity] = useState("");
  const [status, setStatus] = useState("");
  const [rule, setRule] = useState("");
  const [search, setSearch] = useState("");
  const data = useMemo(
    () =>
      findings.filter(
        (f) =>
          (!severity || f.severity === severity) &&
          (!status || f.status === status) &&
          (!rule || f.rule === rule) &&
          (!search || `${f.title} ${f.rule} ${f.contacts.join(" ")} ${f.loadCase ?? ""}`.toLowerCase().includes(search.toLowerCase())),
      ),
    [findings, severity, status, rule, search],
  );
  const columns = useMemo(
    () => [
      col.accessor("severity", {
        header: "Severity",
        cell: (c) => <SeverityBadge severity={c.getValue()} />,
        sortingFn: (a, b) => sevRank[a.original.severity] - sevRank[b.original.severity],
      }),
      col.accessor("rule", { header: "Rule", cell: (c) => <code className="text-xs">{c.getValue()}</code> }),
      col.accessor("title", { header: "Finding", cell: (c) => <Link href={`/findings/${c.row.original.threadId}`}>{c.getValue()}</Link> }),
      col.accessor("status", { header: "Status", cell: (c) => <StatusBadge status={c.getValue()} /> }),
      col.accessor("loadCase", { header: "Load case", cell: (c) => c.getValue() ?? "—" }),
      col.accessor("comments", { header: "Comments", cell: (c) => <span className="num">{c.getValue()}</span> }),
    ],
    [],
  );
  const table = useReactTable({
    data,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageIndex: 0, pageSize: PAGE } },
  });
  const { pageIndex } = table.getState().pagination;
  const pages = table.getPageCount();
  const rules = [...new Set(findings.map((f) => f.rule))].sort();

  return (
    <section className="space-y-3" aria-labelledby="findings-heading">
      <div className="flex flex-wrap items-end gap-3">
        <h2 id="findings-heading" className="mr-auto">
          Findings{" "}
          <span className="num text-graphite-soft">
            ({data.length} of {findings.length})
          </span>
        </h2>
        <select className="field w-auto py-1 text-xs" aria-label="Filter by severity" value={severity} onChange={(e) => setSeverity(e.target.value)}>
          <option value="">all severities</option>
          {["error", "warning", "info"].map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </select>
        <select className="field w-auto py-1 text-xs" aria-label="Filter by status" value={status} onChange={(e) => setStatus(e.target.value)}>
          <option value="">all states</option>
          {["open", "reopened", "waived", "resolved"].map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </select>
        <select className="field w-auto py-1 text-xs" aria-label="Filter by rule" value={rule} onChange={(e) => setRule(e.target.value)}>
          <option value="">all rules</option>
          {rules.map((r) => (
            <option key={r} value={r}>
              {r}
            </option>
          ))}
        </select>
        <input
          className="field w-48 py-1 text-xs"
          type="search"
          placeholder="Search findings, contacts…"
          aria-label="Search findings"
          value={search}
          onChange={(e) => setSearch(e.target.value)}
        />
      </div>
      {findings.length === 0 ? (
        <div className="sheet px-6 py-8 text-center text-sm" data-testid="no-findings">
          No findings: every rule passed on this revision.
        </div>
      ) : (
        <div className="sheet overflow-x-auto">
          <table className="tbl" data-testid="findings-table">
            <thead>
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id}>
                  {hg.headers.map((h) => (
                    <th key={h.id} aria-sort={h.column.getIsSorted() === "asc" ? "ascending" : h.column.getIsSorted() === "desc" ? "descending" : "none"}>
                      <button type="button" className="uppercase tracking-wider" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        {{ asc: " ↑", desc: " ↓" }[h.column.getIsSorted() as string] ?? " ↕"}
                      </button>
                    </th>
                  ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((r) => (
                <tr key={r.id} data-rule={r.original.rule}>
                  {r.getVisibleCells().map((c) => (
                    <td key={c.id}>{flexRender(c.column.columnDef.cell, c.getContext())}</td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
          {pages > 1 && (
            <div className="flex flex-wrap items-center gap-2 border-t border-paper-line px-3 py-2 text-xs" data-testid="findings-pages">
              <button type="button" className="btn-quiet py-0.5" disabled={!table.getCanPreviousPage()} onClick={() => table.previousPage()}>
                ← previous
              </button>
              <span className="num">
                findings {pageIndex * PAGE + 1}–{Math.min((pageIndex + 1) * PAGE, data.length)} of {data.length} (page {pageIndex + 1} of {pages})
              </span>
              <button type="button" className="btn-quiet py-0.5" disabled={!table.getCanNextPage()} onClick={() => table.nextPage()}>
                next →
              </button>
            </div>
          )}
        </div>
      )}
    </section>
  );
}
