"use client";
/** The project's materials library: supplier or standard values, each with its source; layouts of the project resolve ids against it before the built-in table. */
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/components/ui/fetch-json";
import { useFormPost } from "@/components/ui/use-form-post";
import { ConfirmButton } from "@/components/ui/confirm-button";
import type { ProjectMaterialDto } from "@/lib/contracts/materials";

const cell = (v: number | null, k = 1) => (v === null ? "—" : String(Number((v * k).toPrecision(4))));
const numberOrNull = (v: FormDataEntryValue | null, k = 1) => {
  const t = String(v ?? "").trim();
  return t === "" ? null : Number(t) * k;
};

export function MaterialsLibrary({ projectId, canEdit }: { projectId: number; canEdit: boolean }) {
  const qc = useQueryClient();
  const key = ["materials", projectId];
  const q = useQuery({ queryKey: key, queryFn: () => fetchJson<{ materials: ProjectMaterialDto[] }>(`/api/projects/${projectId}/materials`) });
  const add = useFormPost<Record<string, unknown>>(`/api/projects/${projectId}/materials`, key);
  const remove = useMutation({
    mutationFn: (id: string) => fetchJson(`/api/projects/${projectId}/materials/${encodeURIComponent(id)}`, { method: "DELETE" }),
    onSettled: () => qc.invalidateQueries({ queryKey: key }),
  });
  const rows = q.data?.materials ?? [];
  return (
    <section className="sheet space-y-3 overflow-x-auto p-4" aria-labelledby="materials-heading" data-testid="materials-library">
      <h2 id="materials-heading" className="text-base">
        Materials library
      </h2>
      <p className="text-xs text-graphite-soft">
        Values this project uses for a material id before the built-in table (a layout&apos;s own <code>materials[]</code> still come first). Each entry names
        its source; uploads keep a copy of the values they were analysed with.
      </p>
      {rows.length === 0 ? (
        <p className="text-sm">No entries: layouts use the built-in table (typical values, to be confirmed with your supplier).</p>
      ) : (
        <table className="tbl text-xs">
          <thead>
            <tr>
              <th>id</th>
              <th className="text-right">E (GPa)</th>
              <th className="text-right">ν</th>
              <th className="text-right">allowable p₀ (MPa)</th>
              <th className="text-right">α (µm/(m·K))</th>
              <th>source</th>
              <th>set by</th>
              {canEdit && <th>Action</th>}
            </tr>
          </thead>
          <tbody>
            {rows.map((m) => (
              <tr key={m.id}>
                <td>
                  <code>{m.id}</code>
                </td>
                <td className="num text-right">{cell(m.youngsModulusGPa)}</td>
                <td className="num text-right">{cell(m.poissonRatio)}</td>
                <td className="num text-right">{cell(m.allowableContactPressureMPa)}</td>
                <td className="num text-right">{cell(m.expansionPerK, 1e6)}</td>
                <td>{m.source}</td>
                <td>
                  {m.setBy ?? "—"} · {m.updatedAt.slice(0, 10)}
                </td>
                {canEdit && (
                  <td>
                    <ConfirmButton
                      label={`Remove ${m.id}`}
                      className="btn-quiet py-0.5 text-xs"
                      title={`Remove ${m.id} from the library?`}
                      confirmLabel="Remove"
                      onConfirm={() => remove.mutate(m.id)}
                    >
                      <p>
                        New uploads will no longer find {m.id} here (the built-in value, if any, applies). Stored revisions keep the values they were analysed
                        with.
                      </p>
                    </ConfirmButton>
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {canEdit && (
        <form
          aria-label="Add or replace a material"
          className="grid gap-2 sm:grid-cols-3 lg:grid-cols-6"
          onSubmit={(e) => {
            e.preventDefault();
            const form = e.currentTarget;
            const d = new FormData(form);
            add.mutation.mutate(
              {
                id: String(d.get("id") ?? ""),
                youngsModulusGPa: numberOrNull(d.get("E")),
                poissonRatio: numberOrNull(d.get("nu")),
                allowableContactPressureMPa: numberOrNull(d.get("p0")),
                expansionPerK: numberOrNull(d.get("alpha"), 1e-6),
                source: String(d.get("source") ?? ""),
              },
              { onSuccess: () => form.reset() },
            );
          }}
        >
          {[
            ["id", "Material id", "text", "id"],
            ["E", "E (GPa)", "number", "youngsModulusGPa"],
            ["nu", "ν", "number", "poissonRatio"],
            ["p0", "Allowable p₀ (MPa)", "number", "allowableContactPressureMPa"],
            ["alpha", "α (µm/(m·K))", "number", "expansionPerK"],
          ].map(([name, label, type, field]) => (
            <div key={name}>
              <label htmlFor={`mat-${name}`} className="label normal-case">
                {label}
              </label>
              <input id={`mat-${name}`} name={name} type={type} step="any" className="field" required={name === "id"} />
              {add.errors[field]?.map((m) => (
                <p key={m} className="text-xs text-severity-error">
                  {m}
                </p>
              ))}
            </div>
          ))}
          <div className="sm:col-span-3 lg:col-span-5">
            <label htmlFor="mat-source" className="label">
              Source (datasheet, standard, test report)
            </label>
            <input id="mat-source" name="source" className="field" required />
            {add.errors.source?.map((m) => (
              <p key={m} className="text-xs text-severity-error">
                {m}
              </p>
            ))}
          </div>
          <div className="flex items-end">
            <button type="submit" className="btn" disabled={add.mutation.isPending}>
              Save material
            </button>
          </div>
        </form>
      )}
      {add.message && (
        <p role="alert" className="text-sm text-severity-error">
          {add.message}
        </p>
      )}
      {remove.isError && (
        <p role="alert" className="text-sm text-severity-error">
          {(remove.error as Error).message}
        </p>
      )}
    </section>
  );
}
