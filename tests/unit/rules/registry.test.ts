/** Meta-test over the rule registry: file name = id, docs, source, valid default options, a test file, order. */
import { existsSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { rules } from "@/rules";
import { severities } from "@/rules/types";

describe("rule registry", () => {
  it("is alphabetical and ids are unique", () => {
    const ids = rules.map((r) => r.meta.id);
    expect(ids).toEqual([...ids].sort());
    expect(new Set(ids).size).toBe(ids.length);
  });
  it.each(rules.map((r) => [r.meta.id, r] as const))("%s is complete", (id, rule) => {
    expect(id).toMatch(/^[a-z]+(-[a-z]+)*$/);
    expect(existsSync(`rules/${id}.ts`)).toBe(true);
    expect(existsSync(`tests/unit/rules/${id}.test.ts`)).toBe(true);
    expect(severities).toContain(rule.meta.severity);
    expect(rule.meta.summary.length).toBeGreaterThan(10);
    expect(rule.meta.explanation.length).toBeGreaterThan(80);
    expect(rule.meta.source.length).toBeGreaterThan(10);
    expect(() => rule.meta.options.parse({})).not.toThrow();
  });
});
