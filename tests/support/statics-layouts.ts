/** Small statics layouts for rule tables. */
import { validateRaw } from "@/lib/layout/schema";
import type { Layout } from "@/lib/layout/model";

/** A validated layout from raw fields (format and name filled in). */
export function rawLayout(raw: Record<string, unknown>): Layout {
  const r = validateRaw({ format: "mount-layout/1", name: "t", ...raw });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.layout;
}

/** A plate on vertical supports at the given (x, y) points with an optional load and stiffness. */
export function plate(pts: [number, number][], load?: [number, number, number], k?: number, extra: Record<string, unknown> = {}): Layout {
  return rawLayout({
    bodies: [{ id: "plate" }],
    contacts: pts.map(([x, y], i) => ({
      id: `S${i + 1}`,
      body: "plate",
      feature: `seat-${i + 1}`,
      point: [x, y, 0],
      normal: [0, 0, 1],
      ...(k ? { stiffness: k } : {}),
    })),
    loads: load ? [{ id: "P", body: "plate", force: [0, 0, -load[2]], point: [load[0], load[1], 0] }] : [],
    ...extra,
  });
}

/** A plate held 3-2-1 by six orthogonal rows: three vertical seats, two stops along y, one along x, at the origin corner. */
export const plate321Rows = [
  { id: "Z1", body: "plate", point: [0, 0, 0], normal: [0, 0, 1] },
  { id: "Z2", body: "plate", point: [100, 0, 0], normal: [0, 0, 1] },
  { id: "Z3", body: "plate", point: [0, 100, 0], normal: [0, 0, 1] },
  { id: "X1", body: "plate", point: [0, 0, 0], normal: [1, 0, 0] },
  { id: "Y1", body: "plate", point: [0, 0, 0], normal: [0, 1, 0] },
  { id: "Y2", body: "plate", point: [100, 0, 0], normal: [0, 1, 0] },
];
