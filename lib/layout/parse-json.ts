/** JSON encoding: parse with line and column on syntax errors, then the shared schema (errors by JSON pointer). */
import type { Material, ParseResult } from "./model";
import { validateRaw } from "./schema";

function lineAndColumn(text: string, offset: number): string {
  const before = text.slice(0, offset);
  const line = before.split("\n").length;
  const column = offset - before.lastIndexOf("\n");
  return `line ${line}, column ${column}`;
}

/** Parses a JSON mount layout. */
export function parseJsonLayout(text: string, library: Material[] = []): ParseResult {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    const msg = (e as Error).message;
    const pos = /position (\d+)/.exec(msg);
    const where = pos ? lineAndColumn(text, Number(pos[1])) : "/";
    const why = e instanceof RangeError ? "the JSON is nested too deeply" : `the file is not valid JSON (${msg.replace(/ in JSON at position \d+.*$/, "")})`;
    return { ok: false, errors: [{ location: where, message: why }] };
  }
  if (typeof raw !== "object" || raw === null || Array.isArray(raw)) {
    return { ok: false, errors: [{ location: "/", message: "the file must hold one JSON object" }] };
  }
  return validateRaw(raw, undefined, library);
}
