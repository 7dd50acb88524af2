/**
 * Flexure elements → bilateral constraint rows (analysis.md §10): ids, points, normals and stiffness.
 * The expansion is fixed by the design contract (order and ids), so other tools get the same rows.
 */
import { builtinMaterials } from "./materials";
import { metresPer, newtonsPer } from "./units";
import { add, dot, norm as len, scale as mul, sub } from "@/lib/analysis/vec";
import type { BladeFlexure, Contact, Flexure, Layout, Vec3 } from "./model";

/** Relative size below which a blade's width direction counts as parallel to its length. */
export const WIDTH_PARALLEL_TOLERANCE = 1e-9;

/** The ids of the rows a flexure becomes, in row order. */
export function flexureRowIds(f: Flexure): string[] {
  return f.kind === "wire" ? [f.id] : [`${f.id}.a`, `${f.id}.b`, `${f.id}.s`];
}

/** Length ℓ of a flexure, file length units. */
export function flexureLength(f: Flexure): number {
  return f.kind === "wire" ? len(sub(f.to, f.from)) : len(sub(f.tip, f.root));
}

/** A blade's unit length direction l̂ and unit width direction ŵ (l̂ part removed); null when degenerate. */
export function bladeFrame(f: BladeFlexure): { l: Vec3; w: Vec3 } | null {
  const d = sub(f.tip, f.root);
  const dl = len(d);
  if (!(dl > 0)) return null;
  const l = mul(d, 1 / dl);
  const wRaw = f.widthDirection;
  const wr = len(wRaw);
  if (!(wr > 0)) return null;
  const perp = sub(wRaw, mul(l, dot(wRaw, l)));
  const pl = len(perp);
  if (pl <= WIDTH_PARALLEL_TOLERANCE * wr) return null;
  return { l, w: mul(perp, 1 / pl) };
}

/** Young's modulus (Pa) of a material id from the layout or the built-in table, or undefined. */
function youngsModulusPa(layout: Layout, id: string | undefined): number | undefined {
  if (!id) return undefined;
  const m = layout.materials.find((x) => x.id === id) ?? builtinMaterials.find((x) => x.id === id);
  return m?.youngsModulusGPa === undefined ? undefined : m.youngsModulusGPa * 1e9;
}

/**
 * Row stiffness of a flexure in file force per file length, in row order, or null when the material's
 * E or the section is not given. Wire: EA/ℓ. Blade: E·w·t/(2ℓ) for each axial row, E·t·w³/ℓ³ in plane
 * (12EI/ℓ³ of a guided clamped beam, Roark's beam tables, with I = t w³/12; Euler–Bernoulli, w ≪ ℓ).
 */
export function flexureStiffness(layout: Layout, f: Flexure): number[] | null {
  const E = youngsModulusPa(layout, f.material);
  if (E === undefined) return null;
  const toM = metresPer(layout.units.length);
  const toFile = toM / newtonsPer(layout.units.force);
  const l = flexureLength(f) * toM;
  if (f.kind === "wire") {
    if (f.diameter === undefined) return null;
    const d = f.diameter * toM;
    return [((E * Math.PI * d * d) / 4 / l) * toFile];
  }
  if (f.thickness === undefined) return null;
  const w = f.width * toM;
  const t = f.thickness * toM;
  const axial = ((E * w * t) / (2 * l)) * toFile;
  return [axial, axial, ((E * t * w ** 3) / l ** 3) * toFile];
}

/** The rows of one flexure (bilateral, no feature), with file stiffness where it can be derived. */
export function flexureRows(layout: Layout, f: Flexure): Contact[] {
  const k = flexureStiffness(layout, f);
  const scatter = f.scatter ?? layout.defaultScatter;
  const row = (id: string, point: Vec3, normal: Vec3, i: number): Contact => ({
    id,
    body: f.body,
    on: f.on,
    point,
    normal,
    sense: "bilateral",
    ...(k ? { stiffness: k[i] } : {}),
    ...(scatter !== undefined ? { scatter } : {}),
    flexure: f.id,
  });
  if (f.kind === "wire") return [row(f.id, f.to, mul(sub(f.to, f.from), 1 / flexureLength(f)), 0)];
  const frame = bladeFrame(f);
  if (!frame) return [];
  const half = mul(frame.w, f.width / 2);
  const [a, b, s] = flexureRowIds(f);
  return [row(a, add(f.tip, half), frame.l, 0), row(b, sub(f.tip, half), frame.l, 1), row(s, f.tip, frame.w, 2)];
}

/** The layout the engine analyses: the file's contacts, then every flexure's rows in file order. */
export function expandFlexures(layout: Layout): Layout {
  const flexures = layout.flexures ?? [];
  if (!flexures.length) return layout;
  return { ...layout, contacts: [...layout.contacts, ...flexures.flatMap((f) => flexureRows(layout, f))] };
}
