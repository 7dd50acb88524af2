/**
 * Project rule overrides: an admin changes a rule's severity or options for one project, with a reason.
 * Rows are append-only (a change or a clearing is a new row), so the history says who changed what and when;
 * the override in force is the newest row per rule unless that row clears it. Uploads analyse with the
 * overrides in force and keep a copy on the revision.
 */
import "server-only";
import { db } from "./knex";
import { iso } from "./rows";
import { forbidden, invalid, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import type { SessionUser } from "@/lib/auth/session";
import { rules, type RuleOverride } from "@/rules";
import type { Severity } from "@/rules/types";
import type { OverrideInput, OverrideDto } from "@/lib/contracts/overrides";
export type { OverrideInput, OverrideDto } from "@/lib/contracts/overrides";
export { overrideInputSchema } from "@/lib/contracts/overrides";

/** What the form offers: every rule with its default severity and default options. */
export function ruleCatalogue(): { id: string; severity: Severity; summary: string; defaults: Record<string, unknown> }[] {
  return rules.map((r) => ({
    id: r.meta.id,
    severity: r.meta.severity,
    summary: r.meta.summary,
    defaults: r.meta.options.parse({}) as Record<string, unknown>,
  }));
}

/** A rule-override row joined with the name of who set it. */
interface OverrideRow {
  id: number;
  project_id: number;
  rule: string;
  severity: Severity | null;
  options: string | null;
  cleared: number | boolean;
  reason: string;
  set_by: number;
  set_by_name: string | null;
  created_at: Date;
}
const metaOf = (id: string) => rules.find((r) => r.meta.id === id)?.meta;

function toDto(r: OverrideRow): OverrideDto {
  return {
    id: r.id,
    rule: r.rule,
    defaultSeverity: metaOf(r.rule)?.severity ?? "info",
    severity: r.severity ?? null,
    options: r.options ? (JSON.parse(r.options) as Record<string, unknown>) : null,
    cleared: !!r.cleared,
    reason: r.reason,
    setBy: r.set_by_name ?? "",
    setAt: iso(r.created_at),
  };
}

/** The overrides in force (newest row per rule, unless it clears) and the whole history, newest first. Every role reads them. */
export async function listOverrides(_user: SessionUser, projectId: number): Promise<{ current: OverrideDto[]; history: OverrideDto[] }> {
  if (!(await db()("projects").where({ id: projectId }).first())) throw notFound("That project");
  return readOverrides(projectId);
}

async function readOverrides(projectId: number): Promise<{ current: OverrideDto[]; history: OverrideDto[] }> {
  const rows: OverrideRow[] = await db()("rule_overrides as o")
    .join("users as u", "u.id", "o.set_by")
    .where("o.project_id", projectId)
    .select("o.*", "u.name as set_by_name")
    .orderBy("o.id", "desc");
  const history = rows.map(toDto);
  const seen = new Set<string>();
  const current: OverrideDto[] = [];
  for (const o of history) {
    if (seen.has(o.rule)) continue;
    seen.add(o.rule);
    if (!o.cleared) current.push(o);
  }
  return { current: current.sort((a, b) => a.rule.localeCompare(b.rule)), history };
}

/** Checks options against the rule's own schema; unknown option names are refused, not dropped. */
function checkedOptions(ruleId: string, options: Record<string, unknown>): Record<string, unknown> {
  const meta = metaOf(ruleId)!;
  const known = Object.keys(meta.options.parse({}) as Record<string, unknown>);
  const unknown = Object.keys(options).filter((k) => !known.includes(k));
  if (unknown.length) {
    throw invalid(`"${ruleId}" has no option ${unknown.map((k) => `"${k}"`).join(", ")}.`, {
      fieldErrors: { options: [known.length ? `Known options: ${known.join(", ")}.` : "This rule takes no options."] },
    });
  }
  const parsed = meta.options.safeParse(options);
  if (!parsed.success) {
    const msgs = parsed.error.issues.map((i) => `${i.path.join(".") || "options"}: ${i.message}`);
    throw invalid(`Those options do not fit "${ruleId}".`, { fieldErrors: { options: msgs } });
  }
  return options;
}

/** Sets or clears one rule's override in a project (admins only). */
export async function changeOverride(user: SessionUser, projectId: number, input: OverrideInput): Promise<OverrideDto> {
  if (!allowed(user.role, "overrideRules")) throw forbidden("Only administrators change rule overrides.");
  if (!(await db()("projects").where({ id: projectId }).first())) throw notFound("That project");
  const meta = metaOf(input.rule);
  if (!meta) throw invalid(`There is no rule "${input.rule}".`, { fieldErrors: { rule: ["Pick one of the listed rules."] } });
  let row: Record<string, unknown>;
  if (input.action === "clear") {
    const { current } = await readOverrides(projectId);
    if (!current.some((o) => o.rule === input.rule))
      throw invalid(`No override of "${input.rule}" is in force in this project.`, { fieldErrors: { rule: ["Nothing to clear."] } });
    row = { project_id: projectId, rule: input.rule, severity: null, options: null, cleared: true, reason: input.reason, set_by: user.id };
  } else {
    const options = input.options && Object.keys(input.options).length ? checkedOptions(input.rule, input.options) : null;
    const severity = input.severity && input.severity !== meta.severity ? input.severity : null;
    if (!severity && !options)
      throw invalid(
        "Change the severity or give options; an override that changes nothing is not stored (to return to the rule's own setting, clear its override).",
        { fieldErrors: { severity: ["Pick a severity other than the rule's own, or give options."] } },
      );
    row = {
      project_id: projectId,
      rule: input.rule,
      severity,
      options: options ? JSON.stringify(options) : null,
      cleared: false,
      reason: input.reason,
      set_by: user.id,
    };
  }
  const [id] = await db()("rule_overrides").insert(row);
  const stored = await db()("rule_overrides as o").join("users as u", "u.id", "o.set_by").where("o.id", id).select("o.*", "u.name as set_by_name").first();
  return toDto(stored);
}

/** The overrides in force for the project a layout belongs to, in the engine's form. */
export async function overridesForLayout(layoutId: number): Promise<Record<string, RuleOverride>> {
  const layout = await db()("layouts").where({ id: layoutId }).select("project_id").first();
  if (!layout) return {};
  const { current } = await readOverrides(layout.project_id as number);
  return Object.fromEntries(current.map((o) => [o.rule, { ...(o.severity ? { severity: o.severity } : {}), ...(o.options ? { options: o.options } : {}) }]));
}
