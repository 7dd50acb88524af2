/** Writes a layout back out as mount-layout/1 JSON, XML or CSV (contacts only). */
import type { Layout, Vec3 } from "./model";

const v3 = (v: Vec3) => v.map((x) => String(x)).join(" ");
const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/"/g, "&quot;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
const attrs = (pairs: [string, string | number | undefined][]) =>
  pairs
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => `${k}="${esc(String(v))}"`)
    .join(" ");

/** JSON, two-space indented, with short arrays (vectors, radii pairs) kept on one line. */
export function toJson(layout: Layout): string {
  return pretty(JSON.parse(JSON.stringify(layout)), "") + "\n";
}

function pretty(value: unknown, indent: string): string {
  const flat = (v: unknown): boolean => v === null || typeof v !== "object" || (Array.isArray(v) && v.every(flat) && JSON.stringify(v).length < 60);
  if (flat(value)) return Array.isArray(value) ? `[${value.map((v) => pretty(v, indent)).join(", ")}]` : JSON.stringify(value);
  const inner = indent + "  ";
  if (Array.isArray(value)) {
    const smallObjects = value.every((v) => v && typeof v === "object" && !Array.isArray(v) && JSON.stringify(v).length < 110);
    if (smallObjects) {
      const line = (o: Record<string, unknown>) =>
        `{${Object.entries(o)
          .filter(([, v]) => v !== undefined)
          .map(([k, v]) => `${JSON.stringify(k)}: ${pretty(v, inner)}`)
          .join(", ")}}`;
      return `[\n${value.map((v) => inner + line(v as Record<string, unknown>)).join(",\n")}\n${indent}]`;
    }
    return `[\n${value.map((v) => inner + pretty(v, inner)).join(",\n")}\n${indent}]`;
  }
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
  return `{\n${entries.map(([k, v]) => `${inner}${JSON.stringify(k)}: ${pretty(v, inner)}`).join(",\n")}\n${indent}}`;
}

/** XML, attribute-based. */
export function toXml(layout: Layout): string {
  const out: string[] = ['<?xml version="1.0" encoding="UTF-8"?>'];
  out.push(
    `<mount-layout ${attrs([
      ["format", layout.format],
      ["name", layout.name],
      ["length", layout.units.length],
      ["force", layout.units.force],
      ["gravity", v3(layout.gravity)],
      ["tolerance", layout.tolerance],
      ["intended-freedoms", layout.intendedFreedoms || undefined],
      ["ground-material", layout.groundMaterial],
      ["temperature-swing", layout.temperatureSwing],
      ["default-scatter", layout.defaultScatter],
    ])}>`,
  );
  for (const b of layout.bodies)
    out.push(
      `  <body ${attrs([
        ["id", b.id],
        ["mass", b.mass],
        ["center-of-mass", b.centerOfMass && v3(b.centerOfMass)],
        ["material", b.material],
      ])}/>`,
    );
  for (const m of layout.materials)
    out.push(
      `  <material ${attrs([
        ["id", m.id],
        ["youngs-modulus-gpa", m.youngsModulusGPa],
        ["poisson-ratio", m.poissonRatio],
        ["allowable-contact-pressure-mpa", m.allowableContactPressureMPa],
        ["expansion-per-k", m.expansionPerK],
      ])}/>`,
    );
  for (const c of layout.contacts) {
    const a = attrs([
      ["id", c.id],
      ["body", c.body],
      ["on", c.on],
      ["feature", c.feature],
      ["point", v3(c.point)],
      ["normal", v3(c.normal)],
      ["sense", c.sense === "bilateral" ? "bilateral" : undefined],
      ["stiffness", c.stiffness],
      ["scatter", c.scatter],
    ]);
    if (!c.hertz) out.push(`  <contact ${a}/>`);
    else {
      const r = (pair: (number | null)[]) => pair.map((x) => (x === null ? "flat" : String(x))).join(" ");
      out.push(`  <contact ${a}>`);
      out.push(
        `    <hertz ${attrs([
          ["body-radii", r(c.hertz.radii[0])],
          ["on-radii", r(c.hertz.radii[1])],
          ["angle-deg", c.hertz.angleDeg],
          ["materials", c.hertz.materials.join(" ")],
        ])}/>`,
      );
      out.push("  </contact>");
    }
  }
  for (const f of layout.flexures ?? []) {
    const ends: [string, string | number | undefined][] =
      f.kind === "wire"
        ? [
            ["from", v3(f.from)],
            ["to", v3(f.to)],
            ["diameter", f.diameter],
          ]
        : [
            ["root", v3(f.root)],
            ["tip", v3(f.tip)],
            ["width-direction", v3(f.widthDirection)],
            ["width", f.width],
            ["thickness", f.thickness],
          ];
    out.push(
      `  <flexure ${attrs([["id", f.id], ["kind", f.kind], ["body", f.body], ["on", f.on], ["feature", f.feature], ...ends, ["material", f.material], ["scatter", f.scatter]])}/>`,
    );
  }
  for (const l of layout.loads)
    out.push(
      `  <load ${attrs([
        ["id", l.id],
        ["body", l.body],
        ["force", v3(l.force)],
        ["point", v3(l.point)],
        ["moment", l.moment && v3(l.moment)],
      ])}/>`,
    );
  for (const p of layout.points)
    out.push(
      `  <point ${attrs([
        ["id", p.id],
        ["body", p.body],
        ["at", v3(p.point)],
        ["allowance", p.allowance],
      ])}/>`,
    );
  for (const lc of layout.loadCases ?? [])
    out.push(
      `  <load-case ${attrs([
        ["id", lc.id],
        ["gravity", v3(lc.gravity)],
        ["loads", lc.loads?.join(" ")],
      ])}/>`,
    );
  out.push("</mount-layout>", "");
  return out.join("\n");
}

/** CSV of the contacts (units are not in the file: give them at upload). */
export function toCsv(layout: Layout): string {
  const hasStiffness = layout.contacts.some((c) => c.stiffness !== undefined);
  const hasScatter = layout.contacts.some((c) => c.scatter !== undefined);
  const header = [
    "id",
    "body",
    "on",
    "x",
    "y",
    "z",
    "nx",
    "ny",
    "nz",
    "sense",
    "feature",
    ...(hasStiffness ? ["stiffness"] : []),
    ...(hasScatter ? ["scatter"] : []),
  ];
  const q = (s: string) => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
  const rows = layout.contacts.map((c) =>
    [
      c.id,
      c.body,
      c.on,
      ...c.point.map(String),
      ...c.normal.map(String),
      c.sense,
      c.feature ?? "",
      ...(hasStiffness ? [c.stiffness === undefined ? "" : String(c.stiffness)] : []),
      ...(hasScatter ? [c.scatter === undefined ? "" : String(c.scatter)] : []),
    ]
      .map(q)
      .join(","),
  );
  return [header.join(","), ...rows, ""].join("\n");
}
