"use client";
/** A small sortable table: click a header to sort by it (again to reverse); numbers sort as numbers. */
import { useState, type ReactNode } from "react";

export interface Column<R> {
  key: string;
  label: string;
  /** value to sort by */
  sort: (row: R) => number | string;
  render: (row: R) => ReactNode;
  numeric?: boolean;
}

export function SortableTable<R>({
  rows,
  columns,
  rowKey,
  testId,
  initial,
}: {
  rows: R[];
  columns: Column<R>[];
  rowKey: (r: R) => string;
  testId?: string;
  initial?: { key: string; desc?: boolean };
}) {
  const [by, setBy] = useState<{ key: string; desc: boolean }>({ key: initial?.key ?? columns[0].key, desc: initial?.desc ?? false });
  const col = columns.find((c) => c.key === by.key) ?? columns[0];
  const sorted = rows.slice().sort((a, b) => {
    const x = col.sort(a);
    const y = col.sort(b);
    const d = typeof x === "number" && typeof y === "number" ? x - y : String(x).localeCompare(String(y));
    return by.desc ? -d : d;
  });
  return (
    <table className="tbl text-xs" data-testid={testId}>
      <thead>
        <tr>
          {columns.map((c) => (
            <th key={c.key} className={c.numeric ? "text-right" : undefined} aria-sort={by.key === c.key ? (by.desc ? "descending" : "ascending") : "none"}>
              <button type="button" className="normal-case" onClick={() => setBy((s) => ({ key: c.key, desc: s.key === c.key ? !s.desc : false }))}>
                {c.label}
                {by.key === c.key ? (by.desc ? " ▾" : " ▴") : ""}
              </button>
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {sorted.map((r) => (
          <tr key={rowKey(r)}>
            {columns.map((c) => (
              <td key={c.key} className={c.numeric ? "num text-right" : undefined}>
                {c.render(r)}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
