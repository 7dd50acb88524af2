"use client";
/** Project list from GET /api/projects with react-query, and the manager's create form. */
import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/components/ui/fetch-json";
import { useFormPost } from "@/components/ui/use-form-post";
import type { ProjectDto } from "@/lib/contracts/projects";

type Project = ProjectDto;

export function ProjectsView({ canCreate, checkers }: { canCreate: boolean; checkers: { id: number; name: string }[] }) {
  const query = useQuery({
    queryKey: ["projects"],
    queryFn: () => fetchJson<{ projects: Project[] }>("/api/projects"),
  });

  return (
    <div className="space-y-8">
      <div className="flex items-end justify-between">
        <div>
          <h1>Projects</h1>
          <p className="text-sm text-graphite-soft">Each project holds mount layouts under review.</p>
        </div>
      </div>

      {canCreate && <CreateProjectForm checkers={checkers} />}

      <section aria-labelledby="project-list" className="space-y-3">
        <h2 id="project-list" className="sr-only">
          Project list
        </h2>
        {query.isPending && (
          <p className="text-sm text-graphite-soft" role="status">
            Loading projects…
          </p>
        )}
        {query.isError && (
          <p role="alert" className="text-sm text-severity-error">
            Projects could not be loaded: {(query.error as Error).message}
          </p>
        )}
        {query.data && query.data.projects.length === 0 && (
          <div className="sheet px-6 py-10 text-center" data-testid="projects-empty">
            <p className="font-medium">No projects yet.</p>
            <p className="mt-1 text-sm text-graphite-soft">
              {canCreate
                ? "Create the first one above; designers can then add mount layouts to it."
                : "A manager creates projects; ask yours to set one up for your mount."}
            </p>
          </div>
        )}
        {query.data && query.data.projects.length > 0 && (
          <ul className="grid gap-3 md:grid-cols-2" data-testid="project-list">
            {query.data.projects.map((p) => (
              <li key={p.id} className="sheet p-4">
                <a href={`/projects/${p.id}`} className="font-medium">
                  {p.name}
                </a>
                {p.description && <p className="mt-1 text-sm text-graphite-soft">{p.description}</p>}
                <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-3 text-xs text-graphite-soft">
                  <dt>Layouts</dt>
                  <dd className="num" data-testid="project-layouts">
                    {p.layouts}
                  </dd>
                  <dt>Open findings</dt>
                  <dd className="num" data-testid="project-open">
                    {p.openFindings}
                  </dd>
                  <dt>Checker</dt>
                  <dd>{p.checker?.name ?? "not assigned"}</dd>
                  <dt>Created</dt>
                  <dd className="num">{new Date(p.createdAt).toISOString().slice(0, 10)}</dd>
                </dl>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

function CreateProjectForm({ checkers }: { checkers: { id: number; name: string }[] }) {
  const {
    mutation,
    errors: fieldErrors,
    message,
  } = useFormPost<{ name: string; description: string; checkerId: number | null }>("/api/projects", ["projects"]);

  function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = new FormData(form);
    const checker = String(data.get("checkerId") ?? "");
    mutation.mutate(
      { name: String(data.get("name") ?? ""), description: String(data.get("description") ?? ""), checkerId: checker ? Number(checker) : null },
      { onSuccess: () => form.reset() },
    );
  }

  return (
    <form onSubmit={onSubmit} className="sheet grid gap-4 p-4 md:grid-cols-[2fr_3fr_1.5fr_auto] md:items-start" aria-label="New project" noValidate>
      <div>
        <label htmlFor="project-name" className="label">
          Name
        </label>
        <input id="project-name" name="name" className="field" aria-invalid={!!fieldErrors.name} aria-describedby="project-name-error" />
        {fieldErrors.name && (
          <p id="project-name-error" className="field-error">
            {fieldErrors.name.join(" ")}
          </p>
        )}
      </div>
      <div>
        <label htmlFor="project-description" className="label">
          Description
        </label>
        <input id="project-description" name="description" className="field" aria-invalid={!!fieldErrors.description} />
        {fieldErrors.description && <p className="field-error">{fieldErrors.description.join(" ")}</p>}
      </div>
      <div>
        <label htmlFor="project-checker" className="label">
          Checker
        </label>
        <select id="project-checker" name="checkerId" className="field" defaultValue="">
          <option value="">not assigned</option>
          {checkers.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </select>
        {fieldErrors.checkerId && <p className="field-error">{fieldErrors.checkerId.join(" ")}</p>}
      </div>
      <div className="md:pt-5">
        <button type="submit" className="btn" disabled={mutation.isPending}>
          {mutation.isPending ? "Creating…" : "Create project"}
        </button>
      </div>
      {message && Object.keys(fieldErrors).length === 0 && (
        <p role="alert" className="field-error md:col-span-4">
          {message}
        </p>
      )}
    </form>
  );
}
