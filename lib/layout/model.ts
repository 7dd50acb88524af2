/** The validated mount layout (file units kept; SI factors alongside) and the located error type. */
import type { ForceUnit, LengthUnit } from "./units";

export type Vec3 = [number, number, number];
export type Encoding = "json" | "xml" | "csv";

export interface Body {
  id: string;
  mass?: number;
  centerOfMass?: Vec3;
}

export interface Material {
  id: string;
  youngsModulusGPa: number;
  poissonRatio: number;
  allowableContactPressureMPa?: number;
}

export interface HertzData {
  /** principal radii of curvature [body side, on side], file length units; null = flat; negative = concave */
  radii: [[number | null, number | null], [number | null, number | null]];
  angleDeg: number;
  materials: [string, string];
}

export interface Contact {
  id: string;
  body: string;
  on: string;
  feature?: string;
  point: Vec3;
  normal: Vec3;
  sense: "unilateral" | "bilateral";
  stiffness?: number;
  hertz?: HertzData;
}

export interface Load {
  id: string;
  body: string;
  force: Vec3;
  point: Vec3;
  moment?: Vec3;
}

export interface FunctionalPoint {
  id: string;
  body: string;
  point: Vec3;
}

export interface LoadCase {
  id: string;
  gravity: Vec3;
  loads?: string[];
}

export interface Layout {
  format: "mount-layout/1";
  name: string;
  units: { length: LengthUnit; force: ForceUnit };
  gravity: Vec3;
  tolerance: number;
  intendedFreedoms: number;
  bodies: Body[];
  materials: Material[];
  contacts: Contact[];
  loads: Load[];
  points: FunctionalPoint[];
  loadCases?: LoadCase[];
}

/** One reason a file was refused, with where in the file it is. */
export interface LayoutError {
  /** JSON pointer, XML element + attribute, or CSV line + column, as a person reads it */
  location: string;
  message: string;
}

export type ParseResult =
  | { ok: true; layout: Layout; warnings: string[] }
  | { ok: false; errors: LayoutError[] };

export const GROUND = "ground";
export const FORMAT = "mount-layout/1";
/** Upload limit in bytes. */
export const MAX_FILE_BYTES = 5 * 1024 * 1024;
export const MAX_BODIES = 500;
export const MAX_CONTACTS = 5000;
