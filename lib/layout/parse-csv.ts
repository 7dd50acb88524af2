/** CSV encoding (contacts only, header required): csv-parse for the quoting rules, errors by line and column. */
import { parse } from "csv-parse/sync";
import { FORMAT, GROUND, type LayoutError, type Material, type ParseResult } from "./model";
import { readNumber } from "./numbers";
import { validateRaw } from "./schema";
import type { ForceUnit, LengthUnit } from "./units";

const required = ["id", "x", "y", "z", "nx", "ny", "nz"] as const;
const optional = ["body", "on", "sense", "feature", "stiffness", "scatter"] as const;
const known = new Set<string>([...required, ...optional]);
const numeric = new Set(["x", "y", "z", "nx", "ny", "nz", "stiffness", "scatter"]);

export interface CsvOptions {
  length?: LengthUnit;
  force?: ForceUnit;
  name?: string;
  /** the project's materials library (resolved before the built-in table) */
  library?: Material[];
}

/** Parses a CSV contact list; units come from the options (the file carries none). */
export function parseCsvLayout(text: string, options: CsvOptions = {}): ParseResult {
  let records: { record: string[]; info: { lines: number } }[];
  // csv-parse types the `info: true` result loosely; the shape is { record, info }
  try {
    // rows of the wrong width are reported below with the rest, not as the only error
    records = parse(text.replace(/^\uFEFF/, ""), {
      info: true,
      skip_empty_lines: true,
      trim: true,
      relax_quotes: false,
      relax_column_count: true,
    }) as unknown as typeof records;
  } catch (e) {
    const err = e as Error & { lines?: number; code?: string };
    const detail =
      err.code === "CSV_RECORD_INCONSISTENT_FIELDS_LENGTH"
        ? "this row has a different number of columns than the header"
        : err.message.replace(/^Invalid Record Length: /, "");
    return { ok: false, errors: [{ location: `line ${err.lines ?? "?"}`, message: detail }] };
  }
  if (records.length === 0) return { ok: false, errors: [{ location: "line 1", message: "the file is empty; a header row is required" }] };
  const header = records[0].record.map((h) => h.toLowerCase());
  const errors: LayoutError[] = [];
  header.forEach((h, i) => {
    if (!known.has(h)) errors.push({ location: `line 1, column ${i + 1}`, message: `unknown column '${h}' (known: ${[...known].join(", ")})` });
  });
  for (const r of required) if (!header.includes(r)) errors.push({ location: "line 1", message: `required column '${r}' is missing` });
  const dup = header.find((h, i) => header.indexOf(h) !== i);
  if (dup) errors.push({ location: "line 1", message: `column '${dup}' appears twice` });
  if (errors.length) return { ok: false, errors };

  const col = (name: string) => header.indexOf(name);
  const rows = records.slice(1);
  const hasBody = col("body") >= 0;
  const bodies: string[] = [];
  const declare = (b: string) => {
    if (b !== GROUND && !bodies.includes(b)) bodies.push(b);
  };
  const contacts: Record<string, unknown>[] = [];
  const where = new Map<string, string>();
  rows.forEach(({ record, info }, i) => {
    const line = info.lines;
    if (record.length !== header.length) {
      errors.push({ location: `line ${line}`, message: `this row has ${record.length} columns; the header has ${header.length}` });
    }
    const cell = (name: string) => (col(name) >= 0 ? (record[col(name)] ?? "") : "");
    const loc = (name: string) => `line ${line}, column ${col(name) + 1} (${name})`;
    const c: Record<string, unknown> = {};
    where.set(`/contacts/${i}`, `line ${line}`);
    for (const name of header) {
      where.set(`/contacts/${i}/${name}`, loc(name));
      const v = cell(name);
      if (v === "") continue;
      if (numeric.has(name)) {
        const n = readNumber(v);
        if (typeof n === "string") errors.push({ location: loc(name), message: n });
        else c[name] = n;
      } else c[name] = v;
    }
    const body = (c.body as string | undefined) ?? (hasBody ? undefined : "part");
    const on = (c.on as string | undefined) ?? GROUND;
    if (body !== undefined) declare(body);
    declare(on);
    contacts.push({
      id: c.id,
      body,
      on,
      feature: c.feature,
      sense: c.sense,
      stiffness: c.stiffness,
      scatter: c.scatter,
      point: [c.x, c.y, c.z],
      normal: [c.nx, c.ny, c.nz],
    });
    for (const [k, cols] of [
      ["point", ["x", "y", "z"]],
      ["normal", ["nx", "ny", "nz"]],
    ] as const) {
      where.set(`/contacts/${i}/${k}`, `line ${line}, columns ${col(cols[0]) + 1}–${col(cols[2]) + 1} (${cols.join(", ")})`);
      cols.forEach((n, j) => where.set(`/contacts/${i}/${k}/${j}`, loc(n)));
    }
  });
  if (errors.length) return { ok: false, errors: errors.slice(0, 200) };
  const raw = {
    format: FORMAT,
    name: options.name ?? "CSV contact list",
    units: { length: options.length ?? "mm", force: options.force ?? "N" },
    bodies: bodies.map((id) => ({ id })),
    contacts,
  };
  const locate = (p: string) => {
    if (where.has(p)) return where.get(p)!;
    const m = /^\/contacts\/(\d+)/.exec(p);
    if (m && where.has(`/contacts/${m[1]}`)) return where.get(`/contacts/${m[1]}`)!;
    if (p.startsWith("/bodies")) return "column body/on";
    return p;
  };
  return validateRaw(raw, locate, options.library ?? []);
}
