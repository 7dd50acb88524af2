/** A table-driven rule tester: layouts that must give no finding, and layouts that must give the listed ones. */
import { describe, expect, it } from "vitest";
import { analyseLayout } from "@/lib/analysis";
import type { Layout } from "@/lib/layout/model";
import { runRules } from "@/rules";
import type { Rule } from "@/rules/types";

export interface Expected {
  title?: RegExp;
  contacts?: string[];
  body?: RegExp[];
  pivot?: string;
  /** for rules that escalate a finding above their default severity */
  severity?: "error" | "warning" | "info";
}

export interface RuleCases {
  valid: { name: string; layout: Layout; options?: Record<string, unknown> }[];
  invalid: { name: string; layout: Layout; options?: Record<string, unknown>; findings: Expected[] }[];
}

/** Runs a rule's test table through the real runner (so fingerprints and severities are the shipped ones). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- justified: the tester takes a rule of any option type
export function testRule(rule: Rule<any>, cases: RuleCases): void {
  const run = (layout: Layout, options?: Record<string, unknown>) =>
    runRules(analyseLayout(layout), options ? { [rule.meta.id]: { options } } : {}).filter((f) => f.rule === rule.meta.id);
  describe(rule.meta.id, () => {
    it.each(cases.valid.map((c) => [c.name, c] as const))("no finding: %s", (_n, c) => {
      expect(run(c.layout, c.options)).toEqual([]);
    });
    it.each(cases.invalid.map((c) => [c.name, c] as const))("finds: %s", (_n, c) => {
      const found = run(c.layout, c.options);
      expect(found).toHaveLength(c.findings.length);
      c.findings.forEach((e, i) => {
        const f = found[i];
        expect(f.severity).toBe(e.severity ?? rule.meta.severity);
        expect(f.fingerprint.startsWith(rule.meta.id)).toBe(true);
        if (e.title) expect(f.title).toMatch(e.title);
        if (e.contacts) expect(f.contacts).toEqual(e.contacts);
        if (e.pivot) expect(f.fingerprint).toContain(`pivot:${e.pivot}`);
        for (const b of e.body ?? []) expect(f.body).toMatch(b);
      });
      // fingerprints are stable: the same layout gives the same fingerprints
      expect(run(c.layout, c.options).map((f) => f.fingerprint)).toEqual(found.map((f) => f.fingerprint));
    });
  });
}
