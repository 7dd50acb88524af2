"use client";
/**
 * Project rule overrides: the overrides in force (severity and options per rule, with reason, who and when),
 * their history, and for administrators the form that sets or clears one. Later uploads in the project are
 * analysed with them; revisions already stored keep the overrides they were analysed with.
 */
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { fetchJson } from "@/components/ui/fetch-json";
import { useFormPost } from "@/components/ui/use-form-post";
import { SeverityBadge } from "@/components/review/badges";
import type { OverrideDto } from "@/lib/contracts/overrides";
import type { Severity } from "@/lib/contracts/enums";

interface OverridesData {
  current: OverrideDto[];
  history: OverrideDto[];
  rules: { id: string; severity: Severity; summary: string; defaults: Record<string, unknown> }[];
}

const fmt = (iso: string) => iso.slice(0, 16).replace("T", " ");
const optionText = (o: Record<string, unknown> | null) =>
  o
    ? Object.entries(o)
        .map(([k, v]) => `${k} = ${JSON.stringify(v)}`)
        .join(", ")
    : "—";

export function RuleOverrides({ projectId, canChange }: { projectId: number; canChange: boolean }) {
  const q = useQuery({ queryKey: ["overrides", projectId], queryFn: () => fetchJson<OverridesData>(`/api/projects/${projectId}/overrides`) });
  return (
    <section id="rule-overrides" aria-labelledby="overrides-heading" className="sheet space-y-3 p-4">
      <div>
        <h2 id="overrides-heading" className="text-base">
          Rule overrides
        </h2>
        <p className="text-xs text-graphite-soft">
          Severity or options changed for this project. Uploads from now on are analysed with them; stored revisions keep what they were analysed with.
        </p>
      </div>
      {q.isPending && (
        <p role="status" className="text-sm text-graphite-soft">
          Loading overrides…
        </p>
      )}
      {q.isError && (
        <p role="alert" className="text-sm text-severity-error">
          {(q.error as Error).message}
        </p>
      )}
      {q.data && (
        <>
          {q.data.current.length === 0 ? (
            <p className="text-sm" data-testid="overrides-none">
              None: every rule runs with its own severity and options.
            </p>
          ) : (
            <div className="overflow-x-auto">
              <table className="tbl" data-testid="overrides-table">
                <thead>
                  <tr>
                    <th>Rule</th>
                    <th>Own severity</th>
                    <th>In this project</th>
                    <th>Options</th>
                    <th>Reason</th>
                    <th>Set by</th>
                    <th>When (UTC)</th>
                  </tr>
                </thead>
                <tbody>
                  {q.data.current.map((o) => (
                    <tr key={o.id}>
                      <td>
                        <code>{o.rule}</code>
                      </td>
                      <td>
                        <SeverityBadge severity={o.defaultSeverity} />
                      </td>
                      <td>{o.severity ? <SeverityBadge severity={o.severity} /> : "unchanged"}</td>
                      <td className="num text-xs">{optionText(o.options)}</td>
                      <td className="max-w-md text-xs">{o.reason}</td>
                      <td className="text-xs">{o.setBy}</td>
                      <td className="num text-xs">{fmt(o.setAt)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          {q.data.history.length > 0 && (
            <details className="text-xs">
              <summary className="cursor-pointer text-graphite-soft">
                History ({q.data.history.length} change{q.data.history.length === 1 ? "" : "s"})
              </summary>
              <ol className="mt-2 space-y-1" data-testid="overrides-history">
                {q.data.history.map((o) => (
                  <li key={o.id}>
                    <span className="num">{fmt(o.setAt)}</span> · {o.setBy} · <code>{o.rule}</code>{" "}
                    {o.cleared ? "cleared" : `set${o.severity ? ` to ${o.severity}` : ""}${o.options ? ` with ${optionText(o.options)}` : ""}`} — {o.reason}
                  </li>
                ))}
              </ol>
            </details>
          )}
          {canChange && <OverrideForm projectId={projectId} data={q.data} />}
        </>
      )}
    </section>
  );
}

function OverrideForm({ projectId, data }: { projectId: number; data: OverridesData }) {
  const [rule, setRule] = useState(data.rules[0]?.id ?? "");
  const {
    mutation: m,
    errors,
    message,
    setErrors,
    setMessage,
  } = useFormPost<Record<string, unknown>>(`/api/projects/${projectId}/overrides`, ["overrides", projectId]);
  const meta = data.rules.find((r) => r.id === rule);
  const inForce = data.current.some((o) => o.rule === rule);
  return (
    <form
      aria-label="Change a rule override"
      className="grid gap-3 border-t border-paper-line pt-3 md:grid-cols-2"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        const form = e.currentTarget;
        const d = new FormData(form);
        const action = (e.nativeEvent as SubmitEvent).submitter?.getAttribute("value") === "clear" ? "clear" : "set";
        const reason = String(d.get("reason") ?? "");
        if (action === "clear") return m.mutate({ action, rule, reason }, { onSuccess: () => form.reset() });
        const text = String(d.get("options") ?? "").trim();
        let options: Record<string, unknown> | null = null;
        if (text) {
          try {
            options = JSON.parse(text);
          } catch {
            setErrors({ options: ['Write the options as a JSON object, for example {"threshold": 0.08}.'] });
            setMessage(null);
            return;
          }
        }
        const severity = String(d.get("severity") ?? "") || null;
        m.mutate({ action, rule, severity, options, reason }, { onSuccess: () => form.reset() });
      }}
    >
      <div>
        <label htmlFor="override-rule" className="label">
          Rule
        </label>
        <select id="override-rule" name="rule" className="field" value={rule} onChange={(e) => setRule(e.target.value)} aria-invalid={!!errors.rule}>
          {data.rules.map((r) => (
            <option key={r.id} value={r.id}>
              {r.id} ({r.severity})
            </option>
          ))}
        </select>
        {meta && <p className="mt-1 text-xs text-graphite-soft">{meta.summary}</p>}
        {errors.rule && <p className="field-error">{errors.rule.join(" ")}</p>}
      </div>
      <div>
        <label htmlFor="override-severity" className="label">
          Severity in this project
        </label>
        <select id="override-severity" name="severity" className="field" defaultValue="" aria-invalid={!!errors.severity}>
          <option value="">as the rule defines ({meta?.severity})</option>
          <option value="error">error</option>
          <option value="warning">warning</option>
          <option value="info">info</option>
        </select>
        {errors.severity && <p className="field-error">{errors.severity.join(" ")}</p>}
      </div>
      <div>
        <label htmlFor="override-options" className="label">
          Options (JSON)
        </label>
        <input
          id="override-options"
          name="options"
          className="field font-mono"
          placeholder={meta && Object.keys(meta.defaults).length ? JSON.stringify(meta.defaults) : "this rule takes no options"}
          aria-invalid={!!errors.options}
        />
        {errors.options && <p className="field-error">{errors.options.join(" ")}</p>}
      </div>
      <div>
        <label htmlFor="override-reason" className="label">
          Reason (kept in the history)
        </label>
        <input id="override-reason" name="reason" className="field" aria-invalid={!!errors.reason} />
        {errors.reason && <p className="field-error">{errors.reason.join(" ")}</p>}
      </div>
      <div className="flex gap-2 md:col-span-2">
        <button className="btn" type="submit" value="set" disabled={m.isPending}>
          {m.isPending ? "Saving…" : "Save override"}
        </button>
        <button
          className="btn-quiet"
          type="submit"
          value="clear"
          disabled={m.isPending || !inForce}
          title={inForce ? undefined : "No override of this rule is in force"}
        >
          Clear override of {rule}
        </button>
      </div>
      {message && (
        <p role="alert" className="field-error md:col-span-2">
          {message}
        </p>
      )}
    </form>
  );
}
