/** Meta-test over the rule registry: file name = id, docs, source, valid default options, a test file, order. */
import { existsSync, readFileSync, readdirSync } from "node:fs";
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
    // the wording of the titles lives in message templates, and every template names its values
    expect(Object.keys(rule.meta.messages).length).toBeGreaterThan(0);
    for (const t of Object.values(rule.meta.messages)) expect(t.length).toBeGreaterThan(5);
    const source = readFileSync(`rules/${id}.ts`, "utf8");
    expect(source).toMatch(/title:[\s\S]{0,80}messages\./);
    expect(source).not.toMatch(/title:\s*`/);
  });

  // the helpers of the folder; every other file is a rule and must be registered
  const helpers = ["describe.ts", "index.ts", "types.ts"];
  it("every rule file in rules/ is registered, and every registered rule has its file and test table", () => {
    const files = readdirSync("rules").filter((f) => f.endsWith(".ts") && !helpers.includes(f));
    expect(files.map((f) => f.replace(/\.ts$/, "")).sort()).toEqual(rules.map((r) => r.meta.id).sort());
    const tests = readdirSync("tests/unit/rules").filter((f) => f.endsWith(".test.ts") && f !== "registry.test.ts");
    expect(tests.map((f) => f.replace(/\.test\.ts$/, "")).sort()).toEqual(rules.map((r) => r.meta.id).sort());
  });
});
