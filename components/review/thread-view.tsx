"use client";
/** The finding page body: numbers, drawings with the involved contacts, comments, waive / reopen, history. */
import Link from "next/link";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { ApiError, fetchJson } from "@/components/ui/fetch-json";
import { MarkdownView } from "@/components/markdown/markdown-view";
import { LayoutDrawings } from "@/components/layout-views/layout-drawings";
import { SeverityBadge, StatusBadge } from "./badges";
import type { Report } from "@/lib/engine";
import type { Layout } from "@/lib/layout/model";
import type { CommentDto, ThreadDto } from "@/lib/contracts/threads";
import { QueryStatus } from "@/components/ui/query-status";

type Comment = CommentDto;
type Thread = ThreadDto;

const fmt = (iso: string) => iso.slice(0, 16).replace("T", " ");

export function ThreadView({
  threadId,
  ruleDocs,
  people,
  can,
}: {
  threadId: number;
  ruleDocs: Record<string, { summary: string; explanation: string; source: string }>;
  people: { name: string; handle: string }[];
  can: { comment: boolean; waive: boolean; reopen: boolean };
}) {
  const qc = useQueryClient();
  const key = ["thread", threadId];
  const q = useQuery({ queryKey: key, queryFn: () => fetchJson<{ thread: Thread }>(`/api/threads/${threadId}`) });
  const [shown, setShown] = useState<number | null>(null);
  const t = q.data?.thread;
  const appearance = t ? (t.appearances.find((a) => a.revisionId === shown) ?? t.appearances[t.appearances.length - 1]) : undefined;
  const rq = useQuery({
    queryKey: ["revision", appearance?.revisionId],
    enabled: !!appearance,
    queryFn: () => fetchJson<{ revision: { report: Report; layout: Layout } }>(`/api/revisions/${appearance!.revisionId}`),
  });

  const status = useMutation({
    mutationFn: (body: { action: "waive" | "reopen"; reason: string; version: number }) =>
      fetchJson<{ thread: Thread }>(`/api/threads/${threadId}/status`, { method: "POST", body: JSON.stringify(body) }),
    onMutate: async (body) => {
      await qc.cancelQueries({ queryKey: key });
      const prev = qc.getQueryData<{ thread: Thread }>(key);
      if (prev)
        qc.setQueryData(key, {
          thread: { ...prev.thread, status: body.action === "waive" ? "waived" : "reopened", waiverReason: body.action === "waive" ? body.reason : null },
        });
      return { prev };
    },
    onError: (_e, _b, ctx) => ctx?.prev && qc.setQueryData(key, ctx.prev),
    onSuccess: (data) => qc.setQueryData(key, data),
  });

  if (q.isPending || q.isError || !t) return <QueryStatus query={q} loading="Loading finding…" />;
  const doc = ruleDocs[t.rule];
  const latestRev = t.appearances[t.appearances.length - 1];

  return (
    <div className="space-y-6">
      <nav className="text-sm text-graphite-soft">
        <Link href="/projects">Projects</Link> / <Link href={`/projects/${t.projectId}`}>{t.projectName}</Link> /{" "}
        <Link href={`/layouts/${t.layoutId}`}>{t.layoutName}</Link> / <span>finding</span>
      </nav>
      <div className="space-y-2">
        <div className="flex flex-wrap items-center gap-2">
          <SeverityBadge severity={t.severity} />
          <StatusBadge status={t.status} />
          <code className="text-xs">{t.rule}</code>
          {t.readOnly && <span className="badge badge-neutral">released revision: read-only</span>}
        </div>
        <h1 data-testid="finding-title">{t.title}</h1>
        {t.status === "waived" && (
          <p className="rounded-sm border border-paper-line bg-paper-deep p-2 text-sm" data-testid="waiver">
            ≈ Waived by {t.waivedBy}: {t.waiverReason}
          </p>
        )}
      </div>

      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <section className="sheet p-4" aria-labelledby="numbers-heading">
          <div className="mb-2 flex flex-wrap items-baseline gap-2">
            <h2 id="numbers-heading" className="text-base">
              In revision {appearance?.revisionNumber}
            </h2>
            {t.appearances.length > 1 && (
              <select
                className="field ml-auto w-auto py-1 text-xs"
                aria-label="Show the finding as in revision"
                value={appearance?.revisionId}
                onChange={(e) => setShown(Number(e.target.value))}
              >
                {t.appearances.map((a) => (
                  <option key={a.revisionId} value={a.revisionId}>
                    r{a.revisionNumber}
                  </option>
                ))}
              </select>
            )}
          </div>
          {appearance && <MarkdownView source={appearance.body} />}
          {appearance && appearance.contacts.length > 0 && (
            <p className="mt-2 text-xs text-graphite-soft" data-testid="involved">
              Involved contacts: {appearance.contacts.join(", ")}
            </p>
          )}
          {latestRev && t.status === "resolved" && <p className="mt-2 text-xs">✓ Not present since a later revision.</p>}
        </section>
        {doc && (
          <section className="sheet p-4 text-sm" aria-labelledby="rule-heading">
            <h2 id="rule-heading" className="text-base">
              About this rule
            </h2>
            <p className="mt-1 font-medium">{doc.summary}</p>
            <MarkdownView source={doc.explanation} className="mt-2" />
            <p className="mt-2 text-xs text-graphite-soft">Method: {doc.source}</p>
          </section>
        )}
      </div>

      {rq.data && appearance && (
        <LayoutDrawings
          layout={rq.data.revision.layout}
          report={rq.data.revision.report}
          emphasis={{ contacts: appearance.contacts, motions: t.rule === "free-motion" ? undefined : [] }}
        />
      )}

      {(can.waive || can.reopen) && !t.readOnly && (
        <StatusActions thread={t} onSubmit={(b) => status.mutate(b)} pending={status.isPending} error={status.error as Error | null} />
      )}

      <section aria-labelledby="thread-heading" className="space-y-3">
        <h2 id="thread-heading">
          Discussion <span className="num text-graphite-soft">({t.comments.length})</span>
        </h2>
        <ol className="space-y-3" data-testid="comments">
          {t.comments.map((c) => (
            <CommentItem key={c.id} comment={c} threadKey={key} readOnly={t.readOnly} />
          ))}
        </ol>
        {can.comment && !t.readOnly && <Composer threadId={threadId} people={people} />}
      </section>

      <section aria-labelledby="finding-history" className="space-y-2">
        <h2 id="finding-history" className="text-base">
          History
        </h2>
        <ol className="sheet divide-y divide-paper-line text-xs" data-testid="finding-history">
          {t.history.map((e) => (
            <li key={e.id} className="flex gap-3 px-3 py-1.5">
              <span className="num w-36 shrink-0 text-graphite-soft">{fmt(e.createdAt)}</span>
              <span className="w-20 shrink-0 font-medium">{e.kind}</span>
              <span>
                {e.actor ?? "Sixfold"}
                {typeof e.detail.reason === "string" && e.detail.reason ? `: ${e.detail.reason}` : ""}
              </span>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}

function StatusActions({
  thread,
  onSubmit,
  pending,
  error,
}: {
  thread: Thread;
  onSubmit: (b: { action: "waive" | "reopen"; reason: string; version: number }) => void;
  pending: boolean;
  error: Error | null;
}) {
  const [reason, setReason] = useState("");
  const canWaive = thread.status === "open" || thread.status === "reopened";
  return (
    <section className="sheet space-y-2 p-4" aria-labelledby="status-heading">
      <h2 id="status-heading" className="text-base">
        Checker’s decision
      </h2>
      {canWaive ? (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            onSubmit({ action: "waive", reason, version: thread.version });
          }}
        >
          <label htmlFor="waiver-reason" className="label">
            Justification for the waiver (required)
          </label>
          <textarea id="waiver-reason" className="field min-h-[4rem]" value={reason} onChange={(e) => setReason(e.target.value)} />
          <button type="submit" className="btn" disabled={pending || reason.trim().length < 10}>
            {reason.trim().length < 10 ? "Waive — needs a justification of 10 characters or more" : "Waive finding"}
          </button>
          {reason.trim().length > 0 && reason.trim().length < 10 && <p className="field-error">Give at least 10 characters of justification.</p>}
        </form>
      ) : (
        <button type="button" className="btn" disabled={pending} onClick={() => onSubmit({ action: "reopen", reason: "", version: thread.version })}>
          Reopen finding
        </button>
      )}
      {error && (
        <p role="alert" className="text-sm text-severity-error">
          {error.message}
        </p>
      )}
    </section>
  );
}

function CommentItem({ comment, threadKey, readOnly }: { comment: Comment; threadKey: unknown[]; readOnly: boolean }) {
  const qc = useQueryClient();
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(comment.body);
  const save = useMutation({
    mutationFn: (body: string) => fetchJson(`/api/comments/${comment.id}`, { method: "PATCH", body: JSON.stringify({ body }) }),
    onSuccess: () => {
      setEditing(false);
      return qc.invalidateQueries({ queryKey: threadKey });
    },
  });
  return (
    <li className="sheet p-3" data-comment={comment.id}>
      <div className="mb-1 flex flex-wrap gap-2 text-xs text-graphite-soft">
        <span className="font-medium text-graphite">{comment.author.name}</span>
        <span>{comment.author.role}</span>
        <span className="num">{fmt(comment.createdAt)} UTC</span>
        {comment.editedAt && <span>edited {fmt(comment.editedAt)}</span>}
        {comment.mine && !readOnly && !editing && (
          <button type="button" className="ml-auto text-teal underline" onClick={() => setEditing(true)}>
            Edit
          </button>
        )}
      </div>
      {editing ? (
        <div className="space-y-2">
          <textarea className="field min-h-[6rem] font-mono text-xs" value={text} onChange={(e) => setText(e.target.value)} aria-label="Edit comment" />
          <div className="flex gap-2">
            <button type="button" className="btn" disabled={save.isPending} onClick={() => save.mutate(text)}>
              Save
            </button>
            <button
              type="button"
              className="btn-quiet"
              onClick={() => {
                setEditing(false);
                setText(comment.body);
              }}
            >
              Cancel
            </button>
          </div>
          {save.isError && (
            <p role="alert" className="field-error">
              {(save.error as Error).message} Your text is still here.
            </p>
          )}
        </div>
      ) : (
        <MarkdownView source={comment.body} mentions />
      )}
      {comment.history.length > 0 && (
        <details className="mt-2 text-xs text-graphite-soft">
          <summary>Earlier versions ({comment.history.length})</summary>
          {comment.history.map((h, i) => (
            <div key={i} className="mt-1 border-l border-paper-line pl-2">
              <div className="num">replaced {fmt(h.replacedAt)}</div>
              <pre className="whitespace-pre-wrap font-mono">{h.body}</pre>
            </div>
          ))}
        </details>
      )}
    </li>
  );
}

function Composer({ threadId, people }: { threadId: number; people: { name: string; handle: string }[] }) {
  const qc = useQueryClient();
  const [text, setText] = useState("");
  const [tab, setTab] = useState<"write" | "preview">("write");
  const post = useMutation({
    mutationFn: (body: string) => fetchJson(`/api/threads/${threadId}/comments`, { method: "POST", body: JSON.stringify({ body }) }),
    onSuccess: () => {
      setText("");
      return qc.invalidateQueries({ queryKey: ["thread", threadId] });
    },
  });
  const mention = /@([a-z0-9._-]*)$/i.exec(text);
  const suggestions = mention ? people.filter((p) => p.handle.startsWith(mention[1].toLowerCase())).slice(0, 5) : [];
  return (
    <form
      className="sheet space-y-2 p-3"
      aria-label="New comment"
      onSubmit={(e) => {
        e.preventDefault();
        if (text.trim()) post.mutate(text);
      }}
    >
      <div className="flex gap-2 text-xs" role="tablist">
        <button
          type="button"
          role="tab"
          aria-selected={tab === "write"}
          className={tab === "write" ? "font-semibold" : "text-graphite-soft"}
          onClick={() => setTab("write")}
        >
          Draft
        </button>
        <button
          type="button"
          role="tab"
          aria-selected={tab === "preview"}
          className={tab === "preview" ? "font-semibold" : "text-graphite-soft"}
          onClick={() => setTab("preview")}
        >
          As it will read
        </button>
        <span className="ml-auto text-graphite-soft">Markdown: tables, lists, `code`, math $…$ and $$…$$, @mentions</span>
      </div>
      <div className="grid gap-3 md:grid-cols-2">
        <textarea
          className={`field min-h-[8rem] font-mono text-xs ${tab === "preview" ? "hidden md:block" : ""}`}
          value={text}
          onChange={(e) => setText(e.target.value)}
          aria-label="Comment"
          placeholder="Write a comment…"
        />
        <div
          className={`min-h-[8rem] rounded-sm border border-paper-line bg-white p-2 ${tab === "write" ? "hidden md:block" : ""}`}
          data-testid="comment-preview"
          aria-label="Preview"
        >
          {text.trim() ? <MarkdownView source={text} /> : <span className="text-xs text-graphite-soft">Live preview</span>}
        </div>
      </div>
      {suggestions.length > 0 && (
        <div className="flex flex-wrap gap-2 text-xs">
          {suggestions.map((p) => (
            <button key={p.handle} type="button" className="btn-quiet py-0.5" onClick={() => setText(text.replace(/@([a-z0-9._-]*)$/i, `@${p.handle} `))}>
              @{p.handle} ({p.name})
            </button>
          ))}
        </div>
      )}
      <div className="flex items-center gap-3">
        <button type="submit" className="btn" disabled={post.isPending || !text.trim()}>
          {post.isPending ? "Posting…" : "Post comment"}
        </button>
        {post.isError && (
          <p role="alert" className="field-error">
            {post.error instanceof ApiError ? post.error.message : "Could not reach the server."} Your text is kept.
          </p>
        )}
      </div>
    </form>
  );
}
