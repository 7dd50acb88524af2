"use client";
/** Layout page body: header and state, revisions timeline, summary, upload, findings, diff, release, history. */
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useMemo, useState } from "react";
import { fetchJson } from "@/components/ui/fetch-json";
import { LayoutStateBadge } from "@/components/projects/layout-state";
import { FindingsTable, type FindingRow } from "./findings-table";
import { UploadPanel } from "./upload-panel";
import { RevisionDiffView } from "./revision-diff";
import { LoadCaseTable } from "./load-case-table";
import { FlexurePanel, RepeatabilityPanel, ThermalPanel } from "./service-panels";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { summariseLoadCases } from "@/lib/report/load-case-summary";
import { LayoutDrawings } from "@/components/layout-views/layout-drawings";
import { BodyFilter, bodyScope } from "./body-filter";
import type { Report } from "@/lib/engine";
import type { Layout } from "@/lib/layout/model";
import type { RevisionSummaryDto } from "@/lib/contracts/revisions";
import { QueryStatus } from "@/components/ui/query-status";

type RevisionSummary = RevisionSummaryDto;

interface LayoutData {
  layout: {
    id: number;
    name: string;
    description: string;
    projectId: number;
    projectName: string;
    revisions: number;
    openErrors: number;
    released: boolean;
    releaseRequested: boolean;
  };
  revisions: RevisionSummary[];
  history: { id: number; kind: string; actor: string | null; createdAt: string; detail: Record<string, unknown>; threadId: number | null }[];
}

interface RevisionData {
  revision: RevisionSummary & { report: Report; layout: Layout; findings: FindingRow[] };
  blocking: { threadId: number; title: string }[];
}

const fmt = (iso: string) => iso.slice(0, 16).replace("T", " ");
/** Above this many contacts the drawings wait for a click (the findings come first). */
const LARGE_DRAWING = 1500;

export function LayoutView({
  layoutId,
  initialRevision,
  can,
}: {
  layoutId: number;
  initialRevision: number | null;
  can: { upload: boolean; requestRelease: boolean; approveRelease: boolean };
}) {
  const qc = useQueryClient();
  const router = useRouter();
  const lq = useQuery({ queryKey: ["layout", layoutId], queryFn: () => fetchJson<LayoutData>(`/api/layouts/${layoutId}`) });
  const [selected, setSelected] = useState<number | null>(initialRevision);
  const [compareWith, setCompareWith] = useState<number | null>(null);
  const [drawLarge, setDrawLarge] = useState(false);
  // the body filter lives in the address (?body=…) so a link shows the same narrowed page
  const params = useSearchParams();
  const pathname = usePathname();
  const body = params.get("body") ?? "";
  const setBody = (b: string) => {
    const next = new URLSearchParams(params.toString());
    if (b) next.set("body", b);
    else next.delete("body");
    router.replace(`${pathname}${next.size ? `?${next}` : ""}`, { scroll: false });
  };
  const revisions = useMemo(() => lq.data?.revisions ?? [], [lq.data]);
  const latest = revisions[revisions.length - 1];
  const current = selected ?? latest?.id ?? null;
  useEffect(() => {
    if (current && revisions.length > 1 && compareWith === null) {
      const idx = revisions.findIndex((r) => r.id === current);
      if (idx > 0) setCompareWith(revisions[idx - 1].id);
    }
  }, [current, revisions, compareWith]);
  const rq = useQuery({ queryKey: ["revision", current], enabled: !!current, queryFn: () => fetchJson<RevisionData>(`/api/revisions/${current}`) });

  const release = useMutation({
    mutationFn: (action: "request" | "withdraw" | "approve") =>
      fetchJson(`/api/revisions/${current}/release`, { method: "POST", body: JSON.stringify({ action }) }),
    onSettled: () => Promise.all([qc.invalidateQueries({ queryKey: ["layout", layoutId] }), qc.invalidateQueries({ queryKey: ["revision", current] })]),
  });

  if (lq.isPending || lq.isError) return <QueryStatus query={lq} loading="Loading layout…" />;
  const { layout, history } = lq.data;
  const rev = rq.data?.revision;
  const isLatest = rev && latest && rev.id === latest.id;
  const L = rev?.report.units.length === "um" ? "µm" : rev?.report.units.length;
  const seatingSummary = rev ? summariseLoadCases(rev.report) : null;
  const shownBody = rev && rev.layout.bodies.some((b) => b.id === body) ? body : "";
  const scope = rev ? bodyScope(rev.layout, shownBody) : null;

  return (
    <div className="space-y-6">
      <nav className="text-sm text-graphite-soft">
        <Link href="/projects">Projects</Link> / <Link href={`/projects/${layout.projectId}`}>{layout.projectName}</Link> / <span>{layout.name}</span>
      </nav>
      <div className="flex flex-wrap items-start gap-4">
        <div className="mr-auto">
          <h1>{layout.name}</h1>
          <p className="text-sm text-graphite-soft">{layout.description}</p>
        </div>
        <LayoutStateBadge state={layout} />
      </div>

      {revisions.length > 0 && (
        <section aria-labelledby="timeline-heading" className="space-y-2">
          <h2 id="timeline-heading" className="text-base">
            Revisions
          </h2>
          <ol className="flex flex-wrap gap-2" data-testid="revision-timeline">
            {revisions.map((r) => (
              <li key={r.id}>
                <button
                  type="button"
                  onClick={() => {
                    setSelected(r.id);
                    setCompareWith(null);
                    router.replace(`/layouts/${layoutId}?revision=${r.id}`);
                  }}
                  className={`sheet px-3 py-2 text-left text-xs ${r.id === current ? "border-teal ring-1 ring-teal" : ""}`}
                  aria-current={r.id === current ? "true" : undefined}
                >
                  <div className="font-semibold">
                    r{r.number} {r.release?.approvedAt ? "◆ released" : r.release ? "◇ release requested" : ""}
                  </div>
                  <div className="text-graphite-soft">
                    {fmt(r.createdAt)} UTC · {r.uploadedBy}
                  </div>
                  <div className="num">
                    {r.counts.freedoms} free · {r.counts.redundancies} redundant
                  </div>
                </button>
              </li>
            ))}
          </ol>
        </section>
      )}

      {can.upload && !layout.released && (
        <UploadPanel
          layoutId={layoutId}
          onUploaded={(id) => {
            setSelected(id);
            setCompareWith(null);
            void qc.invalidateQueries({ queryKey: ["layout", layoutId] });
            router.replace(`/layouts/${layoutId}?revision=${id}`);
          }}
        />
      )}
      {can.upload && layout.released && (
        <div className="sheet space-y-2 p-4 text-sm">
          <p>The newest revision is released and read-only; a new upload starts the next revision.</p>
          <UploadPanel
            layoutId={layoutId}
            onUploaded={(id) => {
              setSelected(id);
              void qc.invalidateQueries({ queryKey: ["layout", layoutId] });
            }}
          />
        </div>
      )}

      {revisions.length === 0 && (
        <div className="sheet px-6 py-10 text-center text-sm" data-testid="no-revisions">
          No revision yet. {can.upload ? "Upload the layout exported from CAD to start the review." : "The designer has not uploaded a file yet."} See the{" "}
          <Link href="/help/format">exchange format</Link>.
        </div>
      )}

      {rq.isPending && current && (
        <p role="status" className="text-sm text-graphite-soft">
          Loading revision…
        </p>
      )}
      {rev && (
        <>
          <section aria-labelledby="summary-heading" className="sheet p-4">
            <div className="mb-3 flex flex-wrap items-baseline gap-3">
              <h2 id="summary-heading" className="text-base">
                Revision {rev.number}
              </h2>
              <span className="text-xs text-graphite-soft">
                {rev.fileName} · {rev.encoding.toUpperCase()} · {fmt(rev.createdAt)} UTC · {rev.uploadedBy}
              </span>
              <Link className="ml-auto text-xs" href={`/layouts/${layoutId}/print?revision=${rev.id}`}>
                Printable report
              </Link>
              <a className="text-xs" href={`/api/revisions/${rev.id}/report?format=md`}>
                Report (markdown)
              </a>
              <a className="text-xs" href={`/api/revisions/${rev.id}/report?format=pdf`}>
                Report (PDF)
              </a>
            </div>
            <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-4 lg:grid-cols-8" data-testid="summary">
              {[
                ["bodies", rev.report.counts.bodies],
                ["contacts", rev.report.counts.contacts],
                ["rank", rev.report.counts.rank],
                ["freedoms", rev.report.counts.freedoms],
                ["redundancies", rev.report.counts.redundancies],
                ["6N − m", rev.report.counts.grubler],
                ["conditioning", rev.report.conditioning.toPrecision(3)],
                ["char. length", `${Number(rev.report.scaling.length.toPrecision(4))} ${L}`],
              ].map(([k, v]) => (
                <div key={k as string}>
                  <dt className="text-xs tracking-wide text-graphite-soft">{k}</dt>
                  <dd className="num text-lg">{v}</dd>
                </div>
              ))}
            </dl>
            {seatingSummary && (
              <p
                className={`mt-3 text-xs ${seatingSummary.notHeld.length || seatingSummary.liftOff.length ? "text-severity-error" : "text-graphite-soft"}`}
                data-testid="seating-summary"
              >
                {seatingSummary.text} Stiffness: {rev.report.loadCases.find((c) => c.seating)?.seating?.stiffness}.
                {rev.report.foundation
                  ? ` Foundation coupling ${Number(rev.report.foundation.maxPerMicrometre.toPrecision(4))} ${rev.report.units.force} per µm.`
                  : ""}
              </p>
            )}
            {Object.keys(rev.overrides ?? {}).length > 0 && (
              <p className="mt-3 text-xs" data-testid="revision-overrides">
                Analysed with the project&apos;s rule overrides:{" "}
                {Object.entries(rev.overrides).map(([rule, o], i) => (
                  <span key={rule}>
                    {i > 0 && "; "}
                    <code>{rule}</code>
                    {o.severity ? ` → ${o.severity}` : ""}
                    {o.options
                      ? ` (${Object.entries(o.options)
                          .map(([k, v]) => `${k} = ${JSON.stringify(v)}`)
                          .join(", ")})`
                      : ""}
                  </span>
                ))}{" "}
                (<Link href={`/projects/${layout.projectId}#rule-overrides`}>why, and who set them</Link>)
              </p>
            )}
          </section>

          {/* a reviewer's order: summary, findings, drawings, then the detail tables */}
          <FindingsTable findings={rev.findings} />

          <BodyFilter layout={rev.layout} value={shownBody} onChange={setBody} />
          {rev.report.counts.contacts > LARGE_DRAWING && !drawLarge ? (
            // a whole instrument's four views are tens of thousands of elements: drawn when asked, so the
            // summary and findings come up at once
            <section className="sheet flex flex-wrap items-center gap-3 p-4 text-sm" data-testid="drawings-deferred">
              <span>
                Drawings of {rev.report.counts.contacts.toLocaleString("en")} contacts on {rev.report.counts.bodies} bodies: the four views take a few seconds
                to draw.
              </span>
              <button type="button" className="btn" onClick={() => setDrawLarge(true)}>
                Draw the four views
              </button>
            </section>
          ) : (
            <LayoutDrawings layout={rev.layout} report={rev.report} focusBody={shownBody} onFocusBody={setBody} />
          )}

          <LoadCaseTable report={rev.report} scope={scope!} />
          <FlexurePanel layout={rev.layout} scope={scope!} />
          <ThermalPanel layout={rev.layout} report={rev.report} scope={scope!} />
          <RepeatabilityPanel layout={rev.layout} report={rev.report} scope={scope!} />

          <section className="sheet space-y-2 p-4" aria-labelledby="release-heading">
            <h2 id="release-heading" className="text-base">
              Release
            </h2>
            {rev.release?.approvedAt ? (
              <p className="text-sm" data-testid="release-state">
                ◆ Released by {rev.release.approvedBy} on {fmt(rev.release.approvedAt)} UTC (requested by {rev.release.requestedBy}). This revision is
                read-only.
              </p>
            ) : rev.release ? (
              <p className="text-sm" data-testid="release-state">
                ◇ Release requested by {rev.release.requestedBy} on {fmt(rev.release.requestedAt)} UTC.
              </p>
            ) : (
              <p className="text-sm" data-testid="release-state">
                Not requested.
              </p>
            )}
            {rq.data!.blocking.length > 0 && !rev.release?.approvedAt && (
              <div className="text-sm">
                Blocking release ({rq.data!.blocking.length} open error{rq.data!.blocking.length === 1 ? "" : "s"}):
                <ul className="ml-5 list-disc">
                  {rq.data!.blocking.map((b) => (
                    <li key={b.threadId}>
                      <Link href={`/findings/${b.threadId}`}>{b.title}</Link>
                    </li>
                  ))}
                </ul>
              </div>
            )}
            <div className="flex gap-2">
              {can.requestRelease && isLatest && !rev.release && (
                <ConfirmButton
                  label={`Request release of r${rev.number}`}
                  title={`Request release of revision ${rev.number}?`}
                  confirmLabel="Request release"
                  disabled={release.isPending}
                  onConfirm={() => release.mutate("request")}
                >
                  <p>The project&apos;s checker is asked to approve revision {rev.number} as it stands. You can withdraw the request until it is approved.</p>
                </ConfirmButton>
              )}
              {can.requestRelease && isLatest && rev.release && !rev.release.approvedAt && (
                <ConfirmButton
                  label="Withdraw release request"
                  className="btn-quiet"
                  title={`Withdraw the release request of revision ${rev.number}?`}
                  confirmLabel="Withdraw request"
                  disabled={release.isPending}
                  onConfirm={() => release.mutate("withdraw")}
                >
                  <p>The checker will no longer be asked to approve this revision. You can request release again later.</p>
                </ConfirmButton>
              )}
              {can.approveRelease && isLatest && rev.release && !rev.release.approvedAt && (
                <ConfirmButton
                  label={`Approve release of r${rev.number}`}
                  title={`Release revision ${rev.number}?`}
                  confirmLabel="Approve and release"
                  disabled={release.isPending || rq.data!.blocking.length > 0}
                  buttonTitle={rq.data!.blocking.length ? "Open error findings block the release" : undefined}
                  onConfirm={() => release.mutate("approve")}
                >
                  <p>
                    Releasing is final: revision {rev.number} becomes read-only, its threads close to new comments, and the release report is filed with your
                    name and today&apos;s date.
                  </p>
                  <p>
                    Findings: {rev.findings.length}, of which waived: {rev.findings.filter((f) => f.status === "waived").length}.
                  </p>
                </ConfirmButton>
              )}
            </div>
            {release.isError && (
              <p role="alert" className="text-sm text-severity-error">
                {(release.error as Error).message}
              </p>
            )}
          </section>

          {revisions.length > 1 && (
            <section className="space-y-2" aria-labelledby="diff-heading">
              <div className="flex flex-wrap items-center gap-3">
                <h2 id="diff-heading" className="text-base">
                  What changed
                </h2>
                <label className="text-xs">
                  compare r{rev.number} with{" "}
                  <select
                    className="field inline w-auto py-1 text-xs"
                    value={compareWith ?? ""}
                    onChange={(e) => setCompareWith(Number(e.target.value) || null)}
                    aria-label="Compare with revision"
                  >
                    <option value="">—</option>
                    {revisions
                      .filter((r) => r.id !== rev.id)
                      .map((r) => (
                        <option key={r.id} value={r.id}>
                          r{r.number}
                        </option>
                      ))}
                  </select>
                </label>
              </div>
              {compareWith && <RevisionDiffView revisionId={rev.id} against={compareWith} layout={rev.layout} report={rev.report} />}
            </section>
          )}
        </>
      )}

      <section aria-labelledby="history-heading" className="space-y-2">
        <h2 id="history-heading" className="text-base">
          History
        </h2>
        <ol className="sheet divide-y divide-paper-line text-xs" data-testid="history">
          {history
            .slice()
            .reverse()
            .slice(0, 60)
            .map((e) => (
              <li key={e.id} className="flex gap-3 px-3 py-1.5">
                <span className="num w-36 shrink-0 text-graphite-soft">{fmt(e.createdAt)}</span>
                <span className="w-28 shrink-0 font-medium">{e.kind}</span>
                <span>
                  {e.actor ?? "Sixfold"} {describeEvent(e)}
                  {e.threadId ? (
                    <>
                      {" "}
                      · <Link href={`/findings/${e.threadId}`}>finding</Link>
                    </>
                  ) : null}
                </span>
              </li>
            ))}
        </ol>
      </section>
    </div>
  );
}

function describeEvent(e: { kind: string; detail: Record<string, unknown> }): string {
  const d = e.detail;
  switch (e.kind) {
    case "upload":
      return `uploaded revision ${d.number} (${d.fileName}), ${d.findings} findings`;
    case "upload-refused":
      return `tried ${d.fileName}: refused with ${d.errors} errors`;
    case "open":
      return `opened "${d.title}"`;
    case "resolve":
      return `resolved (${d.reason})`;
    case "reopen":
      return d.reason ? `reopened (${d.reason})` : "reopened";
    case "waive":
      return `waived: ${d.reason}`;
    case "comment":
      return "commented";
    case "comment-edit":
      return "edited a comment";
    case "release-request":
      return `requested release of revision ${d.number}`;
    case "release-withdraw":
      return `withdrew the release request of revision ${d.number}`;
    case "release":
      return `released revision ${d.number}`;
    default:
      return "";
  }
}
