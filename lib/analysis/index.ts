/** The engine's analysis of a validated layout (pure, no I/O). */
import type { Layout } from "@/lib/layout/model";
import { analyseConstraint, type ConstraintAnalysis } from "./constraint";
import { analyseStatics, type StaticsResult } from "./statics";
import { analyseCouplings, type CouplingResult } from "./coupling";
import { buildRowMap, type RowMap } from "./row-map";
import { analyseThermal, type ThermalResult } from "./thermal";
import { analyseRepeatability, type RepeatabilityResult } from "./repeatability";
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
  /** kept rows and their stiffness in service (§9, shared with §11) */
  rowMap: RowMap;
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
  const rowMap = buildRowMap(constraint, statics, layout.tolerance);
  return {
    layout,
    constraint,
    statics,
    couplings: analyseCouplings(layout),
    flexures: (file.flexures ?? []).map((f) => ({ id: f.id, kind: f.kind, rows: flexureRowIds(f) })),
    rowMap,
    thermal: analyseThermal(layout, constraint, rowMap),
    repeatability: analyseRepeatability(layout, constraint, rowMap),
  };
}
