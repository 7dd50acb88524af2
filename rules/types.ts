/** The rule framework: defineRule, metadata, options with zod defaults, findings with stable fingerprints. */
import type { z } from "zod";
import type { Layout } from "@/lib/layout/model";
import type { EngineAnalysis } from "@/lib/analysis";

import { severities, type Severity } from "@/lib/contracts/enums";

export { severities, type Severity };

export interface RuleMeta<O> {
  /** kebab-case id, equal to the file name */
  id: string;
  severity: Severity;
  /** one line: what the rule checks */
  summary: string;
  /** markdown: why it matters and how the check works */
  explanation: string;
  /** the published source of the method */
  source: string;
  /** options schema; parsing `{}` gives the defaults */
  options: z.ZodType<O>;
  /** message templates of the finding titles, `{name}` filled by `fill` (wording lives here, not in the check) */
  messages: Record<string, string>;
}

/** What a rule's check reports; the runner adds rule id, severity and fingerprint. */
export interface FindingDraft {
  title: string;
  /** markdown with numbers and units */
  body: string;
  contacts?: string[];
  features?: string[];
  bodies?: string[];
  /** self-stress pivot contact, part of the fingerprint */
  pivot?: string;
  /** load case id, part of the fingerprint */
  loadCase?: string;
  /** further ids that identify this finding (beyond contacts, features and bodies) */
  keys?: string[];
  /** a severity other than the rule's default, for rules that escalate (a project override still wins) */
  severity?: Severity;
}

export interface Finding {
  rule: string;
  severity: Severity;
  title: string;
  fingerprint: string;
  contacts: string[];
  features: string[];
  bodies: string[];
  loadCase?: string;
  body: string;
}

export interface RuleContext<O> {
  layout: Layout;
  analysis: EngineAnalysis;
  options: O;
}

export interface Rule<O = unknown> {
  meta: RuleMeta<O>;
  check(ctx: RuleContext<O>): FindingDraft[];
}

/** Declares a rule (identity at run time; gives the check its typed options). */
export function defineRule<O>(rule: Rule<O>): Rule<O> {
  return rule;
}

/** A stable fingerprint: rule id + sorted involved ids (+ pivot, + load case). */
export function fingerprintOf(ruleId: string, d: FindingDraft): string {
  const ids = [
    ...new Set([...(d.contacts ?? []), ...(d.features ?? []).map((f) => `feature:${f}`), ...(d.bodies ?? []).map((b) => `body:${b}`), ...(d.keys ?? [])]),
  ].sort();
  let fp = `${ruleId}|${ids.join(",")}`;
  if (d.pivot) fp += `|pivot:${d.pivot}`;
  if (d.loadCase) fp += `|case:${d.loadCase}`;
  return fp;
}

/** Fills a message template's `{name}` placeholders; a placeholder without a value is a programming error. */
export function fill(template: string, values: Record<string, string | number>): string {
  return template.replace(/\{(\w+)\}/g, (_m, key: string) => {
    if (!(key in values)) throw new Error(`message template "${template}" needs a value for {${key}}`);
    return String(values[key]);
  });
}
