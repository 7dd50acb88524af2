/** Number and vector formatting for finding texts and the terminal report: units on every number. */
import type { Vec3 } from "@/lib/layout/model";

/** A number with 4 significant digits (plain notation between 1e-3 and 1e6). */
export function num(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return "0";
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e6) return String(Number(x.toPrecision(digits)));
  return x.toExponential(digits - 1);
}

/** A number with its unit. */
export function qty(x: number, unit: string, digits = 4): string {
  return `${num(x, digits)} ${unit}`;
}

/** A vector as (x, y, z) with an optional unit. */
export function vec(v: Vec3, unit = "", digits = 4): string {
  return `(${v.map((x) => num(x, digits)).join(", ")})${unit ? " " + unit : ""}`;
}

/** A direction, rounded to 3 decimals, e.g. (0, 0, 1). */
export function dir(v: Vec3): string {
  return `(${v.map((x) => String(Number(x.toFixed(3)) || 0)).join(", ")})`;
}

/** Names a unit direction after a coordinate axis when it is one. */
export function axisName(v: Vec3): string | null {
  const names = ["x", "y", "z"];
  for (let i = 0; i < 3; i++) {
    if (Math.abs(Math.abs(v[i]) - 1) < 1e-9) return (v[i] > 0 ? "+" : "−") + names[i];
  }
  return null;
}
