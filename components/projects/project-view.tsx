"use client";
/** Project page body: layouts table with review state and, for designers, the new-layout form. */
import Link from "next/link";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { fetchJson } from "@/components/ui/fetch-json";
import { useFormPost } from "@/components/ui/use-form-post";
import { LayoutStateBadge } from "./layout-state";
import { RuleOverrides } from "./rule-overrides";
import { MaterialsLibrary } from "./materials-library";
import type { LayoutSummaryDto } from "@/lib/contracts/layouts";
import { QueryStatus } from "@/components/ui/query-status";

type LayoutRow = LayoutSummaryDto;

interface ProjectData {
  project: { id: number; name: string; description: string; checker: { id: number; name: string } | null };
  layouts: LayoutRow[];
  history: { id: number; kind: string; actor: string | null; createdAt: string; detail: { from?: string | null; to?: string | null; why?: string } }[];
}

/** The manager's control to assign or change the project's checker, and the record of earlier assignments. */
function CheckerControl({
  projectId,
  current,
  checkers,
  history,
}: {
  projectId: number;
  current: { id: number; name: string } | null;
  checkers: { id: number; name: string }[];
  history: ProjectData["history"];
}) {
  const qc = useQueryClient();
  const [choice, setChoice] = useState(String(current?.id ?? ""));
  const save = useMutation({
    mutationFn: () => fetchJson(`/api/projects/${projectId}`, { method: "PATCH", body: JSON.stringify({ checkerId: choice ? Number(choice) : null }) }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ["project", projectId] }),
  });
  return (
    <section className="sheet space-y-2 p-4 text-sm" aria-labelledby="checker-heading" data-testid="checker-control">
      <h2 id="checker-heading" className="text-base">
        Checker
      </h2>
      <div className="flex flex-wrap items-end gap-2">
        <div>
          <label htmlFor="checker-select" className="label">
            Checker who approves releases
          </label>
          <select id="checker-select" className="field w-auto" value={choice} onChange={(e) => setChoice(e.target.value)}>
            <option value="">not assigned (any checker)</option>
            {checkers.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </select>
        </div>
        <button type="button" className="btn" disabled={save.isPending || choice === String(current?.id ?? "")} onClick={() => save.mutate()}>
          Save checker
        </button>
      </div>
      {save.isError && (
        <p role="alert" className="text-severity-error">
          {(save.error as Error).message}
        </p>
      )}
      {history.length > 0 && (
        <ol className="text-xs text-graphite-soft" data-testid="checker-history">
          {history.map((h) => (
            <li key={h.id}>
              {h.createdAt.slice(0, 16).replace("T", " ")} UTC · {h.actor ?? "Sixfold"} changed the checker from {h.detail.from ?? "not assigned"} to{" "}
              {h.detail.to ?? "not assigned"}
              {h.detail.why ? ` (${h.detail.why})` : ""}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}

export function ProjectView({
  projectId,
  canCreate,
  canOverride,
  canAssign = false,
  canEditMaterials = false,
  checkers = [],
}: {
  projectId: number;
  canCreate: boolean;
  canOverride: boolean;
  canAssign?: boolean;
  canEditMaterials?: boolean;
  checkers?: { id: number; name: string }[];
}) {
  const q = useQuery({ queryKey: ["project", projectId], queryFn: () => fetchJson<ProjectData>(`/api/projects/${projectId}`) });
  if (q.isPending || q.isError) return <QueryStatus query={q} loading="Loading project…" />;
  const { project, layouts, history } = q.data;
  return (
    <div className="space-y-6">
      <nav className="text-sm text-graphite-soft">
        <Link href="/projects">Projects</Link> / <span>{project.name}</span>
      </nav>
      <div>
        <h1>{project.name}</h1>
        <p className="text-sm text-graphite-soft">{project.description}</p>
        <p className="mt-1 text-xs text-graphite-soft">Checker: {project.checker?.name ?? "not assigned"}</p>
      </div>
      {canAssign && <CheckerControl key={project.checker?.id ?? 0} projectId={projectId} current={project.checker} checkers={checkers} history={history} />}
      {canCreate && <NewLayoutForm projectId={projectId} />}
      {layouts.length === 0 ? (
        <div className="sheet px-6 py-10 text-center" data-testid="layouts-empty">
          <p className="font-medium">No layouts in this project yet.</p>
          <p className="mt-1 text-sm text-graphite-soft">
            {canCreate ? "Add one above, then upload its first revision." : "A designer adds layouts and uploads their revisions."}
          </p>
        </div>
      ) : (
        <div className="sheet overflow-x-auto">
          <table className="tbl" data-testid="layout-table">
            <thead>
              <tr>
                <th>Layout</th>
                <th>State</th>
                <th className="text-right">Revision</th>
                <th className="text-right">Freedoms</th>
                <th className="text-right">Redundancies</th>
                <th className="text-right">Open ■ / ▲ / ●</th>
                <th className="text-right">Waived</th>
              </tr>
            </thead>
            <tbody>
              {layouts.map((l) => (
                <tr key={l.id}>
                  <td>
                    <Link href={`/layouts/${l.id}`} className="font-medium">
                      {l.name}
                    </Link>
                    <div className="text-xs text-graphite-soft">{l.description}</div>
                  </td>
                  <td>
                    <LayoutStateBadge state={l} />
                  </td>
                  <td className="num text-right">{l.latestRevision ? `r${l.latestRevision.number}` : "—"}</td>
                  <td className="num text-right">{l.latestRevision?.freedoms ?? "—"}</td>
                  <td className="num text-right">{l.latestRevision?.redundancies ?? "—"}</td>
                  <td className="num text-right">
                    {l.openErrors} / {l.openWarnings} / {l.openInfos}
                  </td>
                  <td className="num text-right">{l.waived}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="px-3 pb-2 pt-1 text-xs text-graphite-soft" data-testid="state-legend">
            Open findings: ■ errors / ▲ warnings / ● notes (info). State: ◇ release requested, ◆ released.
          </p>
        </div>
      )}
      <RuleOverrides projectId={projectId} canChange={canOverride} />
      <MaterialsLibrary projectId={projectId} canEdit={canEditMaterials} />
    </div>
  );
}

function NewLayoutForm({ projectId }: { projectId: number }) {
  const { mutation: m, errors, message } = useFormPost<{ name: string; description: string }>(`/api/projects/${projectId}/layouts`, ["project", projectId]);
  return (
    <form
      aria-label="New layout"
      className="sheet grid gap-4 p-4 md:grid-cols-[2fr_3fr_auto] md:items-start"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        const form = e.currentTarget;
        const d = new FormData(form);
        m.mutate({ name: String(d.get("name") ?? ""), description: String(d.get("description") ?? "") }, { onSuccess: () => form.reset() });
      }}
    >
      <div>
        <label htmlFor="layout-name" className="label">
          Layout name
        </label>
        <input id="layout-name" name="name" className="field" aria-invalid={!!errors.name} />
        {errors.name && (
          <p className="field-error" id="layout-name-error">
            {errors.name.join(" ")}
          </p>
        )}
      </div>
      <div>
        <label htmlFor="layout-description" className="label">
          Description
        </label>
        <input id="layout-description" name="description" className="field" />
      </div>
      <div className="md:pt-5">
        <button className="btn" type="submit" disabled={m.isPending}>
          {m.isPending ? "Adding…" : "Add layout"}
        </button>
      </div>
      {message && !Object.keys(errors).length && (
        <p role="alert" className="field-error md:col-span-3">
          {message}
        </p>
      )}
    </form>
  );
}
