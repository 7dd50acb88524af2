/**
 * The command-line checker: `npm run --silent check -- <file> [--json] [--length mm] [--force N]`.
 * Exit 0: no error finding; 1: an error finding; 2: the file was rejected (located errors on stderr).
 */
import { readFileSync, statSync } from "node:fs";
import { parseLayoutBytes, lengthUnits, forceUnits, type Encoding } from "@/lib/layout";
import type { ForceUnit, LengthUnit } from "@/lib/layout/units";
import { runEngine } from "@/lib/engine";
import { renderText } from "./render-text";

const usage = "usage: npm run --silent check -- <file> [--json] [--length m|mm|um|in] [--force N|kN|lbf] [--encoding json|xml|csv]";

function fail(message: string, code = 2): never {
  process.stderr.write(message + "\n");
  process.exit(code);
}

function main(argv: string[]): void {
  let file: string | undefined;
  let json = false;
  let length: LengthUnit | undefined;
  let force: ForceUnit | undefined;
  let encoding: Encoding | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "--json") json = true;
    else if (a === "--length") {
      const v = argv[++i];
      if (!lengthUnits.includes(v as LengthUnit)) fail(`--length must be one of ${lengthUnits.join(", ")}\n${usage}`);
      length = v as LengthUnit;
    } else if (a === "--force") {
      const v = argv[++i];
      if (!forceUnits.includes(v as ForceUnit)) fail(`--force must be one of ${forceUnits.join(", ")}\n${usage}`);
      force = v as ForceUnit;
    } else if (a === "--encoding") {
      const v = argv[++i];
      if (!["json", "xml", "csv"].includes(v)) fail(`--encoding must be json, xml or csv\n${usage}`);
      encoding = v as Encoding;
    } else if (a === "--help" || a === "-h") {
      process.stdout.write(usage + "\n");
      process.exit(0);
    } else if (a.startsWith("--")) fail(`unknown option ${a}\n${usage}`);
    else if (!file) file = a;
    else fail(`only one file at a time\n${usage}`);
  }
  if (!file) fail(usage);
  let bytes: Uint8Array;
  try {
    if (statSync(file).size > 64 * 1024 * 1024) fail(`${file}: the file is far over the 5 MB limit`);
    bytes = readFileSync(file);
  } catch (e) {
    fail(`${file}: cannot read the file (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  const parsed = parseLayoutBytes(bytes, { fileName: file, length, force, encoding });
  if (!parsed.ok) {
    process.stderr.write(`${file}: rejected, ${parsed.errors.length} error${parsed.errors.length === 1 ? "" : "s"}\n`);
    for (const e of parsed.errors) process.stderr.write(`  ${e.location}: ${e.message}\n`);
    process.exit(2);
  }
  for (const w of parsed.warnings) process.stderr.write(`warning: ${w}\n`);
  if (json) process.stderr.write(`analysing ${parsed.layout.bodies.length} bodies, ${parsed.layout.contacts.length} contacts…\n`);
  const { report } = runEngine(parsed.layout);
  if (json) process.stdout.write(JSON.stringify(report) + "\n");
  else process.stdout.write(renderText(report));
  process.exitCode = report.findings.some((f) => f.severity === "error") ? 1 : 0;
}

main(process.argv.slice(2));
