/** A finding: explanation and numbers, involved contacts on the drawings, the thread, status actions, history. */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { allowed } from "@/lib/policy";
import { rules } from "@/rules";
import { ThreadView } from "@/components/review/thread-view";
import { listMentionableUsers } from "@/lib/db/users";

export const metadata: Metadata = { title: "Finding" };

export default async function FindingPage({ params }: { params: Promise<{ threadId: string }> }) {
  const { threadId } = await params;
  const user = await requirePageUser(`/findings/${threadId}`);
  const ruleDocs = Object.fromEntries(rules.map((r) => [r.meta.id, { summary: r.meta.summary, explanation: r.meta.explanation, source: r.meta.source }]));
  return (
    <ThreadView
      threadId={Number(threadId)}
      ruleDocs={ruleDocs}
      people={await listMentionableUsers()}
      can={{ comment: allowed(user.role, "comment"), waive: allowed(user.role, "waive"), reopen: allowed(user.role, "reopen") }}
    />
  );
}
