"use client";
/** Revision diff: contacts added, removed and moved; findings new, resolved, changed (before → after) and unchanged. */
import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/components/ui/fetch-json";
import { SeverityBadge } from "@/components/review/badges";
import { LayoutDrawings } from "@/components/layout-views/layout-drawings";
import type { Report } from "@/lib/engine";
import type { Layout, Vec3 } from "@/lib/layout/model";
import { QueryStatus } from "@/components/ui/query-status";

interface Diff {
  from: number;
  to: number;
  contacts: { added: string[]; removed: string[]; moved: { id: string; from: number[]; to: number[]; normalChanged: boolean }[] };
  findings: Record<"new" | "resolved" | "unchanged", { threadId: number; title: string; severity: string }[]> & {
    changed: { threadId: number; title: string; severity: string; before: { title: string; severity: string }; bodyChanged: boolean }[];
  };
}

export function RevisionDiffView({ revisionId, against, layout, report }: { revisionId: number; against: number; layout?: Layout; report?: Report }) {
  const q = useQuery({
    queryKey: ["diff", revisionId, against],
    queryFn: () => fetchJson<{ diff: Diff }>(`/api/revisions/${revisionId}/diff?against=${against}`),
  });
  if (q.isPending || q.isError) return <QueryStatus query={q} loading="Comparing…" />;
  const d = q.data.diff;
  return (
    <div className="space-y-3">
      <div className="grid gap-3 md:grid-cols-2" data-testid="revision-diff">
        <div className="sheet p-3 text-sm">
          <h3 className="mb-2 font-semibold">
            Contacts (r{d.from} → r{d.to})
          </h3>
          <p>Added: {d.contacts.added.length ? d.contacts.added.join(", ") : "none"}</p>
          <p>Removed: {d.contacts.removed.length ? d.contacts.removed.join(", ") : "none"}</p>
          <p>Moved: {d.contacts.moved.length ? d.contacts.moved.map((m) => `${m.id}${m.normalChanged ? " (normal turned)" : ""}`).join(", ") : "none"}</p>
        </div>
        <div className="sheet p-3 text-sm">
          <h3 className="mb-2 font-semibold">Findings</h3>
          <div className="mb-1" data-testid="diff-changed">
            <span className="font-medium">changed:</span> {d.findings.changed.length === 0 && "none"}
            <ul className="ml-4">
              {d.findings.changed.map((f) => (
                <li key={f.threadId}>
                  <SeverityBadge severity={f.severity} /> <Link href={`/findings/${f.threadId}`}>{f.title}</Link>
                  <div className="text-xs text-graphite-soft">
                    {f.before.severity !== f.severity && (
                      <>
                        severity {f.before.severity} → {f.severity}.{" "}
                      </>
                    )}
                    {f.before.title !== f.title && <>was: “{f.before.title}”. </>}
                    {f.before.title === f.title && f.before.severity === f.severity && f.bodyChanged && <>numbers in the finding changed. </>}
                  </div>
                </li>
              ))}
            </ul>
          </div>
          {(["new", "resolved", "unchanged"] as const).map((k) => (
            <div key={k} className="mb-1">
              <span className="font-medium">{k}:</span> {d.findings[k].length === 0 && "none"}
              <ul className="ml-4">
                {d.findings[k].map((f) => (
                  <li key={f.threadId}>
                    <SeverityBadge severity={f.severity} /> <Link href={`/findings/${f.threadId}`}>{f.title}</Link>
                  </li>
                ))}
              </ul>
            </div>
          ))}
        </div>
      </div>
      {layout && report && d.contacts.moved.length > 0 && (
        <div data-testid="diff-drawing">
          <p className="mb-1 text-xs text-graphite-soft">
            Moved contacts: dashed squares mark where they were in r{d.from}; the dotted line leads to r{d.to}.
          </p>
          <LayoutDrawings
            layout={layout}
            report={report}
            emphasis={{ contacts: d.contacts.moved.map((m) => m.id), motions: [] }}
            ghosts={d.contacts.moved.map((m) => ({ id: m.id, point: m.from as Vec3 }))}
          />
        </div>
      )}
    </div>
  );
}
