"use client";
/** Seat forces in every load case side by side, with each seat's worst case marked (least force or lift-off); collapsed and paginated for large layouts. */
import { useState } from "react";
import type { Report } from "@/lib/engine";
import { FilteredNote, type BodyScope } from "./body-filter";

/** Rows a page of the table shows. */
const PAGE = 50;

export function LoadCaseTable({ report, scope }: { report: Report; scope: BodyScope }) {
  const [page, setPage] = useState(0);
  const cases = report.loadCases.filter((c) => c.seating);
  if (!cases.length) return null;
  const ids = Object.keys(report.seating?.forces ?? cases.find((c) => c.seating?.forces)?.seating?.forces ?? {});
  if (!ids.length && cases.every((c) => !c.seating?.forces)) {
    return <p className="mt-3 text-xs text-severity-error">In every load case the load drives a free motion: no seating forces.</p>;
  }
  const all = report.loadCases.flatMap((c) => (c.seating?.forces ? Object.keys(c.seating.forces) : []));
  const everyContact = [...new Set(all)];
  const contacts = everyContact.filter(scope.contact);
  const worst = (id: string): string | null => {
    let best: { id: string; v: number } | null = null;
    for (const c of cases) {
      const lifted = c.seating!.liftOff.includes(id) || !c.seating!.forces;
      const v = lifted ? -Infinity : c.seating!.forces![id];
      if (!best || v < best.v) best = { id: c.id, v };
    }
    return best?.id ?? null;
  };
  const f = report.units.force;
  const pages = Math.max(1, Math.ceil(contacts.length / PAGE));
  // a page past the end after the filter narrowed the list shows its last page
  const at = Math.min(page, pages - 1);
  const shown = contacts.slice(at * PAGE, (at + 1) * PAGE);
  return (
    <details className="sheet overflow-x-auto p-4" open={contacts.length <= 12} data-testid="load-case-details">
      <summary className="cursor-pointer text-sm font-semibold">
        Seat forces by load case ({contacts.length} contacts × {cases.length} case{cases.length === 1 ? "" : "s"}, {f}; ◀ marks each seat’s worst case)
      </summary>
      <FilteredNote scope={scope} shown={contacts.length} total={everyContact.length} what="contacts" />
      <table className="tbl text-xs" data-testid="load-case-table">
        <thead>
          <tr>
            <th>contact</th>
            {cases.map((c) => (
              <th key={c.id} className="text-right">
                {c.id}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {shown.map((id) => {
            const w = cases.length > 1 ? worst(id) : null;
            return (
              <tr key={id}>
                <td>{id}</td>
                {cases.map((c) => {
                  const lifted = c.seating!.liftOff.includes(id);
                  const v = c.seating!.forces?.[id];
                  return (
                    <td key={c.id} className={`num text-right ${w === c.id ? "font-semibold" : ""}`}>
                      {c.seating!.forces === null ? "not held" : lifted ? "× lifts off" : v === undefined ? "—" : Number(v.toPrecision(4))}
                      {w === c.id ? " ◀" : ""}
                    </td>
                  );
                })}
              </tr>
            );
          })}
        </tbody>
      </table>
      {pages > 1 && (
        <div className="mt-2 flex items-center gap-2 text-xs" data-testid="load-case-pages">
          <button type="button" className="btn-quiet py-0.5" disabled={at === 0} onClick={() => setPage(at - 1)}>
            ← previous
          </button>
          <span className="num">
            contacts {at * PAGE + 1}–{Math.min((at + 1) * PAGE, contacts.length)} of {contacts.length}
          </span>
          <button type="button" className="btn-quiet py-0.5" disabled={at >= pages - 1} onClick={() => setPage(at + 1)}>
            next →
          </button>
        </div>
      )}
    </details>
  );
}
