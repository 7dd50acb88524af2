/** The engine's analysis of a validated layout (pure, no I/O). */
import type { Layout } from "@/lib/layout/model";
import { analyseConstraint, type ConstraintAnalysis } from "./constraint";
import { analyseStatics, type StaticsResult } from "./statics";
import { analyseCouplings, type CouplingResult } from "./coupling";
import { buildRowMap, type RowMap } from "./row-map";
import { analyseThermal, expansionCoefficients, type ThermalResult } from "./thermal";
import { analyseRepeatability, rowScatter, type RepeatabilityResult } from "./repeatability";
import { expandFlexures, flexureRowIds } from "@/lib/layout/flexures";

export type { ConstraintAnalysis, Motion, Screw, SelfStressState } from "./constraint";
export type { StaticsResult, CaseResult, HertzEntry, SeatingResult, FoundationResult, PointMotion, StiffnessSource } from "./statics";
export type { CouplingResult } from "./coupling";
export type { ThermalResult } from "./thermal";
export type { RepeatabilityResult, PointRepeatability } from "./repeatability";
export type { RowMap } from "./row-map";

export interface FlexureEntry {
  id: string;
  kind: "wire" | "blade";
  rows: string[];
}

export interface EngineAnalysis {
  /** the layout as analysed: the file's contacts followed by the rows of its flexures (§10) */
  layout: Layout;
  constraint: ConstraintAnalysis;
  statics: StaticsResult;
  couplings: CouplingResult[];
  flexures: FlexureEntry[];
  /** kept rows and their stiffness in service (§9, shared with §11); null when neither analysis has its inputs */
  rowMap: RowMap | null;
  thermal: ThermalResult | null;
  repeatability: RepeatabilityResult | null;
}

/**
 * Analyses a layout: flexures expanded into rows, rank, screws, self-stress, seating per load case,
 * foundation coupling, Hertz, couplings, temperature and repeatability.
 */
export function analyseLayout(file: Layout): EngineAnalysis {
  const layout = expandFlexures(file);
  const constraint = analyseConstraint(layout);
  const statics = analyseStatics(layout, constraint);
  // the kept-row map costs a decomposition of its own: built only when temperature or repeatability will use it
  const wantsThermal = expansionCoefficients(layout).missing.length === 0;
  const wantsRepeatability = layout.points.length > 0 && rowScatter(layout).some((s) => s > 0);
  const rowMap = wantsThermal || wantsRepeatability ? buildRowMap(constraint, statics, layout.tolerance) : null;
  return {
    layout,
    constraint,
    statics,
    couplings: analyseCouplings(layout),
    flexures: (file.flexures ?? []).map((f) => ({ id: f.id, kind: f.kind, rows: flexureRowIds(f) })),
    rowMap,
    thermal: rowMap && wantsThermal ? analyseThermal(layout, constraint, rowMap) : null,
    repeatability: rowMap && wantsRepeatability ? analyseRepeatability(layout, constraint, rowMap) : null,
  };
}
