/**
 * Coupling geometry (analysis.md §6): couplings recognised from feature groups (2 contacts = vee,
 * 3 = socket or trihedral, 1 = flat), the coupling triangle, each vee's groove axis against its
 * guideline, and the contact angles.
 */
import type { Layout, Vec3 } from "@/lib/layout/model";
import { cross, dot, norm, scale, sub, unit } from "./vec";

export interface SeatGeometry {
  feature: string;
  kind: "vee" | "socket" | "flat";
  centre: Vec3;
  contacts: string[];
  /** vees: acute angle (deg) between the groove axis (in the triangle plane) and the guideline */
  grooveOffDeg?: number;
  guideline?: string;
}

export interface CouplingResult {
  body: string;
  on: string;
  kind: "three-vee" | "socket-vee-flat";
  seats: SeatGeometry[];
  /** angle between each contact normal and the triangle plane's normal (deg) */
  contactAnglesDeg: Record<string, number>;
}

const deg = (rad: number) => (rad * 180) / Math.PI;
const acute = (a: Vec3, b: Vec3) => {
  const c = Math.min(1, Math.abs(dot(unit(a), unit(b))));
  return deg(Math.acos(c));
};

/** Finds three-vee and socket–vee–flat couplings between each body pair. */
export function analyseCouplings(layout: Layout): CouplingResult[] {
  const groups = new Map<string, Map<string, Layout["contacts"]>>();
  for (const c of layout.contacts) {
    if (!c.feature) continue;
    const pair = `${c.body}\u0000${c.on}`;
    if (!groups.has(pair)) groups.set(pair, new Map());
    const g = groups.get(pair)!;
    if (!g.has(c.feature)) g.set(c.feature, []);
    g.get(c.feature)!.push(c);
  }
  const out: CouplingResult[] = [];
  for (const [pair, features] of groups) {
    if (features.size !== 3) continue;
    const seats: SeatGeometry[] = [...features.entries()].map(([feature, cs]) => ({
      feature,
      kind: cs.length === 2 ? "vee" : cs.length === 3 ? "socket" : "flat",
      centre: scale(
        cs.reduce((s, c) => [s[0] + c.point[0], s[1] + c.point[1], s[2] + c.point[2]] as Vec3, [0, 0, 0] as Vec3),
        1 / cs.length,
      ),
      contacts: cs.map((c) => c.id),
    }));
    const sizes = [...features.values()]
      .map((cs) => cs.length)
      .sort()
      .join("");
    if (sizes !== "222" && sizes !== "123") continue;
    const kind = sizes === "222" ? "three-vee" : "socket-vee-flat";
    const [p0, p1, p2] = seats.map((s) => s.centre);
    let planeN = cross(sub(p1, p0), sub(p2, p0));
    if (norm(planeN) === 0) continue;
    planeN = unit(planeN);
    const inPlane = (v: Vec3) => sub(v, scale(planeN, dot(v, planeN)));
    const byId = new Map(layout.contacts.map((c) => [c.id, c]));
    seats.forEach((seat, i) => {
      if (seat.kind !== "vee") return;
      const [a, b] = seat.contacts.map((id) => unit(byId.get(id)!.normal));
      const groove = inPlane(cross(a, b));
      if (norm(groove) < 1e-12) return;
      let guide: Vec3;
      if (kind === "three-vee") {
        const others = seats.filter((_, j) => j !== i).map((s) => unit(sub(s.centre, seat.centre)));
        guide = inPlane(add3(others[0], others[1]));
        seat.guideline = "bisector of the coupling triangle's angle at this seat";
      } else {
        const socket = seats.find((s) => s.kind === "socket")!;
        guide = inPlane(sub(socket.centre, seat.centre));
        seat.guideline = `line from this vee to the socket ${socket.feature}`;
      }
      seat.grooveOffDeg = acute(groove, guide);
    });
    const contactAnglesDeg: Record<string, number> = {};
    for (const s of seats) for (const id of s.contacts) contactAnglesDeg[id] = acute(byId.get(id)!.normal, planeN);
    const [body, on] = pair.split("\u0000");
    out.push({ body, on, kind, seats, contactAnglesDeg });
  }
  return out;
}

const add3 = (a: Vec3, b: Vec3): Vec3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
