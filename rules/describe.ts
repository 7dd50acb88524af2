/** Shared wording for findings: motions as markdown tables, contact → feature look-ups, repair hints. */
import type { Layout } from "@/lib/layout/model";
import { unitLabel } from "@/lib/layout/units";
import type { Motion } from "@/lib/analysis";
import { axisName, dir, num, vec } from "@/lib/analysis/format";

/** The layout's rows by id, built once a layout (rules look rows up thousands of times on a whole instrument). */
const rowIndex = new WeakMap<Layout, Map<string, Layout["contacts"][number]>>();
function rowsById(layout: Layout): Map<string, Layout["contacts"][number]> {
  let m = rowIndex.get(layout);
  if (!m) rowIndex.set(layout, (m = new Map(layout.contacts.map((c) => [c.id, c]))));
  return m;
}

/** Features of the given contacts, sorted and unique. */
export function featuresOf(layout: Layout, contactIds: string[]): string[] {
  const set = new Set<string>();
  const byId = rowsById(layout);
  for (const id of contactIds) {
    const f = byId.get(id)?.feature;
    if (f) set.add(f);
  }
  return [...set].sort();
}

/**
 * Names of the given rows as a reviewer knows them: a flexure's rows collapse into the flexure's id
 * ("leaf-front" rather than "leaf-front.a, leaf-front.b"); contacts keep their own ids. Order kept.
 */
export function rowNames(layout: Layout, rowIds: string[]): string[] {
  const byId = rowsById(layout);
  const out = new Set<string>();
  for (const id of rowIds) out.add(byId.get(id)?.flexure ?? id);
  return [...out];
}

/** Ids for a sentence: all of them when few, else the first ten "and N more" (a whole instrument has thousands). */
export function listIds(ids: string[], max = 12): string {
  return ids.length > max ? `${ids.slice(0, max - 2).join(", ")} and ${ids.length - (max - 2)} more` : ids.join(", ");
}

/** The ids of the `max` largest |value|, kept in their given order (finding tables stay readable on a whole instrument). */
export function largestRows(ids: string[], value: (id: string) => number, max = 40): string[] {
  if (ids.length <= max) return ids;
  const keep = new Set(
    ids
      .slice()
      .sort((a, b) => Math.abs(value(b)) - Math.abs(value(a)))
      .slice(0, max),
  );
  return ids.filter((id) => keep.has(id));
}

/** One row's label for tables: the contact id, or "row of flexure X" for a generated row. */
export function rowLabel(layout: Layout, rowId: string): string {
  const f = rowsById(layout).get(rowId)?.flexure;
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
