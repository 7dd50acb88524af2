/** Strict number and vector reading for XML and CSV text: JSON number syntax only. */

const jsonNumber = /^-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?$/;

/** Parses one number in JSON syntax; returns an error sentence instead when it is not one. */
export function readNumber(text: string): number | string {
  const t = text.trim();
  if (!jsonNumber.test(t)) return `'${t.slice(0, 40)}' is not a number (use JSON number syntax, e.g. 12.5 or 1e-3)`;
  const v = Number(t);
  if (!Number.isFinite(v)) return `'${t.slice(0, 40)}' is too large to be a finite number`;
  return v;
}

/** Parses "x y z" (space-separated) into three numbers; `allowFlat` maps the word "flat" to null. */
export function readList(text: string, count: number, allowFlat = false): (number | null)[] | string {
  const parts = text.trim().split(/\s+/).filter(Boolean);
  if (parts.length !== count) return `needs ${count} space-separated values, found ${parts.length}`;
  const out: (number | null)[] = [];
  for (const p of parts) {
    if (allowFlat && p === "flat") {
      out.push(null);
      continue;
    }
    const v = readNumber(p);
    if (typeof v === "string") return v;
    out.push(v);
  }
  return out;
}
