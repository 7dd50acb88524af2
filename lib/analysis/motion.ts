/** Geometry of free motions: the velocity of a body point, and the contact line that would stop a motion. */
import type { Layout, Vec3 } from "@/lib/layout/model";
import { GROUND } from "@/lib/layout/model";
import type { Motion } from "./constraint";
import { add, cross, norm, scale, sub } from "./vec";

/** Velocity of a body point under a motion (file units). */
export function pointVelocity(m: Motion, bodyId: string, p: Vec3): Vec3 {
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
