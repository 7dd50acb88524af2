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
