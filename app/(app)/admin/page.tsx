/** Admin: users and roles, the mail outbox and the messages the local SMTP fake captured. */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { allowed } from "@/lib/policy";
import { UserAdmin } from "@/components/admin/user-admin";
import { listOutbox } from "@/lib/mail/outbox";
import { capturedMail } from "@/lib/mail/captured";

export const metadata: Metadata = { title: "Admin" };
export const dynamic = "force-dynamic";

export default async function AdminPage() {
  const user = await requirePageUser("/admin");
  if (!allowed(user.role, "readMailOutbox")) {
    return (
      <div className="sheet p-6" role="alert">
        <h1 className="text-lg">Administrators only</h1>
        <p className="text-sm text-graphite-soft">Your role ({user.role}) does not open the admin pages.</p>
      </div>
    );
  }
  const outbox = await listOutbox(100);
  const captured = await capturedMail(100);
  return (
    <div className="space-y-8">
      <h1>Administration</h1>
      <UserAdmin selfId={user.id} />
      <section className="sheet overflow-x-auto p-4">
        <h2>
          Mail outbox <span className="num text-graphite-soft">({outbox.length})</span>
        </h2>
        <table className="tbl mt-2 text-xs" data-testid="outbox">
          <thead>
            <tr>
              <th>Queued (UTC)</th>
              <th>To</th>
              <th>Kind</th>
              <th>Subject</th>
              <th>State</th>
              <th className="text-right">Attempts</th>
              <th>Last error</th>
            </tr>
          </thead>
          <tbody>
            {outbox.map((m) => (
              <tr key={m.id}>
                <td className="num">{m.createdAt.slice(0, 19).replace("T", " ")}</td>
                <td>{m.to}</td>
                <td>{m.kind}</td>
                <td>{m.subject}</td>
                <td>{m.status}</td>
                <td className="num text-right">{m.attempts}</td>
                <td>{m.lastError ?? "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <section className="sheet p-4">
        <h2>
          Captured by the local mail fake <span className="num text-graphite-soft">({captured.length})</span>
        </h2>
        <ol className="mt-2 space-y-3 text-xs" data-testid="captured-mail">
          {captured.map((m, i) => (
            <li key={i} className="border-b border-paper-line pb-2">
              <div>
                <b>To:</b> {m.to.join(", ")} · <b>Subject:</b> {m.subject} · <span className="num">{m.receivedAt.slice(0, 19).replace("T", " ")}</span>
              </div>
              <pre className="mt-1 whitespace-pre-wrap font-mono">{m.text}</pre>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}
