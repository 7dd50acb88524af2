/** Shared wording for findings: motions as markdown tables, contact → feature look-ups, repair hints. */
import type { Layout } from "@/lib/layout/model";
import { unitLabel } from "@/lib/layout/units";
import type { Motion } from "@/lib/analysis";
import { axisName, dir, num, vec } from "@/lib/analysis/format";

/** Features of the given contacts, sorted and unique. */
export function featuresOf(layout: Layout, contactIds: string[]): string[] {
  const set = new Set<string>();
  for (const c of layout.contacts) if (contactIds.includes(c.id) && c.feature) set.add(c.feature);
  return [...set].sort();
}

/**
 * Names of the given rows as a reviewer knows them: a flexure's rows collapse into the flexure's id
 * ("leaf-front" rather than "leaf-front.a, leaf-front.b"); contacts keep their own ids. Order kept.
 */
export function rowNames(layout: Layout, rowIds: string[]): string[] {
  const byId = new Map(layout.contacts.map((c) => [c.id, c]));
  const out: string[] = [];
  for (const id of rowIds) {
    const name = byId.get(id)?.flexure ?? id;
    if (!out.includes(name)) out.push(name);
  }
  return out;
}

/** One row's label for tables: the contact id, or "row of flexure X" for a generated row. */
export function rowLabel(layout: Layout, rowId: string): string {
  const f = layout.contacts.find((c) => c.id === rowId)?.flexure;
  return f && f !== rowId ? `${rowId} (flexure ${f})` : f ? `${rowId} (flexure)` : rowId;
}

/** Bodies that move in a motion. */
export function movingBodies(m: Motion): string[] {
  return Object.entries(m.screws)
    .filter(([, s]) => s.kind !== "still")
    .map(([id]) => id);
}

/** One line describing a body's screw, with units. */
export function screwText(m: Motion, bodyId: string, lengthUnit: string): string {
  const s = m.screws[bodyId];
  const u = unitLabel(lengthUnit as "mm");
  if (s.kind === "still") return "does not move";
  const d = s.direction!;
  const named = axisName(d);
  if (s.kind === "translation") return `translation along ${named ?? dir(d)}`;
  const axis = `axis ${named ?? dir(d)} through ${vec(s.point!, u)}`;
  if (s.kind === "rotation") return `rotation about ${axis}`;
  return `screw about ${axis}, pitch ${num(s.pitch!)} ${u}/rad`;
}

/** A markdown table of motions (one row per motion and moving body). */
export function motionTable(motions: Motion[], lengthUnit: string): string {
  const rows = ["| # | body | motion |", "|---|---|---|"];
  motions.forEach((m, i) => {
    for (const b of movingBodies(m)) rows.push(`| ${i + 1} | ${b} | ${screwText(m, b, lengthUnit)} |`);
  });
  return rows.join("\n");
}
