/** The release report in markdown, rendered from loaded data (pure): summary, every load case, findings, waivers, release record, one caution. */
import type { ReleaseReportData } from "@/lib/contracts/report";
import { num, vec } from "@/lib/analysis/format";
import { unitLabel } from "@/lib/layout/units";
import { CAUTION } from "@/lib/caution";
import { serviceSections } from "./service-sections";
import { summariseLoadCases } from "./load-case-summary";

/**
 * Builds the markdown report of one revision (used at release and for download). `approval` is given
 * only by the approval itself, for the record it stores in the same transaction; otherwise the approval
 * line comes from the stored release record alone, and a revision without one prints as a draft.
 * `link` makes an app path absolute (the report leaves the app as a file).
 */
export function renderReleaseReport(data: ReleaseReportData, approval?: { by: string; at: Date }, link: (path: string) => string = (p) => p): string {
  const rev = data.revision;
  const layout = { name: data.layoutName, project: data.projectName };
  const threads = data.threads;
  const byThread = new Map(threads.map((t) => [t.id, t]));
  const r = rev.report;
  const u = unitLabel(r.units.length);
  const fu = unitLabel(r.units.force);
  const lines: string[] = [];
  // only a stored approval makes a release report; anything else is a draft (issue: no report may claim an approval that did not happen)
  const record = approval
    ? { by: approval.by, at: approval.at.toISOString() }
    : rev.release?.approvedBy && rev.release.approvedAt
      ? { by: rev.release.approvedBy, at: rev.release.approvedAt }
      : null;
  const approved = record !== null;
  lines.push(approved ? `# Release report — ${layout.name}, revision ${rev.number}` : `# DRAFT, not approved — ${layout.name}, revision ${rev.number}`, "");
  if (!approved) lines.push("> **Draft.** This revision has not been released: this document is not a release record and carries no approval.", "");
  lines.push(
    `Drawing views (plan, front, side and axonometric): in the PDF of this report, and on screen at ${link(`/layouts/${rev.layoutId}/print?revision=${rev.id}`)}.`,
    "",
  );
  lines.push(
    `Project: ${layout.project}  `,
    `File: ${rev.fileName} (${rev.encoding.toUpperCase()}), uploaded by ${rev.uploadedBy} on ${rev.createdAt.slice(0, 10)}  `,
    `Layout: ${r.layout}`,
    "",
  );
  lines.push("## Summary", "", "| quantity | value |", "|---|---|");
  lines.push(
    `| bodies | ${r.counts.bodies} |`,
    `| contacts | ${r.counts.contacts} |`,
    `| rank | ${r.counts.rank} |`,
    `| freedoms | ${r.counts.freedoms} |`,
    `| redundancies | ${r.counts.redundancies} |`,
  );
  lines.push(
    `| Grübler–Kutzbach 6N − m | ${r.counts.grubler} |`,
    `| conditioning σ_r/σ_max | ${num(r.conditioning)} |`,
    `| characteristic length | ${num(r.scaling.length)} ${u} |`,
    `| centroid | ${vec(r.scaling.centroid, u)} |`,
  );
  const seating = summariseLoadCases(r);
  if (seating) lines.push(`| seating (every load case) | ${seating.text.replace(/^Seating over /, "").replace(/\|/g, "/")} |`);
  if (r.foundation) lines.push(`| foundation coupling | ${num(r.foundation.maxPerMicrometre)} ${fu} per µm |`);
  lines.push("");
  const overridden = Object.entries(rev.overrides);
  if (overridden.length) {
    const rows = data.overrideReasons;
    lines.push("## Rule overrides of the project (in force for this revision)", "", "| rule | severity | options | reason | set by |", "|---|---|---|---|---|");
    for (const [rule, o] of overridden) {
      const why = rows.find((x) => x.rule === rule);
      const opts = o.options
        ? Object.entries(o.options)
            .map(([k, v]) => `${k} = ${JSON.stringify(v)}`)
            .join(", ")
        : "—";
      lines.push(`| ${rule} | ${o.severity ?? "as defined"} | ${opts} | ${(why?.reason ?? "").replace(/\|/g, "/")} | ${why?.who ?? ""} |`);
    }
    lines.push("");
  }
  const solved = r.loadCases.filter((c) => c.seating);
  if (solved.length) {
    // every load case, side by side: a case that fails must be in the record, not only the first
    const ids = [...new Set(solved.flatMap((c) => Object.keys(c.seating!.forces ?? {})))];
    lines.push(
      `## Seated contact forces by load case (${fu})`,
      "",
      `| contact | ${solved.map((c) => c.id).join(" | ")} |`,
      `|---|${solved.map(() => "---").join("|")}|`,
    );
    if (!ids.length) lines.push(`| — | ${solved.map(() => "not held").join(" | ")} |`);
    for (const id of ids) {
      const cells = solved.map((c) =>
        c.seating!.forces === null ? "not held" : c.seating!.liftOff.includes(id) ? "lifts off" : num(c.seating!.forces[id] ?? 0),
      );
      lines.push(`| ${id} | ${cells.join(" | ")} |`);
    }
    lines.push(`| margin | ${solved.map((c) => (c.seating!.forces === null || c.seating!.margin === null ? "—" : num(c.seating!.margin))).join(" | ")} |`, "");
  }
  lines.push(...serviceSections(r));
  lines.push(`## Findings (${rev.findings.length})`, "");
  for (const f of rev.findings) {
    const t = byThread.get(f.threadId);
    lines.push(`### [${f.severity}] ${f.rule}: ${f.title}`, "", `Status: **${t?.status ?? f.status}**${f.loadCase ? ` · load case ${f.loadCase}` : ""}`, "");
    if (t?.status === "waived") lines.push(`Waived by ${t.waivedBy ?? "a checker"}: ${t.waiverReason}`, "");
    // the caution stands once, at the end of the report, not after every finding
    lines.push(f.body.replace(CAUTION, "").replace(/^#+ /gm, "**").trim(), "");
  }
  const waived = rev.findings.filter((f) => byThread.get(f.threadId)?.status === "waived");
  lines.push("## Waivers", "");
  if (!waived.length) lines.push("None.", "");
  for (const f of waived) {
    const t = byThread.get(f.threadId)!;
    lines.push(`- **${f.title}** — ${t.waivedBy}: ${t.waiverReason}`);
  }
  lines.push("", "## Release record", "");
  if (rev.release) {
    lines.push(`Requested by ${rev.release.requestedBy} on ${rev.release.requestedAt.slice(0, 16).replace("T", " ")} UTC.  `);
    lines.push(record ? `Approved by ${record.by} on ${record.at.slice(0, 16).replace("T", " ")} UTC.` : "Not approved.");
  } else lines.push("Not requested; not approved.");
  lines.push("", CAUTION, "");
  return lines.join("\n");
}
