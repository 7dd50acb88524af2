/** Shared wording for findings: motions as markdown tables, contact → feature look-ups, repair hints. */
import type { Layout, Vec3 } from "@/lib/layout/model";
import { GROUND } from "@/lib/layout/model";
import { unitLabel } from "@/lib/layout/units";
import type { Motion } from "@/lib/analysis";
import { axisName, dir, num, vec } from "@/lib/analysis/format";
import { add, cross, norm, scale, sub } from "@/lib/analysis/vec";

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

/** Velocity of a body point under a motion (file units). */
function pointVelocity(m: Motion, bodyId: string, p: Vec3): Vec3 {
  if (bodyId === GROUND) return [0, 0, 0];
  const t = m.twist[bodyId];
  return add(t.v, cross(t.omega, p));
}

/**
 * A contact line that stops a free motion: at the existing contact point (or mass centre) that moves
 * most, along that point's velocity. A contact there has a non-zero row on this twist, so it raises
 * the rank by one and adds no redundancy.
 */
export function stoppingContact(layout: Layout, m: Motion): { point: Vec3; normal: Vec3; body: string; on: string; feature?: string; contact?: string } | null {
  let best: { point: Vec3; normal: Vec3; body: string; on: string; feature?: string; contact?: string; speed: number } | null = null;
  for (const c of layout.contacts) {
    const rel = sub(pointVelocity(m, c.body, c.point), pointVelocity(m, c.on, c.point));
    const speed = norm(rel);
    if (!best || speed > best.speed * (1 + 1e-9))
      best = { point: c.point, normal: scale(rel, 1 / (speed || 1)), body: c.body, on: c.on, feature: c.feature, contact: c.id, speed };
  }
  for (const b of layout.bodies) {
    if (!b.centerOfMass) continue;
    const vel = pointVelocity(m, b.id, b.centerOfMass);
    const speed = norm(vel);
    if (!best || speed > best.speed * (1 + 1e-9)) best = { point: b.centerOfMass, normal: scale(vel, 1 / (speed || 1)), body: b.id, on: GROUND, speed };
  }
  if (!best || best.speed < 1e-12) return null;
  const { speed: _s, ...rest } = best;
  void _s;
  return rest;
}

/** Standard caution for mounts that can hurt someone. */
export const CAUTION =
  "> **Caution.** This result is a design aid for rigid-body constraint and Hertz contact. It does not replace a structural analysis; for heavy or fragile parts, payloads over people and preloaded springs, local codes, company standards and licensed engineering practice decide.";

/** Whether a layout holds enough mass or preload to hurt someone (common practice threshold: 10 kg or any preload). */
export function needsCaution(layout: Layout): boolean {
  const mass = layout.bodies.reduce((s, b) => s + (b.mass ?? 0), 0);
  return mass >= 10 || layout.loads.length > 0;
}
