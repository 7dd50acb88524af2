/** GET ?status=open|waived|resolved|reopened|all: findings of the layout's newest revision with their review state. */
import { z } from "zod";
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom, parseWith } from "@/lib/api/handler";
import { db } from "@/lib/db/knex";
import { getRevision } from "@/lib/db/revisions";
import { notFound } from "@/lib/errors";

export const dynamic = "force-dynamic";
const querySchema = z.object({ status: z.enum(["open", "waived", "resolved", "reopened", "all"]).default("open") });

export const GET = handle(async (req: Request, ctx: { params: Promise<{ layoutId: string }> }) => {
  const user = await requireUser();
  const layoutId = await idFrom(ctx.params, "layoutId");
  const { status } = parseWith(querySchema, Object.fromEntries(new URL(req.url).searchParams));
  if (!(await db()("layouts").where({ id: layoutId }).first())) throw notFound("That layout");
  const latest = await db()("revisions").where({ layout_id: layoutId }).orderBy("number", "desc").first();
  if (!latest) return Response.json({ revision: null, findings: [] }, { status: 200 });
  const rev = await getRevision(user, latest.id);
  const wanted = status === "open" ? ["open", "reopened"] : status === "all" ? null : [status];
  const findings = rev.findings.filter((f) => !wanted || wanted.includes(f.status)).map((f) => ({ id: f.threadId, rule: f.rule, severity: f.severity, title: f.title, status: f.status, contacts: f.contacts, loadCase: f.loadCase, body: f.body }));
  return Response.json({ revision: { id: rev.id, number: rev.number }, findings }, { status: 200 });
});
