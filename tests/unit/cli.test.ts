/** The CLI: --json for every example validates against the report contract (ajv); exit codes; readable output. */
import { execFileSync, spawnSync } from "node:child_process";
import { existsSync, readFileSync, writeFileSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it, vi } from "vitest";
import Ajv2020 from "ajv/dist/2020";
import { exampleNames } from "../support/examples";

// each case starts a Node process: allow for a busy machine (speed is measured by the bench, not here)
vi.setConfig({ testTimeout: 30_000 });

const shared = "../shared/design/report.schema.json";
const schema = JSON.parse(readFileSync("docs/report.schema.json", "utf8"));
const validate = new Ajv2020({ strict: false, allErrors: true }).compile(schema);

function check(args: string[]) {
  // the bundled CLI (rebuilt by scripts/check.mjs when a source is newer), as `npm run check` runs it
  const r = spawnSync(process.execPath, ["scripts/check.mjs", ...args], { encoding: "utf8", timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe("CLI --json against report.schema.json", () => {
  it("the committed schema is the design contract (no drift)", () => {
    if (existsSync(shared)) expect(JSON.parse(readFileSync(shared, "utf8"))).toEqual(schema);
    else expect(schema.title).toMatch(/report/);
  });

  const files = exampleNames.flatMap((n) => ["json", "xml", "csv"].map((e) => `examples/${n}.${e}`));
  it.each(files)("%s", (file) => {
    const { code, stdout, stderr } = check([file, "--json"]);
    expect([0, 1]).toContain(code);
    const lines = stdout.trim().split("\n");
    expect(lines).toHaveLength(1);
    const report = JSON.parse(lines[0]);
    const ok = validate(report);
    expect(validate.errors ?? [], JSON.stringify(validate.errors)).toEqual([]);
    expect(ok).toBe(true);
    expect(code).toBe(report.findings.some((f: { severity: string }) => f.severity === "error") ? 1 : 0);
    expect(stderr).toMatch(/analysing/);
  });
});

describe("CLI behaviour", () => {
  it("four feet: exit 1, readable counts and screws", () => {
    const { code, stdout } = check(["examples/breadboard-four-feet.json"]);
    expect(code).toBe(1);
    expect(stdout).toMatch(/freedoms 3 {3}redundancies 1/);
    expect(stdout).toMatch(/rotation about \+z through \(300, 225, 0\) mm/);
    expect(stdout).toMatch(/pivot F1: F1 1, F2 -1, F3 1, F4 -1/);
  });

  it("three seats: exit 0", () => {
    expect(check(["examples/breadboard-three-seats.json", "--json"]).code).toBe(0);
  });

  it("a rejected file: exit 2, located errors on stderr, nothing on stdout", () => {
    const dir = mkdtempSync(path.join(tmpdir(), "sixfold-"));
    const bad = path.join(dir, "bad.csv");
    writeFileSync(bad, "id,x,y,z,nx,ny,nz\na,0,0,0,0,0,0\nb,1,x,0,0,0,1\n");
    const { code, stdout, stderr } = check([bad, "--json"]);
    expect(code).toBe(2);
    expect(stdout).toBe("");
    expect(stderr).toMatch(/line 3, column 3 \(y\): 'x' is not a number/);
  });

  it("CSV units from --length and --force reach the report", () => {
    const { stdout } = check(["examples/breadboard-four-feet.csv", "--json", "--length", "in", "--force", "lbf"]);
    expect(JSON.parse(stdout).units).toEqual({ length: "in", force: "lbf" });
  });

  it("refuses an unknown option with exit 2", () => {
    expect(check(["examples/breadboard-four-feet.json", "--frobnicate"]).code).toBe(2);
  });

  it("npm run --silent check prints exactly one JSON object", () => {
    const out = execFileSync("npm", ["run", "--silent", "check", "--", "examples/mirror-cell-three-vee.json", "--json"], {
      encoding: "utf8",
      stdio: ["ignore", "pipe", "ignore"],
    });
    expect(JSON.parse(out).counts).toMatchObject({ rank: 6, freedoms: 0, redundancies: 0 });
  });
});
