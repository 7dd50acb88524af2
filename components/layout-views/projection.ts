/** Orthographic projections for the drawing views and the fit of a set of points into a viewport. */
import type { Vec3 } from "@/lib/layout/model";

export type ViewName = "plan" | "front" | "side" | "axonometric";

export interface ViewSpec {
  name: ViewName;
  title: string;
  /** how the view is made, as the drawing states it */
  projection: string;
  /** screen axes as unit vectors in model space: right and up */
  right: Vec3;
  up: Vec3;
}

const iso = (() => {
  // isometric: view direction (1, −1, 1)/√3 from the viewer towards the origin (common drafting practice)
  const r: Vec3 = [1 / Math.SQRT2, 1 / Math.SQRT2, 0];
  const u: Vec3 = [-1 / Math.sqrt(6), 1 / Math.sqrt(6), 2 / Math.sqrt(6)];
  return { r, u };
})();

export const views: ViewSpec[] = [
  { name: "plan", title: "Plan", projection: "looking down −z; x right, y up", right: [1, 0, 0], up: [0, 1, 0] },
  { name: "front", title: "Front", projection: "looking along +y; x right, z up", right: [1, 0, 0], up: [0, 0, 1] },
  { name: "side", title: "Side", projection: "looking along −x; y right, z up", right: [0, 1, 0], up: [0, 0, 1] },
  { name: "axonometric", title: "Axonometric", projection: "isometric, viewer at (+x, −y, +z)", right: iso.r, up: iso.u },
];

/** Projects a model point to view coordinates (x right, y up), model units. */
export function project(p: Vec3, v: ViewSpec): [number, number] {
  return [p[0] * v.right[0] + p[1] * v.right[1] + p[2] * v.right[2], p[0] * v.up[0] + p[1] * v.up[1] + p[2] * v.up[2]];
}

/** Projects a direction; returns its in-plane part (not normalised). */
export const projectDir = project;

export interface Fit {
  /** model → SVG: sx = (x − x0)·scale + pad, sy = (y1 − y)·scale + pad */
  scale: number;
  x0: number;
  y1: number;
  width: number;
  height: number;
  pad: number;
}

/** Fits projected points into a width × height box with a margin; a degenerate set gets a unit extent. */
export function fitPoints(pts: [number, number][], width: number, height: number, pad = 36): Fit {
  if (!pts.length) return { scale: 1, x0: 0, y1: 0, width, height, pad };
  let [xmin, xmax, ymin, ymax] = [Infinity, -Infinity, Infinity, -Infinity];
  for (const [x, y] of pts) {
    xmin = Math.min(xmin, x);
    xmax = Math.max(xmax, x);
    ymin = Math.min(ymin, y);
    ymax = Math.max(ymax, y);
  }
  const span = Math.max(xmax - xmin, ymax - ymin, 1e-9);
  const w = Math.max(xmax - xmin, span * 0.05);
  const h = Math.max(ymax - ymin, span * 0.05);
  const scale = Math.min((width - 2 * pad) / w, (height - 2 * pad) / h);
  // centre the drawing
  const cx = (xmin + xmax) / 2;
  const cy = (ymin + ymax) / 2;
  return { scale, x0: cx - (width - 2 * pad) / (2 * scale), y1: cy + (height - 2 * pad) / (2 * scale), width, height, pad };
}

/** Model view coordinates → SVG coordinates. */
export function toSvg(f: Fit, [x, y]: [number, number]): [number, number] {
  return [(x - f.x0) * f.scale + f.pad, (f.y1 - y) * f.scale + f.pad];
}

/** A "nice" scale-bar length (1, 2 or 5 × 10ⁿ) close to a fraction of the drawing width, in model units. */
export function scaleBarLength(f: Fit, fraction = 0.25): number {
  const target = ((f.width - 2 * f.pad) * fraction) / f.scale;
  const p = Math.pow(10, Math.floor(Math.log10(target)));
  const m = target / p;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
}
