/** The shapes of the statics results (analysis.md §3–§5) and the solve context every statics module shares. */
import type { Layout, Vec3 } from "@/lib/layout/model";
import type { ConstraintAnalysis } from "../constraint";

export type StiffnessSource = "file" | "hertz" | "equal" | "none";

export interface HertzEntry {
  semiMajor: number;
  semiMinor: number;
  maxPressureMPa: number;
  approachUm: number;
  stiffness: number;
  /** lower allowable maximum pressure of the two materials, MPa (null when neither gives one) */
  allowableMPa: number | null;
  ellipticity: number;
}

export interface SeatingResult {
  forces: Record<string, number> | null;
  liftOff: string[];
  stiffness: StiffnessSource;
  margin: number | null;
}

export interface CaseResult {
  id: string;
  gravity: Vec3;
  /** true when some load has a component along a free motion of the (active) support */
  driven: boolean;
  seating: SeatingResult | null;
  /** seats that carry nothing (the part rocks on them) */
  unloaded: string[];
  hertz: Record<string, HertzEntry>;
  /** per-contact force in contact order, file force units, positive when the seat pushes (null when not solved) */
  force: number[] | null;
  active: boolean[];
  /** scaled twist [L·ω; v + ω × c] under the seated load from contact compliance, file length units (null when no stiffness magnitude) */
  displacement: number[] | null;
  /** tangent stiffness per contact, file force per file length (null when unknown) */
  tangent: number[] | null;
}

export interface FoundationResult {
  sensitivity: Record<string, Record<string, number>>;
  maxPerMicrometre: number;
  /** response to each self-stress state scaled to 1 µm of support warp */
  warp: { pivot: string; forces: Record<string, number> }[];
  stiffness: StiffnessSource;
}

export interface PointMotion {
  /** displacement of the point (µm) per 1 µm rise of each ground support */
  perMicrometre: Record<string, Vec3>;
  /** displacement under the first case's seated load from contact compliance (µm), or null */
  seatedUm: Vec3 | null;
  body: string;
}

export interface StaticsResult {
  hasLoad: boolean;
  stiffnessSource: StiffnessSource;
  /** per row, when every row (contact or flexure) has a file stiffness */
  fileStiffness: number[] | null;
  cases: CaseResult[];
  foundation: FoundationResult | null;
  points: Record<string, PointMotion>;
}

/** What every statics solve needs: the layout, its scaled matrix, sizes, unit factors and the material table. */
export interface Ctx {
  layout: Layout;
  c: ConstraintAnalysis;
  m: number;
  n: number;
  toMetre: number;
  toNewton: number;
  bodyIndex: Map<string, number>;
  materials: Map<string, { E?: number; nu?: number; allowable?: number }>;
}

export interface Solve {
  u: number[];
  lambda: number[];
  driven: boolean;
}

/** A factored stiffness system over the active rows: dense SVD (small layouts) or the structured pseudo-inverse (§12). */
export interface Factor {
  k: number[];
  rows: number[];
  /** rank of K^½ A over the active rows */
  r: number;
  /** (AᵀKA)⁺ rhs */
  applyPinv(rhs: number[]): number[];
  /** rhs without its part along the null space of the active rows */
  project(v: number[]): number[];
  /** largest component of w along an orthonormal basis of that null space */
  nullAlong(w: number[]): number;
}

/** The stiffness factor of the first case's active contacts and each ground contact's 1 µm response, shared by the foundation map and the functional points. */
export interface GroundSolves {
  factor(): Factor;
  /** the twist u_j for a 1 µm rise of ground contact j */
  twist(j: number): number[];
}
