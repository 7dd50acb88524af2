"use client";
/** Project page body: layouts table with review state and, for designers, the new-layout form. */
import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/components/ui/fetch-json";
import { useFormPost } from "@/components/ui/use-form-post";
import { LayoutStateBadge } from "./layout-state";
import { RuleOverrides } from "./rule-overrides";
import type { LayoutSummaryDto } from "@/lib/db/layouts";

type LayoutRow = LayoutSummaryDto;

interface ProjectData {
  project: { id: number; name: string; description: string; checker: { name: string } | null };
  layouts: LayoutRow[];
}

export function ProjectView({ projectId, canCreate, canOverride }: { projectId: number; canCreate: boolean; canOverride: boolean }) {
  const q = useQuery({ queryKey: ["project", projectId], queryFn: () => fetchJson<ProjectData>(`/api/projects/${projectId}`) });
  if (q.isPending) return <p role="status" className="text-sm text-graphite-soft">Loading project…</p>;
  if (q.isError) return <p role="alert" className="text-sm text-severity-error">{(q.error as Error).message}</p>;
  const { project, layouts } = q.data;
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
      {canCreate && <NewLayoutForm projectId={projectId} />}
      {layouts.length === 0 ? (
        <div className="sheet px-6 py-10 text-center" data-testid="layouts-empty">
          <p className="font-medium">No layouts in this project yet.</p>
          <p className="mt-1 text-sm text-graphite-soft">{canCreate ? "Add one above, then upload its first revision." : "A designer adds layouts and uploads their revisions."}</p>
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
                    <Link href={`/layouts/${l.id}`} className="font-medium">{l.name}</Link>
                    <div className="text-xs text-graphite-soft">{l.description}</div>
                  </td>
                  <td><LayoutStateBadge state={l} /></td>
                  <td className="num text-right">{l.latestRevision ? `r${l.latestRevision.number}` : "—"}</td>
                  <td className="num text-right">{l.latestRevision?.freedoms ?? "—"}</td>
                  <td className="num text-right">{l.latestRevision?.redundancies ?? "—"}</td>
                  <td className="num text-right">{l.openErrors} / {l.openWarnings} / {l.openInfos}</td>
                  <td className="num text-right">{l.waived}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <RuleOverrides projectId={projectId} canChange={canOverride} />
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
        <label htmlFor="layout-name" className="label">Layout name</label>
        <input id="layout-name" name="name" className="field" aria-invalid={!!errors.name} />
        {errors.name && <p className="field-error" id="layout-name-error">{errors.name.join(" ")}</p>}
      </div>
      <div>
        <label htmlFor="layout-description" className="label">Description</label>
        <input id="layout-description" name="description" className="field" />
      </div>
      <div className="md:pt-5">
        <button className="btn" type="submit" disabled={m.isPending}>{m.isPending ? "Adding…" : "Add layout"}</button>
      </div>
      {message && !Object.keys(errors).length && <p role="alert" className="field-error md:col-span-3">{message}</p>}
    </form>
  );
}
