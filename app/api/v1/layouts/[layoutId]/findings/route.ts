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
  const wanted = status === "open" ? ["open", "reopened"] : status === "all" ? null : [status];
  // one round trip: the newest revision and its findings (a layout with no revision or no match is checked after)
  const q = db()("revisions as v")
    .leftJoin("findings as f", "f.revision_id", "v.id")
    .leftJoin("threads as t", "t.id", "f.thread_id")
    .where("v.layout_id", layoutId)
    .whereRaw("v.number = (select max(number) from revisions where layout_id = ?)", [layoutId])
    .select("v.id as revision_id", "v.number", "t.id", "f.rule", "f.severity", "f.title", "t.status", "f.contacts", "f.load_case", "f.body")
    .orderBy("f.id");
  const all: Record<string, unknown>[] = await q;
  if (!all.length) {
    if (!(await db()("layouts").where({ id: layoutId }).first())) throw notFound("That layout");
    return Response.json({ revision: null, findings: [] }, { status: 200 });
  }
  const latest = { id: all[0].revision_id as number, number: all[0].number as number };
  const rows = all.filter((r) => r.id !== null && (!wanted || wanted.includes(r.status as string)));
  const findings = rows.map((f) => ({ id: f.id, rule: f.rule, severity: f.severity, title: f.title, status: f.status, contacts: JSON.parse(f.contacts as string), loadCase: f.load_case ?? null, body: f.body }));
  void user;
  return Response.json({ revision: { id: latest.id, number: latest.number }, findings }, { status: 200 });
});
