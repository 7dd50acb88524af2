/** The validated mount layout (file units kept; SI factors alongside) and the located error type. */
import type { ForceUnit, LengthUnit } from "./units";

export type Vec3 = [number, number, number];
export type Encoding = "json" | "xml" | "csv";

export interface Body {
  id: string;
  mass?: number;
  centerOfMass?: Vec3;
  /** material id (built-in or `materials[]`): its expansion coefficient drives the temperature analysis */
  material?: string;
}

/** Every value besides the id is optional: a check that needs a missing one is skipped (missing-data). */
export interface Material {
  id: string;
  youngsModulusGPa?: number;
  poissonRatio?: number;
  allowableContactPressureMPa?: number;
  /** linear expansion coefficient, 1/K */
  expansionPerK?: number;
  /** set on entries taken from the project's materials library (not a file field): where the values come from */
  source?: string;
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
  /** 1σ of where the seat lands along its normal from one seating to the next, file length units */
  scatter?: number;
  /** set on the rows the engine generates from a flexure element (analysis.md §10): the flexure's id */
  flexure?: string;
}

interface FlexureCommon {
  id: string;
  body: string;
  on: string;
  feature?: string;
  material?: string;
  scatter?: number;
}

/** A wire (rod) flexure: one row along itself. */
export interface WireFlexure extends FlexureCommon {
  kind: "wire";
  /** the end on `on` */
  from: Vec3;
  /** the end on `body` */
  to: Vec3;
  diameter?: number;
}

/** A blade (leaf) flexure: three rows in its own plane. */
export interface BladeFlexure extends FlexureCommon {
  kind: "blade";
  /** centre of the edge clamped to `on` */
  root: Vec3;
  /** centre of the edge clamped to `body` */
  tip: Vec3;
  widthDirection: Vec3;
  width: number;
  thickness?: number;
}

export type Flexure = WireFlexure | BladeFlexure;

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
  /** the largest error motion the point may have, file length units */
  allowance?: number;
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
  /** flexure elements; the engine expands them into rows after the contacts (analysis.md §10) */
  flexures?: Flexure[];
  loads: Load[];
  points: FunctionalPoint[];
  loadCases?: LoadCase[];
  /** material id of the base (ground) */
  groundMaterial?: string;
  /** uniform temperature change the mount must ride through, K (> 0) */
  temperatureSwing?: number;
  /** scatter of contacts and flexures that give none, file length units */
  defaultScatter?: number;
}

/** One reason a file was refused, with where in the file it is. */
export interface LayoutError {
  /** JSON pointer, XML element + attribute, or CSV line + column, as a person reads it */
  location: string;
  message: string;
}

export type ParseResult = { ok: true; layout: Layout; warnings: string[] } | { ok: false; errors: LayoutError[] };

export const GROUND = "ground";
export const FORMAT = "mount-layout/1";
/** Upload limit in bytes. */
export const MAX_FILE_BYTES = 5 * 1024 * 1024;
export const MAX_BODIES = 500;
export const MAX_CONTACTS = 5000;
