/**
 * Revisions: stored in one transaction with their findings, carrying threads over by fingerprint
 * (same fingerprint keeps its thread, a vanished one resolves, a reappearing one reopens).
 */
import "server-only";
import { iso, isoOrNull } from "./rows";
import { createHash } from "node:crypto";
import { db, lockLayout, transaction } from "./knex";
import { recordEvent } from "./events";
import { forbidden, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import type { SessionUser } from "@/lib/auth/session";
import type { Encoding, Layout, LayoutError } from "@/lib/layout/model";
import type { Report } from "@/lib/engine";
import type { RuleOverride } from "@/rules";
import type { RevisionSummaryDto, RevisionDto, FindingRowDto, RevisionDiff } from "@/lib/contracts/revisions";
export type { RevisionSummaryDto, RevisionDto, FindingRowDto, RevisionDiff } from "@/lib/contracts/revisions";

/** A revision row joined with its uploader and release (revisionQuery). */
interface RevisionRow {
  id: number;
  layout_id: number;
  number: number;
  encoding: Encoding;
  file_name: string;
  bodies: number;
  contacts: number;
  rank_: number;
  freedoms: number;
  redundancies: number;
  conditioning: number;
  uploader: string;
  created_at: Date;
  overrides: string | null;
  requester: string | null;
  requested_at: Date | null;
  approver: string | null;
  approved_at: Date | null;
  report?: string;
  parsed?: string;
}

/** A finding row joined with its thread's status and comment count. */
interface FindingJoinRow {
  id: number;
  thread_id: number;
  rule: string;
  severity: FindingRowDto["severity"];
  title: string;
  body: string;
  contacts: string;
  load_case: string | null;
  status: FindingRowDto["status"];
  comment_count: number | string;
}

/** A thread row as the carry-over reads it. */
interface ThreadRow {
  id: number;
  layout_id: number;
  fingerprint: string;
  fingerprint_hash: string;
  rule: string;
  severity: FindingRowDto["severity"];
  title: string;
  status: FindingRowDto["status"];
  version: number;
}

function toSummary(r: RevisionRow): RevisionSummaryDto {
  return {
    id: r.id,
    layoutId: r.layout_id,
    number: r.number,
    encoding: r.encoding,
    fileName: r.file_name,
    counts: { bodies: r.bodies, contacts: r.contacts, rank: r.rank_, freedoms: r.freedoms, redundancies: r.redundancies },
    conditioning: r.conditioning,
    uploadedBy: r.uploader,
    createdAt: iso(r.created_at),
    overrides: r.overrides ? (JSON.parse(r.overrides) as Record<string, RuleOverride>) : {},
    release: r.requested_at
      ? { requestedBy: r.requester ?? "", requestedAt: iso(r.requested_at), approvedBy: r.approver ?? null, approvedAt: isoOrNull(r.approved_at) }
      : null,
  };
}

const toFinding = (f: FindingJoinRow): FindingRowDto => ({
  id: f.id,
  threadId: f.thread_id,
  rule: f.rule,
  severity: f.severity,
  title: f.title,
  body: f.body,
  contacts: JSON.parse(f.contacts) as string[],
  loadCase: f.load_case ?? null,
  status: f.status,
  comments: Number(f.comment_count),
});

function revisionQuery() {
  return db()("revisions as v")
    .join("users as u", "u.id", "v.uploaded_by")
    .leftJoin("releases as r", "r.revision_id", "v.id")
    .leftJoin("users as rq", "rq.id", "r.requested_by")
    .leftJoin("users as ap", "ap.id", "r.approved_by")
    .select(
      "v.id",
      "v.layout_id",
      "v.number",
      "v.encoding",
      "v.file_name",
      "v.bodies",
      "v.contacts",
      "v.rank_",
      "v.freedoms",
      "v.redundancies",
      "v.conditioning",
      "v.overrides",
      "v.created_at",
      "u.name as uploader",
      "r.requested_at",
      "r.approved_at",
      "rq.name as requester",
      "ap.name as approver",
    );
}

/** Revisions of a layout, oldest first. */
export async function listRevisions(_user: SessionUser, layoutId: number): Promise<RevisionSummaryDto[]> {
  const rows = await revisionQuery().where("v.layout_id", layoutId).orderBy("v.number", "asc");
  return rows.map(toSummary);
}

/** One revision with its report, parsed layout and findings (with the thread status now). */
export async function getRevision(_user: SessionUser, revisionId: number): Promise<RevisionDto> {
  const row: RevisionRow | undefined = await revisionQuery().select("v.report", "v.parsed").where("v.id", revisionId).first();
  if (!row) throw notFound("That revision");
  const findings: FindingJoinRow[] = await db()("findings as f")
    .join("threads as t", "t.id", "f.thread_id")
    .where("f.revision_id", revisionId)
    .select("f.*", "t.status", db().raw("(select count(*) from comments c where c.thread_id = t.id) as comment_count"))
    .orderBy("f.id", "asc");
  return {
    ...toSummary(row),
    report: JSON.parse(row.report!),
    layout: JSON.parse(row.parsed!),
    findings: findings.map(toFinding),
  };
}

/** Records a refused upload (nothing else is stored). */
export async function recordRefusedUpload(user: SessionUser, layoutId: number, fileName: string, size: number, errors: LayoutError[]): Promise<void> {
  await transaction(async (trx) => {
    await lockLayout(trx, layoutId, "share");
    await trx("upload_attempts").insert({
      layout_id: layoutId,
      user_id: user.id,
      file_name: fileName.slice(0, 255),
      size_bytes: size,
      accepted: false,
      errors: JSON.stringify(errors.slice(0, 200)),
    });
    await recordEvent(trx, { layoutId, kind: "upload-refused", actorId: user.id, detail: { fileName, errors: errors.length } });
  });
}

export interface StoreInput {
  fileName: string;
  encoding: Encoding;
  raw: string;
  layout: Layout;
  report: Report;
  /** the project rule overrides the report was made with */
  overrides?: Record<string, RuleOverride>;
}

/** Stores an analysed revision with its findings in one transaction and carries the threads over. */
export async function storeRevision(user: SessionUser, layoutId: number, input: StoreInput): Promise<RevisionSummaryDto> {
  if (!allowed(user.role, "uploadRevision")) throw forbidden("Only designers upload revisions.");
  const id = await transaction(async (trx) => {
    if (!(await lockLayout(trx, layoutId, "update"))) throw notFound("That layout");
    const last = await trx("revisions").where({ layout_id: layoutId }).max({ n: "number" }).first();
    const number = Number(last?.n ?? 0) + 1;
    const c = input.report.counts;
    const [revisionId] = await trx("revisions").insert({
      layout_id: layoutId,
      number,
      encoding: input.encoding,
      file_name: input.fileName.slice(0, 255),
      raw: input.raw,
      parsed: JSON.stringify(input.layout),
      report: JSON.stringify(input.report),
      bodies: c.bodies,
      contacts: c.contacts,
      rank_: c.rank,
      freedoms: c.freedoms,
      redundancies: c.redundancies,
      conditioning: input.report.conditioning,
      overrides: input.overrides && Object.keys(input.overrides).length ? JSON.stringify(input.overrides) : null,
      uploaded_by: user.id,
    });
    const threads: ThreadRow[] = await trx("threads").where({ layout_id: layoutId }).forUpdate();
    const byFp = new Map<string, Pick<ThreadRow, "id" | "status">>(threads.map((t) => [t.fingerprint, t]));
    const seen = new Set<number>();
    for (const f of input.report.findings) {
      let t = byFp.get(f.fingerprint);
      if (!t) {
        const [threadId] = await trx("threads").insert({
          layout_id: layoutId,
          fingerprint: f.fingerprint,
          fingerprint_hash: createHash("sha256").update(f.fingerprint).digest("hex"),
          rule: f.rule,
          severity: f.severity,
          title: f.title.slice(0, 400),
          status: "open",
          last_revision_id: revisionId,
        });
        t = { id: threadId, status: "open" };
        byFp.set(f.fingerprint, t);
        await recordEvent(trx, { layoutId, kind: "open", actorId: null, threadId, revisionId, detail: { title: f.title } });
      } else {
        const reappeared = t.status === "resolved";
        await trx("threads")
          .where({ id: t.id })
          .update({
            severity: f.severity,
            title: f.title.slice(0, 400),
            last_revision_id: revisionId,
            ...(reappeared ? { status: "reopened", version: trx.raw("version + 1"), updated_at: trx.fn.now(3) } : {}),
          });
        if (reappeared)
          await recordEvent(trx, {
            layoutId,
            kind: "reopen",
            actorId: null,
            threadId: t.id,
            revisionId,
            detail: { reason: `reappeared in revision ${number}` },
          });
      }
      seen.add(t.id);
      await trx("findings").insert({
        revision_id: revisionId,
        thread_id: t.id,
        rule: f.rule,
        severity: f.severity,
        title: f.title.slice(0, 400),
        body: f.body,
        contacts: JSON.stringify(f.contacts),
        load_case: f.loadCase ?? null,
      });
    }
    for (const t of threads) {
      if (seen.has(t.id as number) || t.status === "resolved") continue;
      await trx("threads")
        .where({ id: t.id })
        .update({ status: "resolved", version: trx.raw("version + 1"), updated_at: trx.fn.now(3) });
      await recordEvent(trx, {
        layoutId,
        kind: "resolve",
        actorId: null,
        threadId: t.id,
        revisionId,
        detail: { reason: `not found in revision ${number}` },
      });
    }
    await trx("upload_attempts").insert({
      layout_id: layoutId,
      user_id: user.id,
      file_name: input.fileName.slice(0, 255),
      size_bytes: Buffer.byteLength(input.raw),
      accepted: true,
      revision_id: revisionId,
    });
    await recordEvent(trx, {
      layoutId,
      kind: "upload",
      actorId: user.id,
      revisionId,
      detail: { number, fileName: input.fileName, findings: input.report.findings.length },
    });
    return revisionId as number;
  });
  const row: RevisionRow = await revisionQuery().where("v.id", id).first();
  return toSummary(row);
}

/** Two findings of one thread read the same: severity, title and body (with its numbers) alike. */
const sameFinding = (a: FindingRowDto, b: FindingRowDto) => a.severity === b.severity && a.title === b.title && a.body === b.body;

/** What changed between two revisions of the same layout: contacts and findings (new, resolved, changed, unchanged). */
export async function diffRevisions(user: SessionUser, fromId: number, toId: number): Promise<RevisionDiff> {
  const [a, b] = await Promise.all([getRevision(user, fromId), getRevision(user, toId)]);
  if (a.layoutId !== b.layoutId) throw notFound("Those revisions of one layout");
  const ca = new Map(a.layout.contacts.map((c) => [c.id, c]));
  const cb = new Map(b.layout.contacts.map((c) => [c.id, c]));
  const moved: RevisionDiff["contacts"]["moved"] = [];
  for (const [id, c] of cb) {
    const o = ca.get(id);
    if (!o) continue;
    const pd = Math.hypot(...c.point.map((x, i) => x - o.point[i]));
    const un = (v: number[]) => v.map((x) => x / Math.hypot(...v));
    const nd = Math.hypot(...un(c.normal).map((x, i) => x - un(o.normal)[i]));
    if (pd > 1e-9 * (1 + Math.hypot(...o.point)) || nd > 1e-9) moved.push({ id, from: o.point, to: c.point, normalChanged: nd > 1e-9 });
  }
  const fa = new Map(a.findings.map((f) => [f.threadId, f]));
  const fb = new Map(b.findings.map((f) => [f.threadId, f]));
  const brief = (f: FindingRowDto) => ({ threadId: f.threadId, title: f.title, severity: f.severity });
  return {
    from: a.number,
    to: b.number,
    contacts: { added: [...cb.keys()].filter((k) => !ca.has(k)), removed: [...ca.keys()].filter((k) => !cb.has(k)), moved },
    findings: {
      new: [...fb.values()].filter((f) => !fa.has(f.threadId)).map(brief),
      resolved: [...fa.values()].filter((f) => !fb.has(f.threadId)).map(brief),
      changed: [...fb.values()]
        .filter((f) => fa.has(f.threadId) && !sameFinding(fa.get(f.threadId)!, f))
        .map((f) => {
          const o = fa.get(f.threadId)!;
          return { ...brief(f), before: { title: o.title, severity: o.severity }, bodyChanged: o.body !== f.body };
        }),
      unchanged: [...fb.values()].filter((f) => fa.has(f.threadId) && sameFinding(fa.get(f.threadId)!, f)).map(brief),
    },
  };
}

/** The id of a layout's newest revision, or null. */
export async function latestRevisionId(layoutId: number): Promise<number | null> {
  const row: { id: number } | undefined = await db()("revisions").where({ layout_id: layoutId }).orderBy("number", "desc").first("id");
  return row?.id ?? null;
}
