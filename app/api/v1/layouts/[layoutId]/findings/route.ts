/** GET ?status=open|waived|resolved|reopened|all: findings of the layout's newest revision with their review state. */
import { z } from "zod";
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom, parseWith } from "@/lib/api/handler";
import { db } from "@/lib/db/knex";
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
  const wanted = status === "open" ? ["open", "reopened"] : status === "all" ? null : [status];
  const q = db()("findings as f").join("threads as t", "t.id", "f.thread_id").where("f.revision_id", latest.id).select("t.id", "f.rule", "f.severity", "f.title", "t.status", "f.contacts", "f.load_case", "f.body").orderBy("f.id");
  if (wanted) q.whereIn("t.status", wanted);
  const rows: Record<string, unknown>[] = await q;
  const findings = rows.map((f) => ({ id: f.id, rule: f.rule, severity: f.severity, title: f.title, status: f.status, contacts: JSON.parse(f.contacts as string), loadCase: f.load_case ?? null, body: f.body }));
  void user;
  return Response.json({ revision: { id: latest.id, number: latest.number }, findings }, { status: 200 });
});
