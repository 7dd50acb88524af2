"use client";
/** Admin: every account with role and state, add an account, change a role, deactivate or reactivate; the change log. */
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/components/ui/fetch-json";
import { useFormPost } from "@/components/ui/use-form-post";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { roleLabels, roles, type Role } from "@/lib/roles";
import { QueryStatus } from "@/components/ui/query-status";

interface UserRow {
  id: number;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  createdAt: string;
}
interface AuditRow {
  id: number;
  kind: string;
  actor: string | null;
  createdAt: string;
  detail: { name?: string; from?: string; to?: string; role?: string };
}

const describe = (h: AuditRow) => {
  const who = h.detail.name ?? "an account";
  switch (h.kind) {
    case "user-added":
      return `added ${who} as ${h.detail.role}`;
    case "role-changed":
      return `changed ${who} from ${h.detail.from} to ${h.detail.to}`;
    case "user-deactivated":
      return `deactivated ${who}`;
    case "user-reactivated":
      return `reactivated ${who}`;
    default:
      return h.kind;
  }
};

export function UserAdmin({ selfId }: { selfId: number }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ["admin-users"], queryFn: () => fetchJson<{ users: UserRow[]; history: AuditRow[] }>("/api/admin/users") });
  const change = useMutation({
    mutationFn: ({ id, body }: { id: number; body: { role?: Role; active?: boolean } }) =>
      fetchJson(`/api/admin/users/${id}`, { method: "PATCH", body: JSON.stringify(body) }),
    onSettled: () => qc.invalidateQueries({ queryKey: ["admin-users"] }),
  });
  const add = useFormPost<{ name: string; email: string; role: Role; password: string }>("/api/admin/users", ["admin-users"]);
  if (q.isPending || q.isError) return <QueryStatus query={q} loading="Loading users…" />;
  return (
    <section className="sheet space-y-4 overflow-x-auto p-4" aria-labelledby="users-heading">
      <h2 id="users-heading">Users</h2>
      <table className="tbl" data-testid="user-table">
        <thead>
          <tr>
            <th>Name</th>
            <th>E-mail</th>
            <th>Role</th>
            <th>State</th>
            <th>Action</th>
          </tr>
        </thead>
        <tbody>
          {q.data.users.map((u) => (
            <tr key={u.id} className={u.active ? undefined : "text-graphite-soft"}>
              <td>{u.name}</td>
              <td>{u.email}</td>
              <td>
                <select
                  aria-label={`Role of ${u.name}`}
                  className="field w-auto py-1 text-xs"
                  value={u.role}
                  disabled={u.id === selfId || change.isPending}
                  onChange={(e) => change.mutate({ id: u.id, body: { role: e.target.value as Role } })}
                >
                  {roles.map((r) => (
                    <option key={r} value={r}>
                      {roleLabels[r]}
                    </option>
                  ))}
                </select>
              </td>
              <td>{u.active ? "active" : "deactivated"}</td>
              <td>
                {u.id === selfId ? (
                  <span className="text-xs text-graphite-soft">you</span>
                ) : u.active ? (
                  <ConfirmButton
                    label={`Deactivate ${u.name}`}
                    className="btn-quiet py-0.5 text-xs"
                    title={`Deactivate ${u.name}?`}
                    confirmLabel="Deactivate"
                    onConfirm={() => change.mutate({ id: u.id, body: { active: false } })}
                  >
                    <p>{u.name} can no longer sign in, and their API tokens stop working at once. Their comments, waivers and releases stay in the history.</p>
                  </ConfirmButton>
                ) : (
                  <button type="button" className="btn-quiet py-0.5 text-xs" onClick={() => change.mutate({ id: u.id, body: { active: true } })}>
                    Reactivate {u.name}
                  </button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {change.isError && (
        <p role="alert" className="text-sm text-severity-error">
          {(change.error as Error).message}
        </p>
      )}
      <form
        className="grid gap-2 sm:grid-cols-5"
        aria-label="Add a user"
        onSubmit={(e) => {
          e.preventDefault();
          const form = e.currentTarget;
          const data = new FormData(form);
          add.mutation.mutate(
            {
              name: String(data.get("name") ?? ""),
              email: String(data.get("email") ?? ""),
              role: String(data.get("role") ?? "designer") as Role,
              password: String(data.get("password") ?? ""),
            },
            { onSuccess: () => form.reset() },
          );
        }}
      >
        {[
          ["name", "Name", "text"],
          ["email", "E-mail", "email"],
          ["password", "First password (≥ 10 characters)", "password"],
        ].map(([id, label, type]) => (
          <div key={id}>
            <label htmlFor={`new-user-${id}`} className="label">
              {label}
            </label>
            <input id={`new-user-${id}`} name={id} type={type} className="field" required autoComplete="off" />
            {add.errors[id]?.map((m) => (
              <p key={m} className="text-xs text-severity-error">
                {m}
              </p>
            ))}
          </div>
        ))}
        <div>
          <label htmlFor="new-user-role" className="label">
            Role
          </label>
          <select id="new-user-role" name="role" className="field" defaultValue="designer">
            {roles.map((r) => (
              <option key={r} value={r}>
                {roleLabels[r]}
              </option>
            ))}
          </select>
        </div>
        <div className="flex items-end">
          <button type="submit" className="btn" disabled={add.mutation.isPending}>
            Add user
          </button>
        </div>
      </form>
      {add.message && (
        <p role="alert" className="text-sm text-severity-error">
          {add.message}
        </p>
      )}
      {q.data.history.length > 0 && (
        <details>
          <summary className="text-sm">Change log ({q.data.history.length})</summary>
          <ol className="mt-1 text-xs text-graphite-soft" data-testid="user-history">
            {q.data.history.map((h) => (
              <li key={h.id}>
                {h.createdAt.slice(0, 16).replace("T", " ")} UTC · {h.actor ?? "Sixfold"} {describe(h)}
              </li>
            ))}
          </ol>
        </details>
      )}
    </section>
  );
}
