"use client";
/** Token list with create (shown once) and revoke; mail kinds with mute switches. */
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { fetchJson } from "@/components/ui/fetch-json";

interface Token {
  id: number;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

export function SettingsView({ name }: { name: string }) {
  const qc = useQueryClient();
  const tokens = useQuery({ queryKey: ["tokens"], queryFn: () => fetchJson<{ tokens: Token[] }>("/api/tokens") });
  const mail = useQuery({ queryKey: ["mail-settings"], queryFn: () => fetchJson<{ kinds: Record<string, string>; muted: string[] }>("/api/settings/mail") });
  const [fresh, setFresh] = useState<string | null>(null);
  const create = useMutation({
    mutationFn: (tokenName: string) => fetchJson<{ token: string }>("/api/tokens", { method: "POST", body: JSON.stringify({ name: tokenName }) }),
    onSuccess: (d) => {
      setFresh(d.token);
      return qc.invalidateQueries({ queryKey: ["tokens"] });
    },
  });
  const revoke = useMutation({
    mutationFn: (id: number) => fetchJson(`/api/tokens/${id}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ["tokens"] }),
  });
  const mute = useMutation({
    mutationFn: (muted: string[]) => fetchJson("/api/settings/mail", { method: "PUT", body: JSON.stringify({ muted }) }),
    onMutate: async (muted) => {
      await qc.cancelQueries({ queryKey: ["mail-settings"] });
      const prev = qc.getQueryData<{ kinds: Record<string, string>; muted: string[] }>(["mail-settings"]);
      if (prev) qc.setQueryData(["mail-settings"], { ...prev, muted });
      return { prev };
    },
    onError: (_e, _v, ctx) => ctx?.prev && qc.setQueryData(["mail-settings"], ctx.prev),
  });
  const fmt = (iso: string | null) => (iso ? iso.slice(0, 16).replace("T", " ") : "—");

  return (
    <div className="max-w-4xl space-y-8">
      <h1>Settings for {name}</h1>
      <section className="sheet space-y-3 overflow-x-auto p-4" aria-labelledby="tokens-heading">
        <h2 id="tokens-heading">API tokens</h2>
        <p className="text-sm text-graphite-soft">
          A token lets a CAD export script post layouts as you, with your role. It is shown once; Sixfold keeps only its hash. See the{" "}
          <a href="/help/api">API page</a> for a ready script.
        </p>
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            const d = new FormData(e.currentTarget);
            create.mutate(String(d.get("name") ?? ""));
            e.currentTarget.reset();
          }}
        >
          <div>
            <label htmlFor="token-name" className="label">
              Token name
            </label>
            <input id="token-name" name="name" className="field w-64" placeholder="e.g. CAD export on workstation 3" />
          </div>
          <button className="btn" type="submit" disabled={create.isPending}>
            Create token
          </button>
        </form>
        {create.isError && (
          <p role="alert" className="field-error">
            {(create.error as Error).message}
          </p>
        )}
        {fresh && (
          <div className="rounded-sm border border-teal bg-teal-light p-3 text-sm" role="status">
            Copy this token now; it will not be shown again:
            <pre className="mt-1 select-all overflow-x-auto font-mono text-xs" data-testid="new-token">
              {fresh}
            </pre>
          </div>
        )}
        <table className="tbl" data-testid="token-table">
          <thead>
            <tr>
              <th>Name</th>
              <th>Starts with</th>
              <th>Created (UTC)</th>
              <th>Last used (UTC)</th>
              <th>State</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {tokens.data?.tokens.map((t) => (
              <tr key={t.id}>
                <td>{t.name}</td>
                <td className="num">{t.prefix}…</td>
                <td className="num">{fmt(t.createdAt)}</td>
                <td className="num">{fmt(t.lastUsedAt)}</td>
                <td>{t.revokedAt ? `revoked ${fmt(t.revokedAt)}` : "active"}</td>
                <td>
                  {!t.revokedAt && (
                    <ConfirmButton
                      label="Revoke"
                      className="btn-quiet py-0.5 text-xs"
                      title={`Revoke the token "${t.name}"?`}
                      confirmLabel="Revoke token"
                      onConfirm={() => revoke.mutate(t.id)}
                    >
                      <p>Scripts that use {t.prefix}… stop working at once. This cannot be undone; create a new token to replace it.</p>
                    </ConfirmButton>
                  )}
                </td>
              </tr>
            ))}
            {tokens.data?.tokens.length === 0 && (
              <tr>
                <td colSpan={6} className="text-center text-graphite-soft">
                  No tokens yet.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </section>
      <section className="sheet space-y-2 overflow-x-auto p-4" aria-labelledby="mail-heading">
        <h2 id="mail-heading">E-mail</h2>
        {mail.data &&
          Object.entries(mail.data.kinds).map(([kind, label]) => {
            const muted = mail.data.muted.includes(kind);
            return (
              <label key={kind} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  checked={!muted}
                  onChange={() => mute.mutate(muted ? mail.data.muted.filter((k) => k !== kind) : [...mail.data.muted, kind])}
                />
                {label}
              </label>
            );
          })}
        {mute.isError && (
          <p role="alert" className="field-error">
            Could not save: {(mute.error as Error).message}
          </p>
        )}
      </section>
    </div>
  );
}
