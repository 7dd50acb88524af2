/** Test helpers: build layouts from short specs, and seeded random layouts (including degenerate ones). */
import { validateRaw } from "@/lib/layout/schema";
import type { Layout, Vec3 } from "@/lib/layout/model";

export interface ContactSpec {
  id?: string;
  body?: string;
  on?: string;
  feature?: string;
  p: Vec3;
  n: Vec3;
  sense?: "unilateral" | "bilateral";
  stiffness?: number;
}

/** A validated layout from contact specs (body defaults to "part" on ground). */
export function makeLayout(contacts: ContactSpec[], extra: Record<string, unknown> = {}): Layout {
  const bodies = new Set<string>();
  for (const c of contacts) {
    bodies.add(c.body ?? "part");
    if (c.on && c.on !== "ground") bodies.add(c.on);
  }
  const raw = {
    format: "mount-layout/1",
    name: "test",
    bodies: [...bodies].map((id) => ({ id })),
    contacts: contacts.map((c, i) => ({
      id: c.id ?? `c${String(i + 1).padStart(2, "0")}`,
      body: c.body ?? "part",
      on: c.on ?? "ground",
      ...(c.feature ? { feature: c.feature } : {}),
      point: c.p,
      normal: c.n,
      ...(c.sense ? { sense: c.sense } : {}),
      ...(c.stiffness ? { stiffness: c.stiffness } : {}),
    })),
    ...extra,
  };
  const r = validateRaw(raw);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.layout;
}

/** mulberry32: a small seeded PRNG so random tests repeat exactly. */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A random layout: `bodies` bodies in a chain or tree, 6–7 contacts a body, with a degenerate pattern mixed in. */
export function randomLayout(seed: number, bodies: number): Layout {
  const r = rng(seed);
  const pick = <T>(xs: T[]) => xs[Math.floor(r() * xs.length)];
  const rv = (s = 100): Vec3 => [(r() - 0.5) * s, (r() - 0.5) * s, (r() - 0.5) * s];
  const ids = Array.from({ length: bodies }, (_, i) => `b${i}`);
  const mode = pick(["generic", "parallel", "axis", "coplanar", "generic"]);
  const contacts: ContactSpec[] = [];
  const tree = r() < 0.5;
  ids.forEach((b, i) => {
    const count = 6 + Math.floor(r() * 2) - (r() < 0.2 ? 2 : 0);
    const parent = i === 0 ? "ground" : tree ? ids[Math.floor(r() * i)] : ids[i - 1];
    const origin = rv(300);
    for (let k = 0; k < count; k++) {
      const on = r() < 0.75 ? parent : pick(["ground", ...ids.filter((x) => x !== b)]);
      let p = origin.map((x, j) => x + rv(80)[j]) as Vec3;
      let n = rv(2);
      if (mode === "parallel" && k < 4) n = [0, 0, 1];
      if (mode === "axis" && k < 5) {
        // lines that all meet the z axis through the body origin
        p = [origin[0] + (r() - 0.5) * 50, origin[1], origin[2] + (r() - 0.5) * 50];
        n = [p[0] - origin[0], 0, (r() - 0.5) * 2];
      }
      if (mode === "coplanar" && k < 5) n = [r() - 0.5, r() - 0.5, 0];
      if (Math.hypot(...n) < 1e-3) n = [1, 0, 0];
      contacts.push({ body: b, on, p, n });
    }
  });
  return makeLayout(contacts.map((c, i) => ({ ...c, id: `k${String(i).padStart(4, "0")}` })));
}
