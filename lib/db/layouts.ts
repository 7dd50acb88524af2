/** Layouts of a project: list with review state, create (designers), read one. */
import "server-only";
import { iso } from "./rows";
import { z } from "zod";
import { db } from "./knex";
import { conflict, forbidden, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import type { SessionUser } from "@/lib/auth/session";
import type { LayoutSummaryDto } from "@/lib/contracts/layouts";
import { layoutInputSchema } from "@/lib/contracts/layouts";
export type { LayoutSummaryDto } from "@/lib/contracts/layouts";
export { layoutInputSchema } from "@/lib/contracts/layouts";

interface LayoutRow {
  id: number;
  project_id: number;
  project_name: string;
  name: string;
  description: string;
  creator: string;
  created_at: Date;
}

async function summaries(where: (q: ReturnType<ReturnType<typeof db>>) => void): Promise<LayoutSummaryDto[]> {
  const q = db()("layouts as l")
    .join("projects as p", "p.id", "l.project_id")
    .join("users as u", "u.id", "l.created_by")
    .select("l.*", "p.name as project_name", "u.name as creator")
    .orderBy("l.created_at", "asc");
  where(q);
  const rows: LayoutRow[] = await q;
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  const revs = await db()("revisions")
    .whereIn("layout_id", ids)
    .select("id", "layout_id", "number", "created_at", "freedoms", "redundancies")
    .orderBy("number", "asc");
  const counts: { layout_id: number; status: string; severity: string; n: number }[] = await db()("threads")
    .whereIn("layout_id", ids)
    .select("layout_id", "status", "severity", db().raw("count(*) as n"))
    .groupBy("layout_id", "status", "severity");
  const releases = await db()("releases as r")
    .join("revisions as v", "v.id", "r.revision_id")
    .whereIn("v.layout_id", ids)
    .select("v.layout_id", "v.id as revision_id", "r.approved_at");
  return rows.map((r) => {
    const mine = revs.filter((v) => v.layout_id === r.id);
    const latest = mine[mine.length - 1];
    const c = (status: string[], sev?: string) =>
      counts.filter((x) => x.layout_id === r.id && status.includes(x.status as string) && (!sev || x.severity === sev)).reduce((s, x) => s + Number(x.n), 0);
    const rel = releases.filter((x) => latest && x.revision_id === latest.id);
    return {
      id: r.id,
      projectId: r.project_id,
      projectName: r.project_name,
      name: r.name,
      description: r.description,
      createdBy: r.creator,
      createdAt: iso(r.created_at),
      revisions: mine.length,
      latestRevision: latest
        ? { id: latest.id, number: latest.number, createdAt: iso(latest.created_at), freedoms: latest.freedoms, redundancies: latest.redundancies }
        : null,
      openErrors: c(["open", "reopened"], "error"),
      openWarnings: c(["open", "reopened"], "warning"),
      openInfos: c(["open", "reopened"], "info"),
      waived: c(["waived"]),
      released: rel.some((x) => x.approved_at),
      releaseRequested: rel.length > 0 && !rel.some((x) => x.approved_at),
    };
  });
}

/** Layouts of one project with their review state. */
export async function listLayouts(_user: SessionUser, projectId: number): Promise<LayoutSummaryDto[]> {
  const project = await db()("projects").where({ id: projectId }).first();
  if (!project) throw notFound("That project");
  return summaries((q) => q.where("l.project_id", projectId));
}

/** One layout with its review state. */
export async function getLayout(_user: SessionUser, layoutId: number): Promise<LayoutSummaryDto> {
  const [l] = await summaries((q) => q.where("l.id", layoutId));
  if (!l) throw notFound("That layout");
  return l;
}

/** Creates a layout in a project (designers). */
export async function createLayout(user: SessionUser, projectId: number, input: z.infer<typeof layoutInputSchema>): Promise<LayoutSummaryDto> {
  if (!allowed(user.role, "createLayout")) throw forbidden("Only designers create layouts.");
  const project = await db()("projects").where({ id: projectId }).first();
  if (!project) throw notFound("That project");
  if (await db()("layouts").where({ project_id: projectId, name: input.name }).first())
    throw conflict(`This project already has a layout named "${input.name}".`);
  const [id] = await db()("layouts").insert({ project_id: projectId, name: input.name, description: input.description ?? "", created_by: user.id });
  return getLayout(user, id);
}

/** Whether a layout exists (any role may ask; no details returned). */
export async function layoutExists(layoutId: number): Promise<boolean> {
  return !!(await db()("layouts").where({ id: layoutId }).first("id"));
}
