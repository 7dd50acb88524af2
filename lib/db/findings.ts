/** Findings of a layout's newest revision with their review state (the token API's read). */
import "server-only";
import { db } from "./knex";
import { notFound } from "@/lib/errors";
import type { SessionUser } from "@/lib/auth/session";
import type { ApiFindingDto, FindingStatusFilter } from "@/lib/contracts/findings";

interface LatestFindingRow {
  revision_id: number;
  number: number;
  id: number | null;
  rule: string | null;
  severity: ApiFindingDto["severity"] | null;
  title: string | null;
  status: ApiFindingDto["status"] | null;
  contacts: string | null;
  load_case: string | null;
  body: string | null;
}

/** The newest revision's findings filtered by review state, in one round trip; 404 for an unknown layout. */
export async function latestFindings(
  _user: SessionUser,
  layoutId: number,
  status: FindingStatusFilter,
): Promise<{ revision: { id: number; number: number } | null; findings: ApiFindingDto[] }> {
  const wanted = status === "open" ? ["open", "reopened"] : status === "all" ? null : [status];
  const all: LatestFindingRow[] = await db()("revisions as v")
    .leftJoin("findings as f", "f.revision_id", "v.id")
    .leftJoin("threads as t", "t.id", "f.thread_id")
    .where("v.layout_id", layoutId)
    .whereRaw("v.number = (select max(number) from revisions where layout_id = ?)", [layoutId])
    .select("v.id as revision_id", "v.number", "t.id", "f.rule", "f.severity", "f.title", "t.status", "f.contacts", "f.load_case", "f.body")
    .orderBy("f.id");
  if (!all.length) {
    if (!(await db()("layouts").where({ id: layoutId }).first())) throw notFound("That layout");
    return { revision: null, findings: [] };
  }
  const findings = all
    .filter((r) => r.id !== null && (!wanted || wanted.includes(r.status as string)))
    .map((f) => ({
      id: f.id!,
      rule: f.rule!,
      severity: f.severity!,
      title: f.title!,
      status: f.status!,
      contacts: JSON.parse(f.contacts ?? "[]") as string[],
      loadCase: f.load_case ?? null,
      body: f.body!,
    }));
  return { revision: { id: all[0].revision_id, number: all[0].number }, findings };
}
